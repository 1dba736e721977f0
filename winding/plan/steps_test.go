package plan

import (
	"strings"
	"testing"

	"coilwright/winding"
	"coilwright/winding/job"
)

func index(p *Plan, pred func(Step) bool) int {
	for _, s := range p.Steps {
		if pred(s) {
			return s.Index
		}
	}
	return -1
}

func testStep(name string) func(Step) bool {
	return func(s Step) bool { return s.Kind == StepTest && s.Test == name }
}

func TestStepsDemo(t *testing.T) {
	p := mustPlan(t, job.Demo())
	checkSteps(t, "demo", p)
	// Outer rotor, facing tooth 1 from outside with the lead end up, the
	// slot after it (slot 1) is on the right: clockwise goes down slot 1.
	first := p.Steps[index(p, func(s Step) bool { return s.Kind == StepCoil })-1].Coil
	if first.Tooth != 1 || first.Direction != "cw" || !strings.Contains(first.HowToWind, "CLOCKWISE seen from the air gap (from outside the stator)") ||
		!strings.Contains(first.HowToWind, "down slot 1, up slot 24") || first.DownSlot != 1 || first.UpSlot != 24 ||
		first.From != "start lead U1 (300 mm)" || first.To != "jumper to tooth 2" || first.SlotBefore != 24 || first.SlotAfter != 1 {
		t.Errorf("first coil step = %+v; want tooth 1 cw, down slot 1, from lead U1, to tooth 2", first)
	}
}

// TestSetupFirst: the numbering is put on the stator before anything else,
// and a job without separator film gets no separator steps or material.
func TestSetupFirst(t *testing.T) {
	p := mustPlan(t, job.Demo())
	s := p.Steps[0]
	if s.Kind != StepSetup || !strings.Contains(s.Detail, "tooth 1") || !strings.Contains(s.Detail, "counter-clockwise seen from the lead end") ||
		!strings.Contains(s.Detail, "there must be 24") || !strings.Contains(s.Detail, "Slot 1 is the slot between tooth 1 and tooth 2") {
		t.Errorf("first step = %+v; want the set-up of lead end, tooth 1, direction and slot count", s)
	}
	j := job.Demo()
	j.Stator.SeparatorMM = 0
	p = mustPlan(t, j)
	for _, s := range p.Steps {
		if s.Kind == StepSeparator {
			t.Errorf("separator_mm = 0: step %d %q", s.Index, s.Title)
		}
	}
	for _, m := range p.Materials {
		if m.Item == "phase separator" {
			t.Errorf("separator_mm = 0: material %+v", m)
		}
	}
}

func TestStepsVariants(t *testing.T) {
	inner := mustPlan(t, mustJob(t, handJob))
	checkSteps(t, "worked example", inner)
	c := inner.Steps[index(inner, func(s Step) bool { return s.Kind == StepCoil })-1].Coil
	// Inner rotor: facing tooth 1 from the bore, the slot before (12) is on the right.
	if !strings.Contains(c.HowToWind, "CLOCKWISE seen from the air gap (from the bore)") || !strings.Contains(c.HowToWind, "down slot 12, up slot 1;") ||
		c.DownSlot != 12 || c.UpSlot != 1 {
		t.Errorf("inner-rotor first coil HowToWind = %q; want clockwise from the bore, down slot 12", c.HowToWind)
	}
	delta := strings.Replace(handJob, "poles = 10", "poles = 10\npaths = 2\nconnection = \"delta\"", 1)
	p := mustPlan(t, mustJob(t, delta))
	checkSteps(t, "delta, two paths", p)
	joins := 0
	for _, s := range p.Steps {
		if s.Kind == StepJoin {
			joins++
		}
	}
	if joins != 3+3 {
		t.Errorf("delta with 2 paths: %d join steps; want 3 path joints and 3 delta corners", joins)
	}
	single := strings.Replace(handJob, "poles = 10", "poles = 10\nlayers = 1", 1)
	p = mustPlan(t, mustJob(t, single))
	checkSteps(t, "single layer", p)
	for _, s := range p.Steps {
		if s.Kind == StepSeparator {
			t.Errorf("single layer: separator step %q; a single-layer slot holds one coil side", s.Title)
		}
	}
}

