package tui

import (
	"errors"
	"fmt"

	"coilwright/winding/journal"
	"coilwright/winding/plan"
)

// JournalRecorder writes the guide's entries to a journal store as events.
// The store keeps an event it could not write and writes it first the next
// time, so the guide never hands an entry over twice.
type JournalRecorder struct {
	Store *journal.Store
	Plan  *plan.Plan
}

// Append writes one entry as a journal event.
func (r JournalRecorder) Append(e Entry) error {
	return wrapHeld(r.Store.Append(EventOf(r.Plan, e)))
}

// Retry writes the events the store keeps.
func (r JournalRecorder) Retry() error { return wrapHeld(r.Store.Retry()) }

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

// EventOf turns a guide entry into a journal event: coil steps carry their
// tooth, readings their named values and the test's name.
func EventOf(p *plan.Plan, e Entry) journal.Event {
	ev := journal.Event{Time: e.At, Step: e.Step, Turns: e.Turns, Note: e.Note}
	var s plan.Step
	if p != nil && e.Step >= 1 && e.Step <= len(p.Steps) {
		s = p.Steps[e.Step-1]
	}
	if s.Coil != nil {
		ev.Tooth = s.Coil.Tooth
	}
	switch e.Kind {
	case EntryTurns:
		ev.Kind = journal.Turns
	case EntryDone:
		ev.Kind = journal.Done
	case EntryUndo:
		ev.Kind = journal.Undo
		ev.Turns = 0
	case EntryNote:
		ev.Kind = journal.Note
	case EntryReading:
		ev.Kind = journal.Reading
		ev.Test = s.Test
		ev.Verdict = e.Verdict
		ev.Readings = map[string]float64{}
		fs := fieldsFor(p, testNamed(p, s.Test))
		for i, v := range e.Values {
			name := fmt.Sprintf("value%d", i+1)
			if i < len(fs) {
				name = fs[i].key
			}
			ev.Readings[name] = v
		}
	}
	return ev
}

// EntriesOf turns the events of a record back into guide entries, in record
// order. Events of no step (readings recorded by the check command) are left
// to their own screens and skipped here.
func EntriesOf(p *plan.Plan, events []journal.Event) []Entry {
	out := make([]Entry, 0, len(events))
	for _, ev := range events {
		if ev.Step <= 0 {
			continue
		}
		e := Entry{Step: ev.Step, Turns: ev.Turns, Note: ev.Note, At: ev.Time, Verdict: ev.Verdict}
		if !fitsPlan(p, ev) {
			// The job changed since this was recorded (another tooth or
			// test now stands at that step): keep it out, and let the
			// guide count it among the entries that do not match.
			e.Step = 0
		}
		switch ev.Kind {
		case journal.Turns:
			e.Kind = EntryTurns
		case journal.Done:
			e.Kind = EntryDone
		case journal.Undo:
			e.Kind = EntryUndo
		case journal.Note:
			e.Kind = EntryNote
		case journal.Reading:
			e.Kind = EntryReading
			var s plan.Step
			if p != nil && ev.Step <= len(p.Steps) {
				s = p.Steps[ev.Step-1]
			}
			for i, f := range fieldsFor(p, testNamed(p, s.Test)) {
				v, ok := ev.Readings[f.key]
				if !ok {
					v, ok = ev.Readings[fmt.Sprintf("value%d", i+1)]
				}
				if ok {
					e.Values = append(e.Values, v)
				}
			}
		default:
			continue // a kind from a newer program
		}
		out = append(out, e)
	}
	return out
}

// fitsPlan reports whether an event still belongs to the step it names: a
// coil event to a coil step on the same tooth, a reading to a test step of
// the same test. Events that carry neither are taken on trust.
func fitsPlan(p *plan.Plan, ev journal.Event) bool {
	if p == nil || ev.Step < 1 || ev.Step > len(p.Steps) {
		return true // out of range: the guide's own check reports it
	}
	s := p.Steps[ev.Step-1]
	if ev.Tooth != 0 && (s.Coil == nil || s.Coil.Tooth != ev.Tooth) {
		return false
	}
	if ev.Kind == journal.Reading && ev.Test != "" && s.Test != ev.Test {
		return false
	}
	return true
}

// testNamed finds a test of the plan by name.
func testNamed(p *plan.Plan, name string) plan.Test {
	if p != nil {
		for _, t := range p.Tests {
			if t.Name == name {
				return t
			}
		}
	}
	return plan.Test{Name: name}
}

// TornNotice says in words that the record's last line was torn and left
// out, or "" when it was whole.
func TornNotice(t *journal.TornTail) string {
	if t == nil {
		return ""
	}
	return fmt.Sprintf("The last line of the progress record was cut short (line %d, %d bytes), most likely by a crash; it was left out and everything before it restored.", t.Line, t.Bytes)
}
