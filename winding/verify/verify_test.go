package verify_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"coilwright/winding"
	"coilwright/winding/job"
	"coilwright/winding/plan"
	"coilwright/winding/verify"
	"coilwright/winding/wire"
)

func demoPlan(t testing.TB) *plan.Plan {
	t.Helper()
	p, err := plan.Build(job.Demo())
	if err != nil {
		t.Fatalf("plan.Build(job.Demo()) err = %v", err)
	}
	return p
}

func near(got, want, relTol float64) bool {
	return math.Abs(got-want) <= relTol*math.Abs(want)
}

// Hand-checked conversions. Star: phases 1.0, 1.1, 1.2 Ω read UV = 2.1,
// VW = 2.3, WU = 2.2; R_U = (2.1 + 2.2 − 2.3)/2 = 1.0. Delta of Ru = 1,
// Rv = 2, Rw = 3 (S = 6): R_UV = 1·5/6 = 0.8333, R_VW = 2·4/6 = 1.3333,
// R_WU = 3·3/6 = 1.5. Balanced delta of 0.3 Ω: 0.3·0.6/0.9 = 0.2 per line.
func TestConversions(t *testing.T) {
	cases := []struct {
		name   string
		delta  bool
		phases [3]float64
		lines  [3]float64
		tol    float64
	}{
		{"star unequal", false, [3]float64{1.0, 1.1, 1.2}, [3]float64{2.1, 2.3, 2.2}, 1e-12},
		{"star balanced", false, [3]float64{0.139, 0.139, 0.139}, [3]float64{0.278, 0.278, 0.278}, 1e-12},
		{"delta unequal", true, [3]float64{1, 2, 3}, [3]float64{5.0 / 6, 8.0 / 6, 1.5}, 1e-12},
		{"delta balanced", true, [3]float64{0.3, 0.3, 0.3}, [3]float64{0.2, 0.2, 0.2}, 1e-12},
	}
	for _, c := range cases {
		fwd, inv := verify.StarLines, verify.StarPhases
		if c.delta {
			fwd, inv = verify.DeltaLines, verify.DeltaPhases
		}
		got := fwd(c.phases)
		for i := range got {
			if !near(got[i], c.lines[i], c.tol) {
				t.Errorf("%s: lines(%v) = %v; want %v", c.name, c.phases, got, c.lines)
				break
			}
		}
		back := inv(c.lines[0], c.lines[1], c.lines[2])
		for i := range back {
			if !near(back[i], c.phases[i], c.tol) {
				t.Errorf("%s: phases(%v) = %v; want %v", c.name, c.lines, back, c.phases)
				break
			}
		}
	}
}

// The copper correction itself is tested in package wire (one place).
func TestTemperatureCorrection(t *testing.T) {
	// IEEE 43: IR halves for every 10 K rise, so 100 MΩ at 30 °C is 50 MΩ at 40 °C.
	for _, c := range []struct{ temp, want float64 }{{30, 50}, {40, 100}, {20, 25}, {50, 200}} {
		if got := verify.IRTo40C(100, c.temp); !near(got, c.want, 1e-12) {
			t.Errorf("IRTo40C(100, %g) = %g; want %g", c.temp, got, c.want)
		}
	}
}

// linesFor makes line readings at tempC from 20 °C phase values, for the
// plan's connection.
func linesFor(p *plan.Plan, ph20 [3]float64, tempC float64) verify.Readings {
	var ph [3]float64
	for i := range ph {
		ph[i] = wire.ResistanceAt(ph20[i], tempC)
	}
	l := verify.StarLines(ph)
	if p.Connection == winding.Delta {
		l = verify.DeltaLines(ph)
	}
	return verify.Readings{UV: l[0], VW: l[1], WU: l[2], TempC: tempC, FourWire: true}
}

func scaled(r float64, f [3]float64) [3]float64 { return [3]float64{r * f[0], r * f[1], r * f[2]} }

