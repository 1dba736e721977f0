package plan

import (
	"math"
	"strings"
	"testing"

	"coilwright/winding"

	"coilwright/winding/job/jobtest"

	"coilwright/winding/wire"
)

func TestFormatValue(t *testing.T) {
	cases := []struct {
		v    float64
		u    Unit
		want string
	}{
		{0.1392, UnitOhm, "139.2 mΩ"},
		{0.14597538, UnitOhm, "146.0 mΩ"}, // computed: four figures, the zero kept
		{0.279, UnitOhm, "279 mΩ"},        // typed as 0.279: that round number
		{1.5997, UnitPercent, "1.60 %"},
		{1.152198, UnitOhm, "1.152 Ω"},
		{24, UnitOhm, "24 Ω"},
		{12346, UnitOhm, "12.35 kΩ"},
		{math.Inf(1), UnitOhm, "OL"},
		{2400, UnitMegaohm, "2.4 GΩ"},
		{5, UnitMegaohm, "5 MΩ"},
		{0.5, UnitMegaohm, "500 kΩ"},
		{570, UnitVolt, "570 V"},
		{1500, UnitVolt, "1500 V"},
		{15, UnitCelsius, "15 °C"},
		{22.46, UnitCelsius, "22.5 °C"},
		{1.6529, UnitPercent, "1.65 %"},
		{299.6, UnitRPM, "300 rpm"},
		{60, UnitSecond, "60 s"},
		{1, UnitPassFail, "held"},
		{0, UnitPassFail, "broke down"},
		{1.2, UnitRatio, "1.2"},
	}
	for _, c := range cases {
		if got := FormatValue(c.v, c.u); got != c.want {
			t.Errorf("FormatValue(%g, %q) = %q; want %q", c.v, c.u, got, c.want)
		}
	}
}

func TestLimitText(t *testing.T) {
	cases := []struct {
		t    Test
		want string
	}{
		{Test{Compare: AtLeast, Limit: 5, Unit: UnitMegaohm, Voltage: 500}, "at least 5 MΩ at 500 V"},
		{Test{Compare: AtMost, Limit: 0.179, Unit: UnitOhm}, "at most 179 mΩ"},
		{Test{Compare: InBand, Limit: 7.1, Unit: UnitPercent, LowPercent: -6.9, HighPercent: 7.1}, "within −6.9 % .. +7.1 % of expected"},
		{Test{Compare: InBand, Limit: 7, Unit: UnitPercent, LowPercent: -6.8, HighPercent: 7}, "within −6.8 % .. +7.0 % of expected"},
		{Test{Compare: InBand, Limit: 2, Unit: UnitPercent}, "within ±2 % of expected"},
		{Test{Compare: AtLeast, Limit: 60, Unit: UnitSecond, Voltage: 1500}, "at least 60 s at 1500 V"},
		{Test{Compare: AtLeast, Limit: 60, Unit: UnitSecond, Voltage: 570, VoltageKind: "AC"}, "at least 60 s at 570 V AC"},
		{Test{Compare: AtLeast, Limit: 5, Unit: UnitMegaohm, Voltage: 500, VoltageKind: "DC"}, "at least 5 MΩ at 500 V DC"},
	}
	for _, c := range cases {
		if got := LimitText(c.t); got != c.want {
			t.Errorf("LimitText(%+v) = %q; want %q", c.t, got, c.want)
		}
	}
}

// EASA AR100-2020 states resistance balance as the largest deviation from the
// average of the phases. Worked by hand: 0.1392, 0.1392, 0.14268 Ω have mean
// 0.42108/3 = 0.14036; the largest deviation is 0.14268 − 0.14036 = 0.00232,
// and 0.00232/0.14036 = 1.6529 %, within 2 %. The spread (max − min)/mean
// would be 0.00348/0.14036 = 2.48 %, a rule 1.5× stricter than the source.
func TestImbalancePercent(t *testing.T) {
	pct, mean := ImbalancePercent([]float64{0.1392, 0.1392, 0.14268})
	if math.Abs(mean-0.14036) > 1e-9 || math.Abs(pct-1.6529) > 1e-3 {
		t.Errorf("ImbalancePercent(0.1392, 0.1392, 0.14268) = %.4f %%, mean %.6f; want 1.6529 %%, mean 0.14036 (EASA AR100)", pct, mean)
	}
	if pct, _ := ImbalancePercent(nil); pct != 0 {
		t.Errorf("ImbalancePercent(nil) = %g; want 0", pct)
	}
}