// checkSteps checks what every plan's steps must satisfy.
func checkSteps(t *testing.T, name string, p *Plan) {
	t.Helper()
	l := p.Layout
	coils := map[int]bool{}
	orders := map[int]bool{}
	sidesIn := map[int]int{}
	separated := map[int]bool{}
	for i, s := range p.Steps {
		if s.Index != i+1 {
			t.Errorf("%s: Steps[%d].Index = %d; want %d", name, i, s.Index, i+1)
		}
		switch s.Kind {
		case StepCoil:
			c := s.Coil
			if c == nil {
				t.Fatalf("%s: coil step %d without Coil", name, s.Index)
			}
			coils[c.Tooth] = true
			orders[c.Order] = true
			if c.Of != len(l.Coils) || c.Turns != p.TurnsPerCoil || c.HowToWind == "" || c.From == "" || c.To == "" {
				t.Errorf("%s: coil step %+v incomplete", name, c)
			}
			before, after := winding.SlotsOf(c.Tooth, l.Spec.Slots)
			if c.SlotBefore != before || c.SlotAfter != after {
				t.Errorf("%s: coil on tooth %d slots %d/%d; want %d/%d", name, c.Tooth, c.SlotBefore, c.SlotAfter, before, after)
			}
			for _, sl := range []int{before, after} {
				if _, _, differ := slotPhases(l, sl); differ && sidesIn[sl] == 1 && !separated[sl] {
					t.Errorf("%s: coil on tooth %d enters shared slot %d before its separator", name, c.Tooth, sl)
				}
				sidesIn[sl]++
			}
		case StepSeparator:
			if separated[s.Slot] {
				t.Errorf("%s: two separator steps for slot %d", name, s.Slot)
			}
			if _, _, differ := slotPhases(l, s.Slot); !differ {
				t.Errorf("%s: separator in slot %d, which holds one phase", name, s.Slot)
			}
			separated[s.Slot] = true
		case StepJumper:
			if s.Jumper == nil {
				t.Errorf("%s: jumper step %d without Jumper", name, s.Index)
			}
		case StepTest:
			if testNamed(p, s.Test).Name == "" {
				t.Errorf("%s: step %d names test %q, not in Tests", name, s.Index, s.Test)
			}
		}
	}
	for _, c := range l.Coils {
		if !coils[c.Tooth] {
			t.Errorf("%s: no step for the coil on tooth %d", name, c.Tooth)
		}
	}
	for i := 1; i <= len(l.Coils); i++ {
		if !orders[i] {
			t.Errorf("%s: no coil step with Order %d", name, i)
		}
	}
	if got, want := len(separated), len(sharedList(l)); got != want {
		t.Errorf("%s: %d separator steps; want one per shared slot, %d", name, got, want)
	}
	firstJoin := index(p, func(s Step) bool { return s.Kind == StepJoin })
	lastCoil := 0
	for _, s := range p.Steps {
		if s.Kind == StepCoil {
			lastCoil = s.Index
		}
	}
	cont, ins := index(p, testStep(TestContinuity)), index(p, testStep(TestPhaseInsulation))
	res, bal := index(p, testStep(TestResistance)), index(p, testStep(TestBalance))
	ir, hv := index(p, testStep(TestInsulation)), index(p, testStep(TestHighVoltage))
	if !(lastCoil < cont && cont < ins && ins < firstJoin && firstJoin < res && res < bal && bal < ir && ir < hv) {
		t.Errorf("%s: step order coils..%d, continuity %d, phase insulation %d, first join %d, resistance %d, balance %d, IR %d, HV %d; want them in that order",
			name, lastCoil, cont, ins, firstJoin, res, bal, ir, hv)
	}
	for _, ts := range p.Tests {
		if ts.Name == "" || ts.Unit == "" || ts.Source == "" || ts.What == "" || ts.Compare == "" {
			t.Errorf("%s: test %+v lacks a field", name, ts)
		}
		if ts.Voltage > 0 && ts.Caution == "" {
			t.Errorf("%s: test %s puts %g V on the winding without a caution", name, ts.Name, ts.Voltage)
		}
	}
}
