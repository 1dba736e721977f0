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
// leaves and enters; for a test the expected values, then its fields once
// opened, each with what the meter should show on its line, and an error
// typed into them; for the balance its verdict from the resistance readings
// recorded; for a polarity step the tooth in hand and the pole it must show,
// an unsure tooth marked, and with every tooth read (one the other pole) the
// verdict naming it; the note field once opened.
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
					h := doneUpTo(p, func(x plan.Step) bool { return x.Index == s.Index })
					if s.Test == plan.TestBalance {
						h = resistanceReadings(t, p) // the readings the balance is judged from
					}
					for _, e := range h {
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
				checkLive(t, name, plain(m), liveWords(p, s))
				if isPolarity(s) {
					// Every tooth read right but the last: the verdict, the
					// tooth named and the key that records it.
					teeth := polarityTeeth(p, s)
					for i, tp := range teeth {
						k := strings.ToLower(string(tp.Pole))
						if i == len(teeth)-1 {
							k = map[string]string{"n": "s", "s": "n"}[k]
						}
						keys(t, m, k)
					}
					last := teeth[len(teeth)-1]
					checkLive(t, name+" verdict", plain(m), []string{"verdict: FAIL", fmt.Sprintf("tooth %d shows", last.Tooth), "enter records the step"})
					m = open()
					keys(t, m, "x") // unsure: the next tooth comes up
					if len(teeth) > 1 {
						checkLive(t, name+" unsure", plain(m), []string{fmt.Sprintf("tooth %d", teeth[1].Tooth), "expect " + poleWord(teeth[1].Pole), fmt.Sprintf("%d%s?", teeth[0].Tooth, teeth[0].Pole)})
					}
					continue // n is north there, not a note: polarity_test.go
				}
				if s.Test == plan.TestBalance {
					keys(t, m, "enter")
					checkLive(t, name+" verdict", plain(m), []string{"verdict: PASS", "285.5 mΩ", "286.1 mΩ", "285.8 mΩ", "enter/y records it"})
				}
				if s.Kind == plan.StepTest && s.Test != plan.TestBalance {
					keys(t, m, "enter")
					v := plain(m)
					var want []string
					for _, f := range m.guide.labels {
						want = append(want, f.label)
					}
					checkLive(t, name+" fields", v, want)
					// What the meter should show stands beside its field,
					// on the field's own line.
					tst := m.c.tests[s.Test]
					for i, r := range tst.Readings {
						if e := expectText(tst, i, true); e != "" && !lineHas(v, r.Label, e) {
							t.Errorf("%s: no line with the field %q and %q beside it:\n%s", name, r.Label, e, v)
						}
					}
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

// lineHas reports whether one line of v holds every word, in order.
func lineHas(v string, words ...string) bool {
	for _, l := range strings.Split(v, "\n") {
		rest, ok := l, true
		for _, w := range words {
			i := strings.Index(rest, w)
			if i < 0 {
				ok = false
				break
			}
			rest = rest[i+len(w):]
		}
		if ok {
			return true
		}
	}
	return false
}

// liveWords are the words step s must show.
func liveWords(p *plan.Plan, s plan.Step) []string {
	switch {
	case s.Coil != nil:
		c := s.Coil
		return []string{fmt.Sprintf("tooth %d", c.Tooth), senseWord(c), plan.SlotWords(c.DownSlot, c.UpSlot), fmt.Sprintf("of %d turns", c.Turns)}
	case isPolarity(s):
		tp := polarityTeeth(p, s)[0]
		return []string{fmt.Sprintf("tooth %d", tp.Tooth), "expect " + poleWord(tp.Pole), "read:"}
	case s.Jumper != nil:
		return []string{fmt.Sprintf("leaves slot %d", s.Jumper.LeavesSlot), fmt.Sprintf("enters slot %d", s.Jumper.EntersSlot)}
	case s.Kind == plan.StepTest && s.Test == plan.TestBalance:
		return []string{"Press enter to judge the balance"}
	case s.Kind == plan.StepTest:
		// The expected values before the fields open, too.
		out := []string{"Press enter to type the readings"}
		for _, t := range p.Tests {
			for i := range t.Readings {
				if e := expectText(t, i, true); t.Name == s.Test && e != "" {
					out = append(out, e)
				}
			}
		}
		return out
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
