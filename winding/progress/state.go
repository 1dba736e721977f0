package progress

import (
	"math"
	"time"

	"coilwright/winding/journal"
	"coilwright/winding/plan"
)

// Reading is what was recorded for a test: the values by name, as measured,
// and the verdict.
type Reading struct {
	Values  map[string]float64
	Verdict string // "pass", "warn" or "fail"
	Note    string
	At      time.Time
}

// Step is where one plan step stands.
type Step struct {
	Done bool
	At   time.Time // when it was done; zero when not done or unknown
	// Turns are, for a coil step, the turns counted so far (not done) or
	// wound (done).
	Turns   int
	Note    string // the latest note; "" for none
	NoteAt  time.Time
	Reading *Reading // the latest readings of a test step
	// Skipped: an optional test done by leaving it out (journal.Event.Skipped).
	Skipped bool
}

// Note is a note of the record that belongs to no step.
type Note struct {
	Text string
	At   time.Time
}

// Dropped is an entry of the record that does not fit the plan, and why.
type Dropped struct {
	Line   int // in the record; 0 for an entry not read from a record
	Kind   journal.Kind
	Key    string // the step it names, when it names one
	Tooth  int    // the coil's tooth, for coil entries
	Reason string
}

// State is the progress of one stator against its plan. It is changed only
// by Apply (and Fold, which applies a record's events in order), so a resume
// and the live work give the same state.
type State struct {
	Steps []Step // by 0-based step index (Plan.Steps[i].Index - 1)
	// Tests holds the latest readings of each test by its name, from the
	// test steps and from checks recorded apart from a step.
	Tests   map[string]Reading
	General []Note    // notes of no step, in order
	Dropped []Dropped // entries left out, in record order
	// Moved counts entries that fit a step now at another number (steps
	// were added or removed since they were written).
	Moved int
	// Changes says what changed in the plan since the record's last plan
	// fingerprint, in words; nil when nothing changed or the record has none.
	Changes []string
	// Recorded is the time of the latest entry; LastSeq its sequence number.
	Recorded time.Time
	LastSeq  int
	// Rev counts the changes applied, so a view can tell that progress moved.
	Rev int

	plan  *plan.Plan
	keys  []string
	index map[string]int
	order []int // done steps, most recent last
	// fingerprint is the one in force while folding (the last plan event).
	fingerprint map[string]string
	same        bool                 // the fingerprint in force is the plan's own
	kept        map[journal.Kind]int // entries folded in, by kind
}

// New returns the state of a plan with nothing done.
func New(p *plan.Plan) *State {
	s := &State{Tests: map[string]Reading{}, plan: p, keys: Keys(p), index: map[string]int{}, kept: map[journal.Kind]int{}}
	s.Steps = make([]Step, len(s.keys))
	for i, k := range s.keys {
		s.index[k] = i
	}
	return s
}

// Plan returns the plan the state is matched against.
func (s *State) Plan() *plan.Plan { return s.plan }

// Key returns the key of step i (0-based), "" when there is none.
func (s *State) Key(i int) string {
	if i < 0 || i >= len(s.keys) {
		return ""
	}
	return s.keys[i]
}

// Current is the first step not done (0-based), or len(Steps) when all are.
func (s *State) Current() int {
	for i, st := range s.Steps {
		if !st.Done {
			return i
		}
	}
	return len(s.Steps)
}

// LastDone is the most recently completed step (0-based), or -1.
func (s *State) LastDone() int {
	if len(s.order) == 0 {
		return -1
	}
	return s.order[len(s.order)-1]
}

// DoneCount is how many steps are done.
func (s *State) DoneCount() int { return len(s.order) }

// CoilsDone counts the finished coil steps.
func (s *State) CoilsDone() int {
	n := 0
	for i, st := range s.Steps {
		if st.Done && s.coil(i) != nil {
			n++
		}
	}
	return n
}

// ToothWound says, for teeth 1..slots (index 0 is tooth 1), whether its coil
// is wound.
func (s *State) ToothWound(slots int) []bool {
	out := make([]bool, max(0, slots))
	for i, st := range s.Steps {
		if c := s.coil(i); c != nil && st.Done && c.Tooth >= 1 && c.Tooth <= slots {
			out[c.Tooth-1] = true
		}
	}
	return out
}