func findPhase(rep *verify.Report, sev verify.Verdict, phase string) *verify.Finding {
	for i, f := range rep.Findings {
		if f.Severity == sev && f.Phase == phase {
			return &rep.Findings[i]
		}
	}
	return nil
}

func findText(rep *verify.Report, sev verify.Verdict, text string) *verify.Finding {
	for i, f := range rep.Findings {
		if f.Severity == sev && strings.Contains(f.Message, text) {
			return &rep.Findings[i]
		}
	}
	return nil
}

// Done when: readings made from the plan's own value at 27 °C pass, each
// phase's 20 °C value within 0.3 % of the IEC 60028 correction.
func TestPlanValueAt27CPasses(t *testing.T) {
	for _, conn := range []winding.Connection{winding.Star, winding.Delta} {
		p := demoPlan(t)
		p.Connection = conn
		r20 := p.PhaseResistance20C
		rep, err := verify.Check(p, linesFor(p, scaled(r20, [3]float64{1, 1, 1}), 27))
		if err != nil {
			t.Fatal(err)
		}
		if rep.Verdict != verify.Pass {
			t.Errorf("%v: Check(plan value at 27 °C).Verdict = %s; want pass; findings %+v", conn, rep.Verdict, rep.Findings)
		}
		// IEC 60028 by its coefficient: R_20 = R_27 / (1 + 0.00393·7).
		for _, ph := range rep.Phases {
			want := ph.OhmAtTemp / (1 + 0.00393*7)
			if !near(ph.Ohm20C, want, 0.003) || !near(ph.Ohm20C, r20, 0.003) {
				t.Errorf("%v: phase %s at 20 °C = %.6f; want %.6f within 0.3 %%", conn, ph.Phase, ph.Ohm20C, want)
			}
		}
	}
}

// Done when: one phase 8 % low fails with a failing finding naming it.
func TestOnePhaseLowFailsNamingIt(t *testing.T) {
	p := demoPlan(t)
	for i, name := range []string{"U", "V", "W"} {
		f := [3]float64{1, 1, 1}
		f[i] = 0.92
		rep, err := verify.Check(p, linesFor(p, scaled(p.PhaseResistance20C, f), 27))
		if err != nil {
			t.Fatal(err)
		}
		if rep.Verdict != verify.Fail || findPhase(rep, verify.Fail, name) == nil {
			t.Errorf("Check(phase %s 8 %% low) = %s, findings %+v; want fail naming %s", name, rep.Verdict, rep.Findings, name)
		}
	}
}

// Done when: readings three times too high do not pass.
func TestThreeTimesDoesNotPass(t *testing.T) {
	p := demoPlan(t)
	rep, err := verify.Check(p, linesFor(p, scaled(3*p.PhaseResistance20C, [3]float64{1, 1, 1}), 27))
	if err != nil {
		t.Fatal(err)
	}
	if rep.Verdict == verify.Pass || findText(rep, verify.Fail, "star and delta confused") == nil {
		t.Errorf("Check(3× readings) = %s, %+v; want fail, star and delta confused", rep.Verdict, rep.Findings)
	}
}

