package tui

import (
	"io"

	tea "github.com/charmbracelet/bubbletea"
)

// The audible cue: the terminal bell rings once when the count of the coil in
// hand reaches the plan, so the winder hears it without looking up. It is
// written by a tea.Cmd to the writer given in Options.Bell (nil: no bell);
// the bell key turns it off and on.

// bellRing is the BEL control character (ASCII 7).
const bellRing = "\a"

// countOf is the count of the coil step in hand and its plan, or ok false
// when the step in hand is not a coil.
func (c *shared) countOf() (n, want int, step int, ok bool) {
	i := c.prog.Current()
	s, found := c.step(i)
	if !found || s.Coil == nil {
		return 0, 0, i, false
	}
	return c.prog.Steps[i].Turns, s.Coil.Turns, i, true
}

// bellAfter rings when a key has brought the count in hand onto the plan.
func (c *shared) bellAfter(beforeN, beforeStep int, beforeOK bool) tea.Cmd {
	if c.bell == nil || c.bellOff {
		return nil
	}
	n, want, step, ok := c.countOf()
	if !ok || want <= 0 || n != want || (beforeOK && beforeStep == step && beforeN == want) {
		return nil
	}
	w := c.bell
	return func() tea.Msg {
		_, _ = io.WriteString(w, bellRing)
		return nil
	}
}

// countNow is the count in hand before a key, for bellAfter.
func (c *shared) countNow() (n, step int, ok bool) {
	n, _, step, ok = c.countOf()
	return n, step, ok
}
