package tui

import (
	"fmt"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/job"
	"coilwright/winding/plan"
)

// demoWith is the plan of the demo job with the rotor given ("" as the job has it).
func demoWith(t *testing.T, rotor string) *plan.Plan {
	t.Helper()
	j := job.Demo()
	if rotor != "" {
		j.Stator.Rotor = rotor
	}
	p, err := plan.Build(j)
	if err != nil {
		t.Fatal(err)
	}
	return p
}

// firstStep is the index (1-based) of the first step that matches.
func firstStep(t *testing.T, p *plan.Plan, match func(plan.Step) bool) plan.Step {
	t.Helper()
	for _, s := range p.Steps {
		if match(s) {
			return s
		}
	}
	t.Fatal("no step matches")
	return plan.Step{}
}

// resistanceReadings is the resistance step recorded with the readings a
// winder types off the meter, so the balance after it has readings to judge.
func resistanceReadings(t *testing.T, p *plan.Plan) []Entry {
	t.Helper()
	rs := firstStep(t, p, func(s plan.Step) bool { return s.Test == plan.TestResistance })
	h := doneUpTo(p, func(s plan.Step) bool { return s.Index == rs.Index })
	h = append(h,
		Entry{Kind: EntryReading, Step: rs.Index, Test: rs.Test, Readings: map[string]float64{"uv": 0.2855, "vw": 0.2861, "wu": 0.2858, plan.KeyTemp: 15}, Verdict: "pass"},
		Entry{Kind: EntryDone, Step: rs.Index})
	return h
}

// TestDemoGoldenScreens pins the demo job's screens a winder meets first
// and the tests the "done when" names, at 80x24 and at the stated
// minimum 60x18, in the pinned colour profile (TestMain): the set-up step,
// coil 1 (outer rotor, and the same job with an inner rotor), the first
// jumper, the resistance test before and while its readings are typed (the
// expected line-to-line value beside each of U–V, V–W, W–U), the balance
// before and after enter, and a polarity step with a tooth showing the
// other pole.
func TestDemoGoldenScreens(t *testing.T) {
	outer, inner := demoWith(t, ""), demoWith(t, job.RotorInner)
	before := func(match func(plan.Step) bool) func(p *plan.Plan) []Entry {
		return func(p *plan.Plan) []Entry { return doneUpTo(p, match) }
	}
	isCoil := func(s plan.Step) bool { return s.Kind == plan.StepCoil }
	isJumper := func(s plan.Step) bool { return s.Kind == plan.StepJumper }
	isRes := func(s plan.Step) bool { return s.Test == plan.TestResistance }
	isPol := func(s plan.Step) bool { return isPolarity(s) }
	balance := func(p *plan.Plan) []Entry { return resistanceReadings(t, p) }
	tests := []struct {
		name    string
		p       *plan.Plan
		history func(*plan.Plan) []Entry
		keys    []string
		want    []string // words the screen must carry besides its golden
	}{
		{name: "setup", p: outer, want: []string{"mark", "tooth 1", "counter-clockwise"}},
		{name: "coil1", p: outer, history: before(isCoil), keys: []string{" ", " ", " "}, want: []string{"tooth 1", "CLOCKWISE", "down slot 1, up slot 24", "of 18 turns"}},
		{name: "coil1_inner", p: inner, history: before(isCoil), keys: []string{" ", " ", " "}, want: []string{"tooth 1", "CLOCKWISE", "down slot 24, up slot 1", "of 18 turns"}},
		{name: "jumper1", p: outer, history: before(isJumper), want: []string{"leaves slot 24", "enters slot 1"}},
		{name: "resistance", p: outer, history: before(isRes), want: []string{"U–V  expect 285.5 mΩ", "V–W  expect 285.8 mΩ", "W–U  expect 285.8 mΩ"}},
		{name: "resistance_typing", p: outer, history: before(isRes),
			keys: []string{"enter", "0", ".", "2", "8", "5", "5", "enter", "2", "8", "6", "m"},
			want: []string{"U–V", "[0.2855", "V–W", "[286m", "W–U", "expect 285.5 mΩ", "expect 285.8 mΩ"}},
		{name: "balance", p: outer, history: balance, want: []string{"Press enter to judge the balance"}},
		{name: "balance_verdict", p: outer, history: balance, keys: []string{"enter"}, want: []string{"verdict: PASS", "285.5 mΩ", "286.1 mΩ"}},
		{name: "polarity", p: outer, history: before(isPol), keys: []string{"s", "n", "s"}, want: []string{"tooth 8", "expect S", "tooth 7 shows S, plan N"}},
	}
	for _, tc := range tests {
		for _, size := range [][2]int{{80, 24}, {minWidth, minHeight}} {
			name := fmt.Sprintf("demo_%s_%dx%d", tc.name, size[0], size[1])
			t.Run(name, func(t *testing.T) {
				var h []Entry
				if tc.history != nil {
					h = tc.history(tc.p)
				}
				m := New(Options{Plan: tc.p, Recorder: &memRecorder{}, History: stamped(tc.p, h), Now: fixedNow})
				drive(t, m, tea.WindowSizeMsg{Width: size[0], Height: size[1]})
				keys(t, m, "z") // a key that does nothing clears the resume banner
				keys(t, m, tc.keys...)
				v := plain(m)
				checkLive(t, name, v, tc.want)
				golden(t, name+".txt", v+"\n")
			})
		}
	}
}

