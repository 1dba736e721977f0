package plan

import (
	"math"
	"testing"
)

// What each test sees on the worked example (plan_test.go), by hand. Paths
// between the lead ends: U and W 13.13987 m, V 13.10321 m, mean 13.12765 m;
// mean turn 77.70787 mm; 4 coils of 40 turns per path, one path.
//
//	one turn on a phase     0.07770787 / 13.12765           = 0.59194 %
//	balance (EASA AR100)    2 % · 3/2 = 3 % off the others; 3 / 0.59194 = 5.07 → 6 turns
//	one turn on every coil  4 · 0.59194                     = 2.3678 %
//	band (IEC 60317 ±0.005 on 0.5 mm, ±5 % length): −6.872 % .. +7.132 %;
//	                        6.872 / 2.3678 = 2.90 → 3 turns per coil
//	back-EMF (3 %), star    x/6 per phase x: 18 % of 160 series turns = 28.8 → 29
//	                 delta  x/3: 9 % of 160 = 14.4 → 15
func TestResolutions(t *testing.T) {
	p := mustPlan(t, mustJob(t, handJob))
	want := map[string]struct {
		turns int
		pct   float64
	}{
		TestResistance: {3, 2.3678},
		TestBalance:    {6, 0.59194},
		TestBackEMF:    {29, 100.0 / 160},
		TestContinuity: {0, 0},
	}
	got := p.Resolutions()
	if len(got) != len(want) {
		t.Fatalf("Resolutions() = %d entries; want %d", len(got), len(want))
	}
	for _, r := range got {
		w := want[r.Test]
		if r.Turns != w.turns || math.Abs(r.PerTurnPercent-w.pct) > 1e-4 || r.Text == "" {
			t.Errorf("Resolutions %s = %d turns, %.5f %% per turn; want %d, %.5f %%", r.Test, r.Turns, r.PerTurnPercent, w.turns, w.pct)
		}
		if tt := testNamed(p, r.Test); tt.Resolution != r.Text {
			t.Errorf("test %s states %q; want the resolution %q", r.Test, tt.Resolution, r.Text)
		}
	}
	j := mustJob(t, handJob)
	j.Winding.Connection = "delta"
	for _, r := range mustPlan(t, j).Resolutions() {
		if r.Test == TestBackEMF && r.Turns != 15 {
			t.Errorf("delta back-EMF resolution = %d turns; want 15 (x/3 per phase, 9 %% of 160)", r.Turns)
		}
	}
}
