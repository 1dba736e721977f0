package tui

import "coilwright/winding/plan"

// reading is what was recorded for a test step.
type reading struct {
	values  []float64
	verdict string
}

// progress is where the work stands: which steps are done, the turns counted
// on each coil, notes and readings. Steps are indexed 0..n-1 here (Step.Index
// minus one). It is changed only by apply, so replaying the record and
// working live give the same state.
type progress struct {
	done     []bool
	turns    []int // counted (in progress) or recorded (done) turns per coil step
	notes    []string
	readings []*reading
	order    []int // completed steps, most recent last, for undo
	rev      int   // counts the changes applied, so a look at another step ends on any change
}

func newProgress(n int) *progress {
	return &progress{
		done:     make([]bool, n),
		turns:    make([]int, n),
		notes:    make([]string, n),
		readings: make([]*reading, n),
	}
}

// apply changes the progress by one entry. Entries naming a step outside the
// plan are ignored and reported false.
func (p *progress) apply(e Entry) bool {
	i := e.Step - 1
	if i < 0 || i >= len(p.done) {
		return false
	}
	switch e.Kind {
	case EntryTurns:
		p.turns[i] = max(0, e.Turns)
	case EntryDone:
		if p.done[i] {
			return false
		}
		p.done[i] = true
		if e.Turns > 0 {
			p.turns[i] = e.Turns
		}
		p.order = append(p.order, i)
	case EntryUndo:
		if !p.done[i] {
			return false
		}
		p.done[i] = false
		for k := len(p.order) - 1; k >= 0; k-- {
			if p.order[k] == i {
				p.order = append(p.order[:k], p.order[k+1:]...)
				break
			}
		}
	case EntryNote:
		p.notes[i] = e.Note
	case EntryReading:
		p.readings[i] = &reading{values: append([]float64(nil), e.Values...), verdict: e.Verdict}
	default:
		return false
	}
	p.rev++
	return true
}

// current is the first step not done, or len(steps) when all are done.
func (p *progress) current() int {
	for i, d := range p.done {
		if !d {
			return i
		}
	}
	return len(p.done)
}

// lastDone is the most recently completed step, or -1.
func (p *progress) lastDone() int {
	if len(p.order) == 0 {
		return -1
	}
	return p.order[len(p.order)-1]
}

// count is how many steps are done.
func (p *progress) count() int { return len(p.order) }

// coilsDone counts the finished coil steps.
func (p *progress) coilsDone(steps []plan.Step) int {
	n := 0
	for i, s := range steps {
		if s.Kind == plan.StepCoil && i < len(p.done) && p.done[i] {
			n++
		}
	}
	return n
}

// toothState is what the drawing shows of each tooth: whether its coil is
// wound. Index 0 is tooth 1.
func (p *progress) toothWound(steps []plan.Step, slots int) []bool {
	out := make([]bool, slots)
	for i, s := range steps {
		if s.Kind == plan.StepCoil && s.Coil != nil && i < len(p.done) && p.done[i] {
			if t := s.Coil.Tooth; t >= 1 && t <= slots {
				out[t-1] = true
			}
		}
	}
	return out
}