// winderSlots derives, apart from the plan, the slots a coil goes down and
// comes up as the winder sees it: facing the tooth from the air gap with the
// lead end up, a clockwise coil goes down the slot on the right and up the
// slot on the left. Slot k lies between tooth k and tooth k+1, and the tooth
// numbers rise counter-clockwise seen from the lead end; seen from outside
// the stator (outer rotor) the right-hand slot of tooth k is slot k, seen
// from the bore (inner rotor) it is slot k-1.
func winderSlots(rotor plan.Rotor, tooth, slots int, cw bool) (down, up int) {
	prev := (tooth+slots-2)%slots + 1
	right, left := tooth, prev
	if rotor == plan.InnerRotor {
		right, left = prev, tooth
	}
	if cw {
		return right, left
	}
	return left, right
}

// TestCoilSlotsAsTheWinderSeesThem opens every coil of the demo, outer and
// inner rotor, and checks the slots on the screen against winderSlots: in
// words, and on the picture (the down slot on the right for a clockwise
// coil).
func TestCoilSlotsAsTheWinderSeesThem(t *testing.T) {
	for _, rotor := range []string{job.RotorOuter, job.RotorInner} {
		p := demoWith(t, rotor)
		q := p.Layout.Spec.Slots
		for _, s := range p.Steps {
			if s.Coil == nil {
				continue
			}
			c := s.Coil
			down, up := winderSlots(p.Rotor, c.Tooth, q, c.Direction == "cw")
			m := New(Options{Plan: p, Recorder: &memRecorder{}, Now: fixedNow,
				History: stamped(p, doneUpTo(p, func(x plan.Step) bool { return x.Index == s.Index }))})
			drive(t, m, tea.WindowSizeMsg{Width: 80, Height: 24})
			v := plain(m)
			words := fmt.Sprintf("down slot %d, up slot %d", down, up)
			left, right := fmt.Sprintf("UP slot %d", up), fmt.Sprintf("DOWN slot %d", down)
			if c.Direction != "cw" {
				left, right = fmt.Sprintf("DOWN slot %d", down), fmt.Sprintf("UP slot %d", up)
			}
			row := ""
			for _, l := range strings.Split(v, "\n") {
				if strings.Contains(l, "slot") && (strings.Contains(l, "UP") || strings.Contains(l, "DOWN")) {
					row = l
					break
				}
			}
			li, ri := strings.Index(row, left), strings.Index(row, right)
			if !strings.Contains(v, words) || li < 0 || ri < 0 || li > ri {
				t.Errorf("%s rotor, coil %d (tooth %d, %s): want %q and %q left of %q on the picture:\n%s",
					rotor, c.Order, c.Tooth, c.Direction, words, left, right, v)
			}
		}
	}
}