// Faults simulated on the demo plan (24/28 star, 8 coils of 18 turns per
// phase, one path): the phase's resistance is proportional to its wire length.
func TestDiagnosisOfSimulatedFaults(t *testing.T) {
	p := demoPlan(t)
	r20 := p.PhaseResistance20C
	pathM := p.Paths[0].LeadEndsLengthM // the wire the meter reads: path and both leads
	turnM := p.MeanTurnLengthMM / 1000
	less := func(turns float64) float64 { return (pathM - turns*turnM) / pathM }

	t.Run("five turns missing on a V coil", func(t *testing.T) {
		rep, _ := verify.Check(p, linesFor(p, scaled(r20, [3]float64{1, less(5), 1}), 22))
		f := findPhase(rep, verify.Fail, "V")
		if f == nil || !strings.Contains(f.Message, "about 5 turns fewer") {
			t.Errorf("Check(V −5 turns) findings = %+v; want phase V, about 5 turns fewer", rep.Findings)
		}
	})
	t.Run("a W coil shorted", func(t *testing.T) {
		rep, _ := verify.Check(p, linesFor(p, scaled(r20, [3]float64{1, 1, less(float64(p.TurnsPerCoil))}), 22))
		f := findPhase(rep, verify.Fail, "W")
		if f == nil || !strings.Contains(f.Message, "one coil's share") || len(f.Teeth) != 8 {
			t.Errorf("Check(W coil shorted) findings = %+v; want phase W, one coil's share, 8 candidate teeth", rep.Findings)
		}
	})
	t.Run("six extra turns on U", func(t *testing.T) {
		rep, _ := verify.Check(p, linesFor(p, scaled(r20, [3]float64{less(-6), 1, 1}), 22))
		f := findPhase(rep, verify.Fail, "U")
		if f == nil || !strings.Contains(f.Message, "about 6 extra turns") || !strings.Contains(f.Message, "poor joint") {
			t.Errorf("Check(U +6 turns) findings = %+v; want phase U, poor joint or about 6 extra turns", rep.Findings)
		}
	})
	t.Run("connected delta though the plan says star", func(t *testing.T) {
		ph := wire.ResistanceAt(r20, 22)
		l := verify.DeltaLines([3]float64{ph, ph, ph})
		rep, _ := verify.Check(p, verify.Readings{UV: l[0], VW: l[1], WU: l[2], TempC: 22, FourWire: true})
		if rep.Verdict != verify.Fail || findText(rep, verify.Fail, "connected in delta") == nil {
			t.Errorf("Check(star plan wound delta) = %s, %+v; want fail, connected in delta", rep.Verdict, rep.Findings)
		}
	})
	t.Run("per-phase given line values", func(t *testing.T) {
		ph := 2 * wire.ResistanceAt(r20, 22)
		rep, _ := verify.Check(p, verify.Readings{PerPhase: []float64{ph, ph, ph}, TempC: 22, FourWire: true})
		if findText(rep, verify.Fail, "line-to-line readings given as per-phase") == nil {
			t.Errorf("Check(per-phase 2×) = %+v; want line read as phase", rep.Findings)
		}
	})
	t.Run("all phases thinner wire", func(t *testing.T) {
		f := 1 / (0.95 * 0.95) // 0.95 mm wire for 1.00 mm: +10.8 %
		rep, _ := verify.Check(p, linesFor(p, scaled(r20, [3]float64{f, f, f}), 22))
		if rep.Verdict != verify.Warn || findText(rep, verify.Warn, "0.950 mm instead of 1.000 mm") == nil {
			t.Errorf("Check(all +10.8 %%) = %s, %+v; want warn naming 0.950 mm wire", rep.Verdict, rep.Findings)
		}
	})
	t.Run("phase U open", func(t *testing.T) {
		inf := math.Inf(1)
		rep, _ := verify.Check(p, verify.Readings{UV: inf, VW: 2 * r20, WU: inf, TempC: 20, FourWire: true})
		if findPhase(rep, verify.Fail, "U") == nil || !strings.Contains(findPhase(rep, verify.Fail, "U").Message, "open") {
			t.Errorf("Check(U open) = %+v; want phase U open", rep.Findings)
		}
	})
	t.Run("one of two parallel paths of U open", func(t *testing.T) {
		// The demo with two paths per phase: each path ρ(l + leads)/A, the
		// phase its two paths in parallel; with one path open phase U reads
		// one path, twice the others (hand: R_U = 2·R, a star line U–V reads
		// 3·R). No count of extra turns explains a path gone open. The
		// meter is a little off the exact double, as a real one is.
		j := job.Demo()
		j.Winding.Paths = 2
		q, err := plan.Build(j)
		if err != nil {
			t.Fatal(err)
		}
		r := q.PhaseResistance20C
		ru := 1.9995 * r
		rep, _ := verify.Check(q, verify.Readings{UV: ru + r, VW: 2 * r, WU: ru + r, TempC: 20, FourWire: true})
		f := findPhase(rep, verify.Fail, "U")
		if f == nil || !strings.Contains(f.Message, "one of its 2 parallel paths is open") || strings.Contains(f.Message, "extra turns") {
			t.Errorf("Check(U path open) = %+v; want phase U, a parallel path open, no count of extra turns", rep.Findings)
		}
	})
	t.Run("delta phase V open", func(t *testing.T) {
		q := *p
		q.Connection = winding.Delta
		// Delta with V (between lines V and W) open: UV = Ru, VW = Ru + Rw, WU = Rw.
		rep, _ := verify.Check(&q, verify.Readings{UV: r20, VW: 2 * r20, WU: r20, TempC: 20, FourWire: true})
		if findPhase(rep, verify.Fail, "V") == nil {
			t.Errorf("Check(delta V open) = %+v; want phase V open", rep.Findings)
		}
	})
}