func (s *State) step(i int) (plan.Step, bool) {
	if s.plan == nil || i < 0 || i >= len(s.plan.Steps) || i >= len(s.Steps) {
		return plan.Step{}, false
	}
	return s.plan.Steps[i], true
}

func (s *State) coil(i int) *plan.CoilStep {
	st, _ := s.step(i)
	return st.Coil
}

// MaxTurns is the most turns a coil step (0-based) can hold: its planned
// turns scaled to a slot filled with copper to the last corner (the plan's
// fill is copper area over usable slot area, so planned turns / fill is that
// bound), and never more than the record allows.
func (s *State) MaxTurns(i int) int {
	c := s.coil(i)
	if c == nil {
		return 0
	}
	fill := 0.0
	if s.plan != nil {
		fill = s.plan.SlotFill
	}
	if fill <= 0 || fill > 1 || math.IsNaN(fill) || c.Turns <= 0 {
		return journal.MaxTurns
	}
	return min(journal.MaxTurns, max(c.Turns, int(math.Ceil(float64(c.Turns)/fill))))
}

// Apply changes the state by one live event (Stamp it first) and reports
// whether anything changed. An event that does not fit the plan changes
// nothing.
func (s *State) Apply(e journal.Event) bool {
	if e.Kind == journal.Plan {
		return false
	}
	i, reason := s.locate(e)
	if reason != "" {
		return false
	}
	ok, _ := s.apply(i, e)
	return ok
}

// apply changes step i (-1 for none) by the event. It reports whether
// anything changed, or why the event does not fit.
func (s *State) apply(i int, e journal.Event) (bool, string) {
	st, hasStep := s.step(i)
	switch e.Kind {
	case journal.Turns:
		switch {
		case !hasStep:
			return false, "a turn count of no step"
		case st.Coil == nil:
			return false, "a turn count on a step that is not a coil"
		case e.Turns > s.MaxTurns(i):
			return false, turnsReason(e.Turns, s.MaxTurns(i))
		case s.Steps[i].Done:
			return false, "" // a count after the coil was done: the done count stands
		}
		s.Steps[i].Turns = e.Turns
	case journal.Done:
		if !hasStep {
			return false, "a step done that names no step"
		}
		if st.Coil != nil && e.Turns > s.MaxTurns(i) {
			return false, turnsReason(e.Turns, s.MaxTurns(i))
		}
		if s.Steps[i].Done { // done twice: the later one stands
			s.unorder(i)
		}
		s.Steps[i].Done, s.Steps[i].At = true, e.Time
		s.Steps[i].Skipped = e.Skipped
		if st.Coil != nil && e.Turns > 0 {
			s.Steps[i].Turns = e.Turns
		}
		s.order = append(s.order, i)
	case journal.Undo:
		if !hasStep {
			i = s.LastDone()
		}
		if i < 0 || i >= len(s.Steps) || !s.Steps[i].Done {
			return false, ""
		}
		s.Steps[i].Done, s.Steps[i].At, s.Steps[i].Skipped = false, time.Time{}, false
		s.unorder(i) // an undone coil keeps its count, to go on from
	case journal.Note:
		if !hasStep {
			if e.Note == "" {
				return false, ""
			}
			s.General = append(s.General, Note{Text: e.Note, At: e.Time})
			break
		}
		s.Steps[i].Note, s.Steps[i].NoteAt = e.Note, e.Time
	case journal.Reading:
		r := Reading{Values: e.Readings, Verdict: e.Verdict, Note: e.Note, At: e.Time}
		if !hasStep {
			if e.Test == "" {
				return false, "readings of no test"
			}
			s.Tests[e.Test] = r
			break
		}
		if st.Kind != plan.StepTest {
			return false, "readings on a step that is not a test"
		}
		s.Steps[i].Reading = &r
		s.Tests[st.Test] = r
	default:
		return false, "" // a kind from a newer coilwright
	}
	s.Rev++
	return true, ""
}

func turnsReason(n, most int) string {
	return "more turns (" + itoa(n) + ") than the slot can hold (at most " + itoa(most) + ")"
}

func (s *State) unorder(i int) {
	for k := len(s.order) - 1; k >= 0; k-- {
		if s.order[k] == i {
			s.order = append(s.order[:k], s.order[k+1:]...)
			return
		}
	}
}
