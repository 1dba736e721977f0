package journal

import "sort"

// State is the record folded up: what is done and what is in progress.
type State struct {
	// Done lists the completed steps in the order they were completed; Undo
	// removes the last (or the one it names).
	Done []int
	// InProgress gives the turns counted so far on coil steps not yet done.
	InProgress map[int]int
	// CoilTurns gives the actual turns of every completed coil, by tooth.
	CoilTurns map[int]int
	// Notes are the note events in order.
	Notes []Event
	// Readings holds the latest reading event of each test, by test name.
	Readings map[string]Event
	// LastSeq is the highest sequence number seen (0 for an empty record).
	LastSeq int
}

// Replay folds events, in record order, into a State. It is pure and accepts
// any events: an undo with nothing done is ignored, unknown kinds are skipped
// (a newer program may have written them).
//
// A done step clears its in-progress count; undoing a coil step puts the turns
// it had recorded back in progress, so the winder resumes from the count the
// coil really has.
func Replay(events []Event) State {
	st := State{InProgress: map[int]int{}, CoilTurns: map[int]int{}, Readings: map[string]Event{}}
	var doneEv []Event // parallel to st.Done
	for _, e := range events {
		st.LastSeq = max(st.LastSeq, e.Seq)
		switch e.Kind {
		case Done:
			if i := indexOf(st.Done, e.Step); i >= 0 { // done twice: the later one stands
				st.Done = append(st.Done[:i], st.Done[i+1:]...)
				doneEv = append(doneEv[:i], doneEv[i+1:]...)
			}
			st.Done = append(st.Done, e.Step)
			doneEv = append(doneEv, e)
			delete(st.InProgress, e.Step)
			if e.Tooth > 0 {
				st.CoilTurns[e.Tooth] = e.Turns
			}
		case Undo:
			i := len(st.Done) - 1
			if e.Step > 0 {
				i = indexOf(st.Done, e.Step)
			}
			if i < 0 {
				continue
			}
			u := doneEv[i]
			st.Done = append(st.Done[:i], st.Done[i+1:]...)
			doneEv = append(doneEv[:i], doneEv[i+1:]...)
			if u.Tooth > 0 {
				delete(st.CoilTurns, u.Tooth)
				st.InProgress[u.Step] = u.Turns
			}
		case Turns:
			if indexOf(st.Done, e.Step) < 0 {
				st.InProgress[e.Step] = e.Turns
			}
		case Note:
			st.Notes = append(st.Notes, e)
		case Reading:
			st.Readings[e.Test] = e
		}
	}
	return st
}

func indexOf(xs []int, x int) int {
	for i, v := range xs {
		if v == x {
			return i
		}
	}
	return -1
}

// IsDone reports whether a step is done.
func (s State) IsDone(step int) bool { return indexOf(s.Done, step) >= 0 }

// Current returns the first step of 1..steps that is not done, or steps+1
// when all are done. With steps <= 0 there is no upper bound.
func (s State) Current(steps int) int {
	done := append([]int(nil), s.Done...)
	sort.Ints(done)
	c := 1
	for _, d := range done {
		if d == c {
			c++
		} else if d > c {
			break
		}
	}
	if steps > 0 && c > steps {
		return steps + 1
	}
	return c
}

// NotesFor returns the notes attached to a step.
func (s State) NotesFor(step int) []Event {
	var out []Event
	for _, n := range s.Notes {
		if n.Step == step {
			out = append(out, n)
		}
	}
	return out
}