// lineEMF gives the line voltages of the demo plan's coils with one coil
// reversed (0: none), computed here from the layout's phasors.
func lineEMF(p *plan.Plan, reversedTooth int, voltsPerTurn float64) [3]float64 {
	var e [3]complex128
	for _, c := range p.Coils {
		z := verify.CoilPhasor(c.Tooth, p.Layout.Spec.Slots, p.Layout.Spec.PolePairs(), c.Direction)
		if c.Tooth == reversedTooth {
			z = -z
		}
		e[map[string]int{"U": 0, "V": 1, "W": 2}[c.Phase]] += z * complex(float64(c.Turns)*voltsPerTurn, 0)
	}
	abs := func(z complex128) float64 { return math.Hypot(real(z), imag(z)) }
	return [3]float64{abs(e[0] - e[1]), abs(e[1] - e[2]), abs(e[2] - e[0])}
}

func TestBackEMF(t *testing.T) {
	p := demoPlan(t)
	rpm := 300.0
	// Scale so the healthy winding reads the plan's prediction.
	healthy := lineEMF(p, 0, 1)
	want := math.Sqrt(3) * p.EMF.VoltsPerRPMPhase * rpm
	vpt := want / healthy[0]

	l := lineEMF(p, 0, vpt)
	rep, err := verify.Check(p, verify.Readings{TempC: 20, EMF: &verify.BackEMF{UV: l[0], VW: l[1], WU: l[2], RPM: rpm}})
	if err != nil || rep.Verdict != verify.Pass {
		t.Fatalf("Check(healthy back-EMF) = %v, %+v; want pass", err, rep)
	}
	for _, tooth := range []int{1, 5, 10} {
		l := lineEMF(p, tooth, vpt)
		rep, _ := verify.Check(p, verify.Readings{TempC: 20, EMF: &verify.BackEMF{UV: l[0], VW: l[1], WU: l[2], RPM: rpm}})
		if rep.Verdict != verify.Fail || rep.EMF == nil || !containsInt(rep.EMF.Reversed, tooth) {
			t.Errorf("Check(coil on tooth %d reversed) = %s, candidates %v, %+v; want fail naming tooth %d", tooth, rep.Verdict, rep.EMF.Reversed, rep.Findings, tooth)
		}
	}
}

func containsInt(xs []int, x int) bool {
	for _, v := range xs {
		if v == x {
			return true
		}
	}
	return false
}