// TestPolarityFieldsAndVerdictLive walks a polarity step of the demo at both
// sizes with one tooth showing the other pole: the tooth in hand and the
// pole it must show stay on screen while reading, and once every tooth is
// read the verdict, the tooth named, and the key that records it.
func TestPolarityFieldsAndVerdictLive(t *testing.T) {
	p := demoWith(t, "")
	s := firstStep(t, p, isPolarity)
	teeth := polarityTeeth(p, s)
	for _, size := range [][2]int{{80, 24}, {minWidth, minHeight}} {
		m := New(Options{Plan: p, Recorder: &memRecorder{}, Now: fixedNow,
			History: stamped(p, doneUpTo(p, func(x plan.Step) bool { return x.Index == s.Index }))})
		drive(t, m, tea.WindowSizeMsg{Width: size[0], Height: size[1]})
		name := fmt.Sprintf("%dx%d", size[0], size[1])
		for i, tp := range teeth {
			checkLive(t, name, plain(m), []string{fmt.Sprintf("tooth %d", tp.Tooth), "expect " + poleWord(tp.Pole)})
			k := strings.ToLower(string(tp.Pole))
			if i == 2 { // the third tooth shows the other pole
				k = map[string]string{"n": "s", "s": "n"}[k]
			}
			keys(t, m, k)
		}
		wrong := teeth[2]
		checkLive(t, name+" verdict", plain(m), []string{"verdict: FAIL", fmt.Sprintf("tooth %d shows", wrong.Tooth), "enter records the step"})
	}
}

// TestPolarityUnsureToothReadAgain reads the first tooth of a polarity step
// as unsure and the rest as planned: the unsure tooth comes up again, and
// read right the step passes.
func TestPolarityUnsureToothReadAgain(t *testing.T) {
	p := demoWith(t, "")
	s := firstStep(t, p, isPolarity)
	teeth := polarityTeeth(p, s)
	m := New(Options{Plan: p, Recorder: &memRecorder{}, Now: fixedNow,
		History: stamped(p, doneUpTo(p, func(x plan.Step) bool { return x.Index == s.Index }))})
	drive(t, m, tea.WindowSizeMsg{Width: 80, Height: 24})
	keys(t, m, "x")
	for _, tp := range teeth[1:] {
		keys(t, m, strings.ToLower(string(tp.Pole)))
	}
	first := teeth[0]
	checkLive(t, "unsure again", plain(m), []string{fmt.Sprintf("tooth %d", first.Tooth), "again: it was unsure", "verdict: WARN"})
	if got := m.c.polarityTooth(s.Index - 1); got != first.Tooth {
		t.Errorf("tooth in hand %d; want the unsure tooth %d", got, first.Tooth)
	}
	keys(t, m, strings.ToLower(string(first.Pole)))
	checkLive(t, "read again", plain(m), []string{"verdict: PASS"})
	keys(t, m, "enter")
	if !m.c.prog.Steps[s.Index-1].Done {
		t.Error("the polarity step is not done after enter")
	}
}

// TestLegendKeepsTheView checks the legend under the drawing at every width
// from the minimum up: it fits, and the signs' sense is never shown without
// the view it is seen from.
func TestLegendKeepsTheView(t *testing.T) {
	for _, looking := range []bool{false, true} {
		for w := minWidth; w <= 220; w++ {
			ls := legend(w, looking)
			all := strings.Join(ls, " ")
			if len(ls) == 0 || len(ls) > 2 || !strings.Contains(all, "+U") || !strings.Contains(all, "air gap") {
				t.Fatalf("legend(%d, %v) = %q; want one or two lines with the signs and \"air gap\"", w, looking, ls)
			}
			for _, l := range ls {
				if len(l) > w {
					t.Errorf("legend(%d, %v) line %q is wider than %d", w, looking, l, w)
				}
			}
			if looking && !strings.Contains(all, "* looking") {
				t.Errorf("legend(%d, looking) = %q lacks the '*' mark", w, ls)
			}
		}
	}
}

// TestLegendBesideANarrowRing: beside the narrowest ring the legend may take
// three lines, never none.
func TestLegendBesideANarrowRing(t *testing.T) {
	for w := 28; w < minWidth; w++ {
		for _, looking := range []bool{false, true} {
			if ls := legend(w, looking); len(ls) == 0 || !strings.Contains(strings.Join(ls, " "), "air gap") {
				t.Errorf("legend(%d, %v) = %q; want the signs with their view", w, looking, ls)
			}
		}
	}
}
