package verify_test

import (
	"testing"

	"coilwright/winding/plan"
	. "coilwright/winding/verify"
)

// A check that judged resistance and insulation yields one reading per plan
// test it touched, on that test's step, with the bench guide's field names
// and the verdict of that test's own findings.
func TestPerTest(t *testing.T) {
	p := demoPlan(t)
	r20 := p.PhaseResistance20C
	// Phase U 8 % low: resistance and balance fail; insulation passes.
	u, v := 0.92*r20, r20
	r := Readings{UV: u + v, VW: 2 * v, WU: v + u, TempC: 20, FourWire: true,
		Insulation: &Insulation{IR1MOhm: 800, IR10MOhm: 2400, Volts: 500}}
	rep, err := Check(p, r)
	if err != nil {
		t.Fatal(err)
	}
	got := PerTest(p, r, rep)
	want := map[string]Verdict{plan.TestResistance: Fail, plan.TestBalance: Fail, plan.TestInsulation: Pass}
	if len(got) != len(want) {
		t.Fatalf("PerTest = %d readings %+v; want %d", len(got), got, len(want))
	}
	for _, tr := range got {
		if tr.Verdict != want[tr.Test] {
			t.Errorf("PerTest %s verdict = %s; want %s", tr.Test, tr.Verdict, want[tr.Test])
		}
		if tr.Step < 1 || p.Steps[tr.Step-1].Test != tr.Test {
			t.Errorf("PerTest %s on step %d; want the plan's step for that test", tr.Test, tr.Step)
		}
	}
	if vals := got[0].Values; vals["uv"] != r.UV || vals["temp"] != 20 {
		t.Errorf("resistance values = %v; want uv %g, temp 20", vals, r.UV)
	}
	if vals := got[2].Values; vals["ir1"] != 800 || vals["volts"] != 500 {
		t.Errorf("insulation values = %v; want ir1 800, volts 500", vals)
	}
}