// Series and parallel resistance worked by hand. Star of 1, 2, 3 Ω: U–V 1+2,
// V–W 2+3, W–U 3+1. Delta of 1, 2, 3 Ω (sum 6): across phase U 1·(2+3)/6 =
// 0.8333, across V 2·4/6 = 1.3333, across W 3·3/6 = 1.5. A balanced delta of R
// reads 2R/3.
func TestLineOhms(t *testing.T) {
	cases := []struct {
		c    winding.Connection
		ph   []float64
		want []float64
	}{
		{winding.Star, []float64{1, 2, 3}, []float64{3, 5, 4}},
		{winding.Delta, []float64{1, 2, 3}, []float64{5.0 / 6, 8.0 / 6, 1.5}},
		{winding.Delta, []float64{0.3, 0.3, 0.3}, []float64{0.2, 0.2, 0.2}},
	}
	for _, c := range cases {
		got := LineOhms(c.c, c.ph)
		for i := range c.want {
			if math.Abs(got[i]-c.want[i]) > 1e-12 {
				t.Errorf("LineOhms(%s, %v) = %v; want %v", c.c, c.ph, got, c.want)
				break
			}
		}
	}
}

func keysOf(tt Test) string { return strings.Join(tt.ReadingKeys(), ",") }

// The reading schema follows the job's phases, paths and connection, and
// carries what the meter should read. Worked example (plan_test.go): phases
// U and W 1.153807 Ω, V 1.150588 Ω at 20 °C at their lead ends. Star: U–V
// reads U and V in series, 2.304395 Ω. Delta: across phase U, U against V and
// W in series, S = 3.458202, 1.153807·(3.458202 − 1.153807)/3.458202 =
// 0.768847 Ω.
func TestReadingSchema(t *testing.T) {
	p := mustPlan(t, mustJob(t, handJob))
	want := map[string]string{
		TestContinuity:      "u1_u2,v1_v2,w1_w2",
		TestPhaseInsulation: "u_v,u_w,v_w",
		TestResistance:      "uv,vw,wu,temp",
		TestBalance:         "", // none of its own: the resistance test's (below)
		TestInsulation:      "ir1,volts,temp,ir10",
		TestHighVoltage:     "volts,seconds,passed",
		TestBackEMF:         "uv,vw,wu,rpm",
		// every wound tooth, phase by phase in tooth order (12/10: U on 1, 2, 7, 8)
		TestPolarity: "tooth_1,tooth_2,tooth_7,tooth_8,tooth_3,tooth_4,tooth_9,tooth_10,tooth_5,tooth_6,tooth_11,tooth_12",
	}
	for _, tt := range p.Tests {
		if got := keysOf(tt); got != want[tt.Name] {
			t.Errorf("%s readings = %s; want %s", tt.Name, got, want[tt.Name])
		}
	}
	r := testNamed(p, TestResistance)
	// the balance refers to the resistance readings, one copy in the plan
	bal := testNamed(p, TestBalance)
	if bal.ReadingsFrom != TestResistance || keysOf(Test{Readings: p.ReadingsFor(bal)}) != keysOf(r) {
		t.Errorf("balance readings from %q = %v; want the resistance test's %s", bal.ReadingsFrom, p.ReadingsFor(bal), keysOf(r))
	}
	if e := r.Readings[0].Expected; e == nil || math.Abs(e.Value-2.304395) > 2e-6 || r.Readings[0].Label != "U–V" {
		t.Errorf("resistance U–V expected = %+v; want 2.304395 Ω, star: two phases in series", e)
	}
	lo, hi := ResistanceBand(p.Wire)
	if e := r.Readings[0].Expected; e != nil && (math.Abs(e.Low-e.Value*(1+lo/100)) > 1e-12 || math.Abs(e.High-e.Value*(1+hi/100)) > 1e-12) {
		t.Errorf("resistance U–V window %g .. %g; want the resistance band %+.1f %% .. %+.1f %%", e.Low, e.High, lo, hi)
	}
	if r := testNamed(p, TestHighVoltage).Readings[0]; r.Preset == nil || *r.Preset != testNamed(p, TestHighVoltage).Voltage {
		t.Errorf("withstand volts preset = %v; want the test voltage", r.Preset)
	}

	j := mustJob(t, handJob)
	j.Winding.Connection = "delta"
	pd := mustPlan(t, j)
	if e := testNamed(pd, TestResistance).Readings[0].Expected; e == nil || math.Abs(e.Value-0.768847) > 2e-6 {
		t.Errorf("delta resistance U–V expected = %+v; want 0.768847 Ω (one phase against two)", e)
	}
}

