package tui

import (
	"testing"

	"coilwright/winding/plan"
)

// TestContinuityJudgedPerPath: each path's continuity reading is judged
// against its own bound (ContinuityFactor times its own expected value, the
// window the bench and the pack show beside its field), not one rounded
// figure for all paths: a reading just over its own bound fails though it is
// under the bound of a longer path.
func TestContinuityJudgedPerPath(t *testing.T) {
	p := demoPlan(t)
	ct, _ := p.TestNamed(plan.TestContinuity)
	if len(ct.Readings) != 3 {
		t.Fatalf("demo continuity has %d readings; want 3", len(ct.Readings))
	}
	exp := make([]float64, 3)
	for i, r := range ct.Readings {
		exp[i] = r.Expected.Value
	}
	// The bound worked by hand: 1.25 x the path's own expected value.
	for i := range ct.Readings {
		v := append([]float64(nil), exp...)
		v[i] = plan.ContinuityFactor*exp[i] + 0.0002 // 0.2 mΩ over its own bound
		if got := limitJudge(p, ct, v); got.Level != "fail" {
			t.Errorf("continuity with %s at %.4f Ω (its bound %.4f Ω) = %s; want fail", ct.Readings[i].Label, v[i], plan.ContinuityFactor*exp[i], got.Level)
		}
		v[i] = plan.ContinuityFactor*exp[i] - 0.0002
		if got := limitJudge(p, ct, v); got.Level != "pass" {
			t.Errorf("continuity with %s at %.4f Ω (its bound %.4f Ω) = %s %v; want pass", ct.Readings[i].Label, v[i], plan.ContinuityFactor*exp[i], got.Level, got.Lines)
		}
	}
	if got, want := plan.LimitText(ct), "each at most 125 % of its expected value"; got != want {
		t.Errorf("LimitText(continuity) = %q; want %q", got, want)
	}
}
