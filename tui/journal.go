package tui

import (
	"errors"
	"fmt"

	"coilwright/winding/journal"
)

// JournalRecorder writes the guide's entries to a journal store. The store
// keeps events it could not write and writes them first the next time, so
// the guide never hands an entry over twice. Head, when set, is written once
// before the first entries (the plan's fingerprint, when the record lacks it).
type JournalRecorder struct {
	Store *journal.Store
	Head  []journal.Event
}

// Append writes entries as journal events, synced once.
func (r *JournalRecorder) Append(es ...Entry) error {
	if len(r.Head) > 0 {
		es = append(append([]Entry(nil), r.Head...), es...)
		r.Head = nil
	}
	return wrapHeld(r.Store.Append(es...))
}

// Retry writes the events the store keeps.
func (r *JournalRecorder) Retry() error { return wrapHeld(r.Store.Retry()) }

// Notices says what the store had to do about the record file.
func (r *JournalRecorder) Notices() []string { return r.Store.Notices() }

// heldError carries the store's count of events waiting.
type heldError struct{ *journal.WriteError }

func (e heldError) HeldEntries() int { return e.Pending }
func (e heldError) Unwrap() error    { return e.WriteError }

func wrapHeld(err error) error {
	var we *journal.WriteError
	if errors.As(err, &we) {
		return heldError{we}
	}
	return err
}

// TornNotice says in words that the record's last line was torn and left
// out, or "" when it was whole.
func TornNotice(t *journal.TornTail) string {
	if t == nil {
		return ""
	}
	return fmt.Sprintf("The last line of the progress record was cut short (line %d, %d bytes), most likely by a crash; it was left out and everything before it restored. Its bytes are copied to a side file next to the record before the next entry is written.", t.Line, t.Bytes)
}
