package tui

import "fmt"

// resumeNotice says where the winder left off when the guide opens on a
// record with work in it, or "" when there is none.
func resumeNotice(c *shared) string {
	if c.prog.DoneCount() == 0 {
		return ""
	}
	i := c.prog.Current()
	s, ok := c.step(i)
	if !ok {
		return fmt.Sprintf("Resumed: all %d steps are recorded.", len(c.steps()))
	}
	what := s.Title
	if s.Coil != nil {
		what = fmt.Sprintf("coil %d of %d on tooth %d", s.Coil.Order, s.Coil.Of, s.Coil.Tooth)
		if n := c.prog.Steps[i].Turns; n > 0 {
			what += fmt.Sprintf(", %d of %d turns counted", n, s.Coil.Turns)
		}
	}
	return fmt.Sprintf("Resumed where you left off: step %d of %d, %s (%d steps done).", s.Index, len(c.steps()), what, c.prog.DoneCount())
}