func TestInsulationAndWithstand(t *testing.T) {
	p := demoPlan(t)
	cases := []struct {
		name string
		in   *verify.Insulation
		hv   *verify.Withstand
		want verify.Verdict
		text string
	}{
		{"good IR and PI", &verify.Insulation{IR1MOhm: 800, IR10MOhm: 2400, Volts: 500}, nil, verify.Pass, "below IEEE 43's 750 W scope"},
		{"IR low at 40 °C", &verify.Insulation{IR1MOhm: 15, Volts: 500}, nil, verify.Fail, "below the 5 MΩ minimum"},
		// IEEE 43-2013: the PI may not apply to small random-wound machines;
		// the demo (about 250 W) is below its 750 W scope: IR 1000 MΩ with
		// PI 1.2 is a warning, not a failure.
		{"PI low, small machine", &verify.Insulation{IR1MOhm: 1000, IR10MOhm: 1200, Volts: 500}, nil, verify.Warn, "polarization index 1.20"},
		{"PI moot above 5 GΩ", &verify.Insulation{IR1MOhm: 30000, IR10MOhm: 33000, Volts: 500}, nil, verify.Pass, "disregarded"},
		{"low test voltage", &verify.Insulation{IR1MOhm: 800, Volts: 250}, nil, verify.Warn, "500 V DC"},
		{"withstand failed", nil, &verify.Withstand{Passed: false, Volts: 568}, verify.Fail, "failed"},
		// Demo: 34.1 V line, about 250 W: IEC 60034-1 500 + 2·34.1 = 568.2 V,
		// the plan rounds up to 570 V.
		{"withstand at the plan's voltage", nil, &verify.Withstand{Passed: true, Volts: 570}, verify.Pass, "the plan's 570 V"},
		{"withstand too low", nil, &verify.Withstand{Passed: true, Volts: 250}, verify.Fail, "proves nothing"},
	}
	for _, c := range cases {
		rep, err := verify.Check(p, verify.Readings{TempC: 20, Insulation: c.in, Withstand: c.hv})
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if rep.Verdict != c.want || findText(rep, c.want, c.text) == nil {
			t.Errorf("%s: Check = %s, %+v; want %s with %q", c.name, rep.Verdict, rep.Findings, c.want, c.text)
		}
		if len(rep.Cautions) == 0 {
			t.Errorf("%s: no cautions shown with an insulation test", c.name)
		}
	}
}

// The withstand test is judged against the plan's test voltage, which IEC
// 60034-1 clause 9.2 (from memory) sets from the rated line voltage U_N and
// the rated output: under 1 kW and under 100 V, 500 V + 2·U_N; otherwise
// 1000 V + 2·U_N, at least 1500 V. Worked by hand: the template job (24 V,
// 1.2 A, about 50 W) 500 + 48 = 548, rounded up to 550 V; the same job
// rated 230 V: 1000 + 460 = 1460, so the 1500 V minimum. Each passes at its
// test voltage and does not pass at 40 % of it (220 V, 600 V), below the
// 80 % of a repeat test.
// Within IEEE 43's scope (here the demo plan rated 3 kW) a PI below 2.0
// fails (IEEE 43-2013, minimum 2.0 for class B and above, from memory).
func TestPILowInScope(t *testing.T) {
	p := demoPlan(t)
	p.RatedPowerW = 3000
	rep, err := verify.Check(p, verify.Readings{TempC: 20, Insulation: &verify.Insulation{IR1MOhm: 1000, IR10MOhm: 1200, Volts: 500}})
	if err != nil {
		t.Fatal(err)
	}
	if rep.Verdict != verify.Fail || findText(rep, verify.Fail, "polarization index 1.20") == nil {
		t.Errorf("Check(3 kW, PI 1.2) = %s, %+v; want fail on the polarization index", rep.Verdict, rep.Findings)
	}
	// IEEE 43-2013 Table 4 (from memory): minimum PI 1.5 for thermal class
	// 105 (A), 2.0 for 130 (B) and above. PI 1.6 (IR 1000 → 1600 MΩ) passes
	// class A and fails class B at 3 kW.
	for _, c := range []struct {
		class int
		want  verify.Verdict
	}{{105, verify.Pass}, {130, verify.Fail}, {155, verify.Fail}} {
		q := *p
		q.ThermalClass = c.class
		rep, err := verify.Check(&q, verify.Readings{TempC: 20, Insulation: &verify.Insulation{IR1MOhm: 1000, IR10MOhm: 1600, Volts: 500}})
		if err != nil {
			t.Fatal(err)
		}
		if rep.Verdict != c.want || rep.Insulation.PIMinimum != verify.MinPIFor(c.class) {
			t.Errorf("Check(3 kW, class %d, PI 1.6) = %s (minimum %g), %+v; want %s", c.class, rep.Verdict, rep.Insulation.PIMinimum, rep.Findings, c.want)
		}
	}
	if got := verify.MinPIFor(105); got != 1.5 {
		t.Errorf("MinPIFor(105) = %g; want 1.5 (IEEE 43-2013 Table 4)", got)
	}
}

