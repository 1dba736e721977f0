package progress

import (
	"fmt"
	"strconv"
	"strings"

	"coilwright/winding/journal"
	"coilwright/winding/plan"
)

// Sense is the sign of a coil's sense, glued to its phase letter: "+" for a
// coil wound clockwise, "-" counter-clockwise.
func Sense(c *plan.CoilStep) string {
	if c != nil && c.Direction == "ccw" {
		return "-"
	}
	return "+"
}

// baseKey names a step by what it is, before repeats are told apart.
func baseKey(s plan.Step) string {
	switch {
	case s.Coil != nil:
		return fmt.Sprintf("coil %d %s%s", s.Coil.Tooth, Sense(s.Coil), s.Coil.Phase)
	case s.Jumper != nil:
		return fmt.Sprintf("jumper %d>%d", s.Jumper.FromTooth, s.Jumper.ToTooth)
	case s.Kind == plan.StepSeparator && s.Slot > 0:
		return "separator " + strconv.Itoa(s.Slot)
	case s.Kind == plan.StepTest && s.Test != "" && len(s.Phases) > 0:
		return "test " + s.Test + " " + strings.Join(s.Phases, ",")
	case s.Kind == plan.StepTest && s.Test != "":
		return "test " + s.Test
	}
	return string(s.Kind) + ": " + s.Title
}

// Keys returns the key of every step of the plan, in step order. Keys are
// unique: a second step of the same kind and identity gets " #2", and so on.
func Keys(p *plan.Plan) []string {
	if p == nil {
		return nil
	}
	out := make([]string, len(p.Steps))
	seen := map[string]int{}
	for i, s := range p.Steps {
		k := baseKey(s)
		seen[k]++
		if n := seen[k]; n > 1 {
			k += " #" + strconv.Itoa(n)
		}
		out[i] = k
	}
	return out
}

// Stamp fills in what an event of plan step e.Step (1-based) says about the
// step itself: its key and, for a coil, its tooth. Events of no step, or of a
// step the plan does not have, are returned as they are.
func Stamp(p *plan.Plan, e journal.Event) journal.Event {
	if p == nil || e.Step < 1 || e.Step > len(p.Steps) {
		return e
	}
	s := p.Steps[e.Step-1]
	e.Key = Keys(p)[e.Step-1]
	if s.Coil != nil {
		e.Tooth = s.Coil.Tooth
	}
	if s.Kind == plan.StepTest && e.Kind == journal.Reading {
		e.Test = s.Test
	}
	return e
}
