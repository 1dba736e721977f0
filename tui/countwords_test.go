package tui

import (
	"fmt"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// TestCountWordsWhole: at every terminal size, from the smallest that draws
// the coil beside its words to a large one, the words under the count are
// shown whole, never cut at the panel's edge: with the count on the plan
// "as planned: press enter" (a 170x48 terminal once showed "press ente"),
// short "N to go" and over "N over".
func TestCountWordsWhole(t *testing.T) {
	p := demoPlan(t)
	var first plan.Step
	for _, s := range p.Steps {
		if s.Coil != nil {
			first = s
			break
		}
	}
	want := first.Coil.Turns
	for _, size := range [][2]int{{80, 24}, {100, 34}, {120, 40}, {150, 44}, {170, 48}, {200, 60}, {240, 70}} {
		for _, c := range []struct {
			turns int
			words string
		}{
			{want - 5, "5 to go"},
			{want, "as planned: press enter"},
			{want + 2, "2 over"},
		} {
			var history []Entry
			for _, e := range doneUpTo(p, func(x plan.Step) bool { return x.Index == first.Index }) {
				history = append(history, progress.Stamp(p, e))
			}
			m := New(Options{Plan: p, Recorder: &memRecorder{}, Now: fixedNow, History: history})
			drive(t, m, tea.WindowSizeMsg{Width: size[0], Height: size[1]})
			keys(t, m, repeat(" ", c.turns)...)
			v := plain(m)
			name := fmt.Sprintf("%dx%d at %d turns", size[0], size[1], c.turns)
			for _, w := range []string{fmt.Sprintf("of %d turns", want), c.words} {
				if !strings.Contains(v, w) {
					t.Errorf("%s: %q is not on the screen whole:\n%s", name, w, v)
				}
			}
		}
	}
}