func TestWithstandAgainstPlanVoltage(t *testing.T) {
	cases := []struct {
		name  string
		volts string
		want  float64
	}{
		{"template, 24 V", "voltage_v = 24 ", 550},
		{"template, 230 V", "voltage_v = 230 ", 1500},
	}
	for _, c := range cases {
		src := strings.Replace(string(job.TemplateTOML()), "voltage_v = 24 ", c.volts, 1)
		j, err := job.Parse([]byte(src), "template")
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		p, err := plan.Build(j)
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		hv, _ := p.TestNamed(plan.TestHighVoltage)
		tv := hv.Voltage
		if tv != c.want {
			t.Fatalf("%s: plan test voltage %g V; want %g V (IEC 60034-1 clause 9.2)", c.name, tv, c.want)
		}
		for _, k := range []struct {
			frac float64
			want verify.Verdict
		}{{1, verify.Pass}, {0.4, verify.Fail}} {
			rep, err := verify.Check(p, verify.Readings{TempC: 20, Withstand: &verify.Withstand{Passed: true, Volts: k.frac * tv}})
			if err != nil {
				t.Fatal(err)
			}
			if rep.Withstand.Verdict != k.want {
				t.Errorf("%s: withstand held at %g V (%.0f %% of %g V) = %s, %+v; want %s", c.name, k.frac*tv, 100*k.frac, tv, rep.Withstand.Verdict, rep.Findings, k.want)
			}
		}
	}
}

func TestBadReadings(t *testing.T) {
	p := demoPlan(t)
	ok := verify.Readings{UV: 0.3, VW: 0.3, WU: 0.3, TempC: 20}
	nan, inf := math.NaN(), math.Inf(1)
	cases := []struct {
		name  string
		edit  func(*verify.Readings)
		field string
	}{
		{"negative", func(r *verify.Readings) { r.VW = -0.3 }, "vw"},
		{"missing one", func(r *verify.Readings) { r.WU = 0 }, "wu"},
		{"not a number", func(r *verify.Readings) { r.UV = nan }, "uv"},
		{"below absolute zero", func(r *verify.Readings) { r.TempC = -300 }, "temp"},
		{"in kelvin", func(r *verify.Readings) { r.TempC = 293 }, "temp"},
		{"absurd ohm", func(r *verify.Readings) { r.UV = 5e6 }, "uv"},
		{"lead above reading", func(r *verify.Readings) { r.LeadOhm = 0.4 }, "lead-ohm"},
		{"four-wire and lead", func(r *verify.Readings) { r.FourWire, r.LeadOhm = true, 0.01 }, "lead-ohm"},
		{"temp infinite", func(r *verify.Readings) { r.TempC = inf }, "temp"},
		{"ir without volts", func(r *verify.Readings) { r.Insulation = &verify.Insulation{IR1MOhm: 100} }, "ir-volts"},
		{"emf without rpm", func(r *verify.Readings) { r.EMF = &verify.BackEMF{UV: 10, VW: 10, WU: 10} }, "rpm"},
		{"hv without volts", func(r *verify.Readings) { r.Withstand = &verify.Withstand{Passed: true} }, "hv-volts"},
		{"nothing", func(r *verify.Readings) { *r = verify.Readings{} }, "uv"},
	}
	for _, c := range cases {
		r := ok
		c.edit(&r)
		_, err := verify.Check(p, r)
		var ie *verify.InputError
		if !errors.As(err, &ie) || !errors.Is(err, verify.ErrInput) || ie.Field != c.field {
			t.Errorf("%s: Check err = %v; want an InputError on %q", c.name, err, c.field)
		}
	}
}

