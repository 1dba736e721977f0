package tui

import (
	"time"

	tea "github.com/charmbracelet/bubbletea"
)

// EntryKind says what a progress entry records.
type EntryKind string

const (
	EntryTurns   EntryKind = "turns"   // the turn count of a coil in progress
	EntryDone    EntryKind = "done"    // a step completed (coil steps carry the turns wound)
	EntryUndo    EntryKind = "undo"    // the last completed step taken back
	EntryNote    EntryKind = "note"    // a note attached to a step
	EntryReading EntryKind = "reading" // readings of a test step and their verdict
)

// Entry is one change of progress, in the order it happened. Step is the
// 1-based Step.Index in the plan.
type Entry struct {
	Kind    EntryKind
	Step    int
	Turns   int       // EntryTurns, EntryDone of a coil
	Note    string    // EntryNote
	Values  []float64 // EntryReading, in the order of the test's fields
	Verdict string    // EntryReading: "pass", "warn" or "fail"
	At      time.Time // set by the guide when the entry is made
}

// Recorder is the progress record the guide writes to. Append must make the
// entry durable before it returns nil; on an error the entry counts as not
// written and the guide offers it again later. The guide calls Append from
// tea.Cmds, one at a time, never from Update or View.
type Recorder interface {
	Append(Entry) error
}

// savedMsg reports a written batch: n entries made durable, then err (nil
// when the whole batch was written).
type savedMsg struct {
	n   int
	err error
}

// retryMsg asks the writer to try again after a failure.
type retryMsg struct{}

// retryAfter is the wait before a failed write is tried again. It is the only
// timer in the guide, and it runs only while a write is failing.
const retryAfter = 2 * time.Second

// writer queues entries and writes them in order, one batch at a time.
type writer struct {
	rec      Recorder
	queue    []Entry
	inflight bool
	err      error // last write error, nil once a write succeeds
	waiting  bool  // a retry timer is running
	failures int
	written  int
}

// push queues an entry.
func (w *writer) push(e Entry) { w.queue = append(w.queue, e) }

// pending reports how many entries are not yet durable.
func (w *writer) pending() int { return len(w.queue) }

// kick starts a write of the queued entries unless one is running, a retry
// is waiting, or there is nothing to write.
func (w *writer) kick() tea.Cmd {
	if w.rec == nil || w.inflight || w.waiting || len(w.queue) == 0 {
		return nil
	}
	w.inflight = true
	batch := append([]Entry(nil), w.queue...)
	rec := w.rec
	return func() tea.Msg {
		for i, e := range batch {
			if err := rec.Append(e); err != nil {
				return savedMsg{n: i, err: err}
			}
		}
		return savedMsg{n: len(batch)}
	}
}

// saved takes the result of a write and returns the next command: another
// batch, a retry timer after a failure, or nil.
func (w *writer) saved(msg savedMsg) tea.Cmd {
	w.inflight = false
	n := min(max(0, msg.n), len(w.queue))
	w.queue = w.queue[n:]
	w.written += n
	if msg.err != nil {
		w.err = msg.err
		w.failures++
		w.waiting = true
		return tea.Tick(retryAfter, func(time.Time) tea.Msg { return retryMsg{} })
	}
	w.err = nil
	w.failures = 0
	return w.kick()
}

// retry writes again when the timer fires; the error stays shown until a
// write succeeds.
func (w *writer) retry() tea.Cmd {
	w.waiting = false
	return w.kick()
}
