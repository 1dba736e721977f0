package tui

import (
	"io"
	"time"

	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// Minimum terminal size for the guide; below it the guide asks for a larger
// terminal (the work and the record are untouched).
const (
	minWidth  = 60
	minHeight = 18
)

// shared is the context every screen reads: size, styles, keys, plan and
// progress. Screens change progress only through record.
type shared struct {
	width, height int
	sized         bool // a window size has arrived

	st    *styles
	keys  *keyMaps
	plan  *plan.Plan
	teeth []toothInfo
	tests map[string]plan.Test
	coils int // M of "coil N of M"

	prog  *progress.State
	out   *writer
	where string
	said  []string // what the resume and the record file said, for the help screen
	judge Judge
	now   func() time.Time

	rings map[ringKey]*ringGeometry // nil entry: no ring fits that box

	bell    io.Writer // where the bell is rung; nil for none
	bellOff bool      // turned off with the bell key
}

// record applies a change in memory at once and queues it for the record.
// The entry names its step by index; it is stamped with the step's key (and
// a coil's tooth) so a later resume matches it by what the step is.
func (c *shared) record(e Entry) {
	e.Time = c.now()
	e = progress.Stamp(c.plan, e)
	if c.prog.Apply(e) {
		c.out.push(e)
	}
}

// steps returns the plan's steps (nil-safe).
func (c *shared) steps() []plan.Step {
	if c.plan == nil {
		return nil
	}
	return c.plan.Steps
}

// step returns step i (0-based) and whether it exists.
func (c *shared) step(i int) (plan.Step, bool) {
	s := c.steps()
	if i < 0 || i >= len(s) {
		return plan.Step{}, false
	}
	return s[i], true
}

// tooSmall reports whether the terminal is below the minimum or unknown.
func (c *shared) tooSmall() bool {
	return !c.sized || c.width < minWidth || c.height < minHeight
}

// ring returns the cached ring geometry for a box, or nil when none fits.
func (c *shared) ring(w, h int) *ringGeometry {
	q := len(c.teeth)
	k := ringKey{q, w, h}
	if g, ok := c.rings[k]; ok {
		return g
	}
	var gp *ringGeometry
	if g, ok := fitRing(q, w, h); ok {
		gp = &g
	}
	if len(c.rings) > 64 {
		c.rings = map[ringKey]*ringGeometry{}
	}
	c.rings[k] = gp
	return gp
}

// currentTooth is the tooth the current step is about, 0 for none.
func (c *shared) currentTooth() int { return c.toothOf(c.prog.Current()) }

// toothOf is the tooth step i (0-based) is about, 0 for none.
func (c *shared) toothOf(i int) int {
	s, ok := c.step(i)
	if !ok {
		return 0
	}
	switch {
	case s.Coil != nil:
		return s.Coil.Tooth
	case s.Jumper != nil:
		return s.Jumper.ToTooth
	case s.Kind == plan.StepSeparator && s.Slot > 0:
		return s.Slot
	case isPolarity(s):
		return c.polarityTooth(i)
	case s.Kind == plan.StepSetup:
		return 1
	}
	return 0
}

// fromNext are the teeth the wire of step i (0-based) comes from and goes to
// next, 0 for a lead or none: for a coil its neighbours on its path, for a
// jumper the coil it leaves.
func (c *shared) fromNext(i int) (from, next int) {
	s, ok := c.step(i)
	if !ok || c.plan == nil || c.plan.Layout == nil {
		return 0, 0
	}
	switch {
	case s.Coil != nil:
		ch, ok := c.plan.Layout.ChainOf(c.phaseIndex(s.Coil.Phase), s.Coil.Path)
		if !ok {
			return 0, 0
		}
		if p := s.Coil.Position; p >= 2 && p-2 < len(ch.Teeth) {
			from = ch.Teeth[p-2]
		}
		if p := s.Coil.Position; p >= 1 && p < len(ch.Teeth) {
			next = ch.Teeth[p]
		}
	case s.Jumper != nil:
		from = s.Jumper.FromTooth
	}
	return from, next
}