func BenchmarkCheckWithBackEMF(b *testing.B) {
	p := demoPlan(b)
	l := lineEMF(p, 5, 0.1)
	r := linesFor(p, scaled(p.PhaseResistance20C, [3]float64{1, 0.95, 1}), 25)
	r.EMF = &verify.BackEMF{UV: l[0], VW: l[1], WU: l[2], RPM: 300}
	for b.Loop() {
		if _, err := verify.Check(p, r); err != nil {
			b.Fatal(err)
		}
	}
}

// EASA AR100-2020: balance is the largest deviation from the average. Phases
// of 0.1392, 0.1392 and 0.14268 Ω at 20 °C (worked by hand: mean 0.14036,
// largest deviation 0.00232, 1.65 %) are balanced within 2 %.
func TestImbalanceLargestDeviation(t *testing.T) {
	p := demoPlan(t)
	rep, err := verify.Check(p, verify.Readings{PerPhase: []float64{0.1392, 0.1392, 0.14268}, TempC: 20, FourWire: true})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(rep.ImbalancePercent-1.6529) > 1e-3 {
		t.Errorf("Check imbalance = %.4f %%; want 1.6529 %% (largest deviation from the mean, EASA AR100)", rep.ImbalancePercent)
	}
	for _, f := range rep.Findings {
		if f.Test == plan.TestBalance && f.Severity != verify.Pass {
			t.Errorf("balance finding %+v; want pass at 1.65 %%", f)
		}
	}
}

// Back-EMF at 1/√3 of the prediction. With line resistances that fit the
// plan's star (each reading two phases in series, R_UV = R_U + R_V), the
// connection is proven and the cause named is the flux estimate; without
// resistance readings star and delta confused stays among the causes.
func TestBackEMFRootThreeLow(t *testing.T) {
	p := demoPlan(t)
	const rpm = 300
	// Star: the line EMF is √3 × the phase EMF, so 1/√3 of it is the phase value.
	line := p.EMF.VoltsPerRPMPhase * rpm
	emf := &verify.BackEMF{UV: line, VW: line, WU: line, RPM: rpm}
	r := linesFor(p, scaled(p.PhaseResistance20C, [3]float64{1, 1, 1}), 20)
	r.EMF = emf
	rep, err := verify.Check(p, r)
	if err != nil {
		t.Fatal(err)
	}
	f := findText(rep, verify.Fail, "flux per pole")
	if f == nil || !strings.Contains(f.Message, "not confused") || f.Test != plan.TestBackEMF {
		t.Errorf("Check(star proven, EMF 1/√3) findings = %+v; want the flux estimate named, star and delta ruled out", rep.Findings)
	}
	rep, err = verify.Check(p, verify.Readings{TempC: 20, EMF: emf})
	if err != nil {
		t.Fatal(err)
	}
	if findText(rep, verify.Fail, "star and delta confused") == nil || findText(rep, verify.Fail, "flux per pole") == nil {
		t.Errorf("Check(EMF 1/√3 alone) findings = %+v; want star and delta confused and the flux both offered", rep.Findings)
	}
}

// The check states the smallest turn error each test it judged can see on
// this job (the plan's Resolutions, worked by hand in package plan).
func TestCheckStatesResolution(t *testing.T) {
	p := demoPlan(t)
	rep, err := verify.Check(p, linesFor(p, scaled(p.PhaseResistance20C, [3]float64{1, 1, 1}), 20))
	if err != nil {
		t.Fatal(err)
	}
	got := map[string]int{}
	for _, r := range rep.Resolution {
		got[r.Test] = r.Turns
	}
	if len(got) != 2 || got[plan.TestBalance] < 1 || got[plan.TestResistance] < 1 {
		t.Errorf("Check resolution = %+v; want resistance and balance, each in turns", rep.Resolution)
	}
	if !strings.Contains(rep.Text(), "What these tests can see on this job") {
		t.Error("check text does not state what the tests can see")
	}
}
