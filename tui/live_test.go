package tui

import (
	"fmt"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/job"
	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// TestEveryStepShowsItsLiveParts opens every step of the demo job (outer
// rotor, and the same job with an inner rotor) at 80x24 and at the stated
// minimum, 60x18, and checks that the parts the work depends on are on the
// screen: the key line with ? and q; for a coil its tooth, its sense in
// words, its down and up slots and the count; for a jumper the slots it
// leaves and enters; for a test its fields once opened and an error typed
// into them; the note field once opened.
func TestEveryStepShowsItsLiveParts(t *testing.T) {
	inner := job.Demo()
	inner.Stator.Rotor = job.RotorInner
	for _, jc := range []struct {
		name string
		j    *job.Job
	}{{"outer", job.Demo()}, {"inner", inner}} {
		p, err := plan.Build(jc.j)
		if err != nil {
			t.Fatal(err)
		}
		for _, size := range [][2]int{{80, 24}, {minWidth, minHeight}} {
			for _, s := range p.Steps {
				name := fmt.Sprintf("%s %dx%d step %d (%s)", jc.name, size[0], size[1], s.Index, s.Kind)
				open := func() *Model {
					var history []Entry
					for _, e := range doneUpTo(p, func(x plan.Step) bool { return x.Index == s.Index }) {
						history = append(history, progress.Stamp(p, e))
					}
					m := New(Options{Plan: p, Recorder: &memRecorder{}, Now: fixedNow, History: history})
					drive(t, m, tea.WindowSizeMsg{Width: size[0], Height: size[1]})
					keys(t, m, "b", "b") // a key clears the resume banner (the bell off and on again)
					return m
				}
				m := open()
				if got := m.c.prog.Current(); got != s.Index-1 {
					t.Fatalf("%s: current step %d; want %d", name, got+1, s.Index)
				}
				checkLive(t, name, plain(m), liveWords(s))
				if isPolarity(s) {
					continue // its own keys (n is north there): polarity_test.go
				}
				if s.Kind == plan.StepTest && s.Test != plan.TestBalance {
					keys(t, m, "enter")
					var want []string
					for _, f := range m.guide.labels {
						want = append(want, f.label)
					}
					checkLive(t, name+" fields", plain(m), want)
					keys(t, m, "x")
					for range m.guide.labels {
						keys(t, m, "enter")
					}
					if m.guide.inErr == "" {
						t.Errorf("%s: a reading with x typed in it was taken", name)
					} else {
						checkLive(t, name+" error", plain(m), []string{firstWords(m.guide.inErr)})
					}
				}
				m = open()
				keys(t, m, "n")
				checkLive(t, name+" note", plain(m), []string{"note: "})
			}
		}
	}
}

// liveWords are the words step s must show.
func liveWords(s plan.Step) []string {
	switch {
	case s.Coil != nil:
		c := s.Coil
		return []string{fmt.Sprintf("tooth %d", c.Tooth), senseWord(c), plan.SlotWords(c.DownSlot, c.UpSlot), fmt.Sprintf("of %d turns", c.Turns)}
	case isPolarity(s):
		return []string{"expect", "read:"}
	case s.Jumper != nil:
		return []string{fmt.Sprintf("leaves slot %d", s.Jumper.LeavesSlot), fmt.Sprintf("enters slot %d", s.Jumper.EntersSlot)}
	case s.Kind == plan.StepTest && s.Test == plan.TestBalance:
		return []string{"Press enter to judge the balance"}
	case s.Kind == plan.StepTest:
		return []string{"Press enter to type the readings"}
	}
	return []string{"Press enter when this is done"}
}

// firstWords is the start of a message, short enough to stay on one line.
func firstWords(s string) string {
	if len(s) > 20 {
		return s[:20]
	}
	return s
}

// checkLive checks the key line and the words on a screen.
func checkLive(t *testing.T, name, v string, want []string) {
	t.Helper()
	ls := strings.Split(v, "\n")
	last := ls[len(ls)-1]
	if !strings.Contains(last, "? help") || !strings.Contains(last, "q quit") {
		t.Errorf("%s: the key line %q lacks ? or q", name, last)
	}
	for _, w := range want {
		if !strings.Contains(v, w) {
			t.Errorf("%s: the screen lacks %q:\n%s", name, w, v)
		}
	}
}