// With two paths per phase each path is read alone, before the paths are
// joined: six continuity readings, each with its path's resistance at the
// lead ends, ρ·(path + two leads)/A (IEC 60028 resistivity).
func TestReadingSchemaPaths(t *testing.T) {
	j := jobtest.DemoVariant(jobtest.Variant{Slots: 24, Poles: 28, Layers: 2, Paths: 2, Phases: 3, TurnsPerCoil: 36})
	p, err := Build(j)
	if err != nil {
		t.Fatalf("Build(demo, 2 paths) = %v", err)
	}
	c := testNamed(p, TestContinuity)
	if got := keysOf(c); got != "u1_u2_p1,u1_u2_p2,v1_v2_p1,v1_v2_p2,w1_w2_p1,w1_w2_p2" {
		t.Fatalf("continuity keys = %s; want one per path", got)
	}
	if c.Readings[1].Label != "U1–U2 path 2" {
		t.Errorf("label = %q; want U1–U2 path 2", c.Readings[1].Label)
	}
	pp := p.Paths[0]
	want := wire.ResistanceAt((1.0/58)*(pp.WireLengthM+2*j.Build.LeadLengthMM/1000)/p.Wire.CopperAreaMM2, p.AmbientC)
	if e := c.Readings[0].Expected; e == nil || math.Abs(e.Value/want-1) > 1e-9 {
		t.Errorf("continuity U1–U2 path 1 expected = %+v; want %.6g Ω", e, want)
	}
	// The phase is its two paths in parallel.
	if got := p.PhaseOhms[0].Ohm20C; math.Abs(got/(p.Paths[0].Ohm20C*p.Paths[1].Ohm20C/(p.Paths[0].Ohm20C+p.Paths[1].Ohm20C))-1) > 1e-9 {
		t.Errorf("phase U = %g Ω; want paths 1 and 2 in parallel", got)
	}
}

// TestSignedPercent: deviations and band edges to 0.1 % with a true minus
// sign, a plus on the positive side and no sign on what rounds to zero.
func TestSignedPercent(t *testing.T) {
	cases := []struct {
		in   float64
		want string
	}{
		{-6.87, "−6.9 %"},
		{7.13, "+7.1 %"},
		{7, "+7.0 %"},
		{-0.04, "0.0 %"},
		{0.04, "0.0 %"},
		{0, "0.0 %"},
		{-0.05, "−0.1 %"}, // math.Round rounds half away from zero
	}
	for _, c := range cases {
		if got := SignedPercent(c.in); got != c.want {
			t.Errorf("SignedPercent(%g) = %q; want %q", c.in, got, c.want)
		}
	}
	if got, want := BandText(-6.87, 7.13), "−6.9 % .. +7.1 %"; got != want {
		t.Errorf("BandText(-6.87, 7.13) = %q; want %q", got, want)
	}
}
