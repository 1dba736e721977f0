package plan

import (
	"encoding/json"
	"errors"
	"math"
	"math/cmplx"
	"strings"
	"testing"

	"coilwright/winding"
	"coilwright/winding/job"
)

// handJob is the worked example below: a 12-slot, 10-pole inner-rotor stator
// with every quantity round enough to follow by hand.
const handJob = `name = "worked example"
[winding]
slots = 12
poles = 10
[stator]
rotor = "inner"
diameter_mm = 60
stack_length_mm = 30
tooth_width_mm = 6
liner_mm = 0.2
separator_mm = 0.2
[stator.slot]
depth_mm = 10
width_top_mm = 6
width_bottom_mm = 8
opening_mm = 2
[wire]
bare_diameter_mm = 0.5
grade = 2
[turns]
per_coil = 40
[rating]
current_a = 1
voltage_v = 24
[build]
lead_length_mm = 250
extra_per_coil_mm = 30
jumper_slack_mm = 20
`

func mustJob(t testing.TB, src string) *job.Job {
	t.Helper()
	j, err := job.Parse([]byte(src), "test.toml")
	if err != nil {
		t.Fatalf("job.Parse: %v", err)
	}
	return j
}

func mustPlan(t testing.TB, j *job.Job) *Plan {
	t.Helper()
	p, err := Build(j)
	if err != nil {
		t.Fatalf("Build: %v", err)
	}
	return p
}

// TestWorkedExample checks the plan of handJob against a computation by hand.
//
// Slot (trapezoid 10 deep, 6 wide at the top, 8 at the bottom, opening 2):
//
//	area       A = 10·(6+8)/2                         = 70 mm²
//	side wall  √(10² + ((8−6)/2)²) = √101             = 10.04988 mm
//	lined      2·10.04988 + 8 + (6−2)                 = 32.09975 mm
//	liner      0.2 · 32.09975                         = 6.41995 mm²
//	separator  0.2 · (10 − 0.2) (12/10 has slots holding two phases) = 1.96 mm²
//	usable     70 − 6.41995 − 1.96                    = 61.62005 mm²
//
// Wire 0.500 mm grade 2: IEC 60317-0-1 maximum overall 0.566 mm, ±0.005 mm.
//
//	strand     π·0.5²/4                               = 0.1963495 mm²
//	copper     2 sides · 40 turns · 0.1963495         = 15.70796 mm²
//	fill       15.70796 / 61.62005                    = 0.254916
//	max turns  ⌊0.40·61.62005 / (2·0.1963495)⌋ = ⌊62.77⌋ = 62
//
// Mean turn (coil build b: 40 wires of 0.566² in square packing over the lined
// depth 10 − 0.2):
//
//	b          40·0.566²/9.8                          = 1.307576 mm
//	MLT        2·(30+0.4) + 2·(6+0.4) + π·1.307576     = 77.70787 mm
//	coil       40 · 77.70787 mm                       = 3.108315 m
//
// Jumpers run at mid slot depth, radius 30 + 10/2 = 35 mm: slot pitch
// 2π·35/12 = 18.32596 mm. Inner rotor: facing tooth k from the bore its
// right-hand slot is k−1, so a cw coil goes down k−1 and up k, a ccw coil down
// k and up k−1. Layout U u v V W w u U V v w W (capital cw):
//
//	U  1 cw (up 1) → 2 ccw (down 2, up 1) → 7 ccw (down 7, up 6) → 8 cw (down 7):
//	   1 + 6 + 1 = 8 slot pitches: 8·18.32596 + 3·20 slack = 206.6077 mm
//	V  3 ccw (up 2) → 4 cw (down 3, up 4) → 9 cw (down 8, up 9) → 10 ccw (down 10):
//	   1 + 4 + 1 = 6 slot pitches: 6·18.32596 + 60       = 169.9557 mm
//	W  as U (5 cw, 6 ccw, 11 ccw, 12 cw)                  = 206.6077 mm
//
//	path U     4·3.108315 + 0.2066077                 = 12.63987 m (V 12.60321 m)
//	R20 U      (12.63987 + 2·0.25 leads) / 58 / 0.1963495 = 1.153807 Ω (IEC 60028);
//	           V (12.60321 + 0.5) / 58 / 0.1963495        = 1.150588 Ω; read at the lead
//	           ends, where the star point is made
//	phase      (2·1.153807 + 1.150588)/3               = 1.152734 Ω
//	leads in   2·12.63987 + 12.60321 + 3·2·0.25        = 39.38295 m
//	mass       39.38295 m · 0.1963495 mm² · 8.89 g/cm³ = 0.0687448 kg
//	cut        12.63987 + 0.5 + 4·0.030               = 13.25987 m (path U)
//	buy        (2·13.25987 + 13.22321) · 1.10          = 43.71724 m, 0.0763105 kg
//	J          1 A / 0.1963495 mm²                    = 5.09296 A/mm²
//	loss       1² · (2·1.153807 + 1.150588)            = 3.458202 W (at 20 °C; hot in TestCopperLossHot)
//	HV test    under 1 kW and 100 V: 500 + 2·24 = 548, rounded up to 550 V
//	           (IEC 60034-1 clause 9.2)
func TestWorkedExample(t *testing.T) {
	p := mustPlan(t, mustJob(t, handJob))
	cases := []struct {
		name      string
		got, want float64
		tol       float64
	}{
		{"Slot.AreaMM2", p.Slot.AreaMM2, 70, 1e-9},
		{"Slot.LinedPerimeterMM", p.Slot.LinedPerimeterMM, 32.09975, 1e-5},
		{"Slot.LinerAreaMM2", p.Slot.LinerAreaMM2, 6.41995, 1e-5},
		{"Slot.SeparatorAreaMM2", p.Slot.SeparatorAreaMM2, 1.96, 1e-9},
		{"Slot.UsableAreaMM2", p.Slot.UsableAreaMM2, 61.62005, 1e-5},
		{"Wire.OverallDiameterMM", p.Wire.OverallDiameterMM, 0.566, 1e-9},
		{"Wire.DiameterTolMM", p.Wire.DiameterTolMM, 0.005, 1e-9},
		{"Wire.CopperAreaMM2", p.Wire.CopperAreaMM2, 0.1963495, 1e-7},
		{"SlotFill", p.SlotFill, 0.254916, 1e-6},
		{"Slot.MaxTurns", float64(p.Slot.MaxTurns), 62, 0},
		{"Slot.CoilBuildMM", p.Slot.CoilBuildMM, 1.307576, 1e-6},
		{"MeanTurnLengthMM", p.MeanTurnLengthMM, 77.70787, 1e-5},
		{"Coils[0].WireLengthM", p.Coils[0].WireLengthM, 3.108315, 1e-6},
		{"JumperPitchMM", p.JumperPitchMM, 18.32596, 1e-5},
		{"Paths[0].JumperLengthM", p.Paths[0].JumperLengthM, 0.2066077, 1e-7},
		{"Paths[0].WireLengthM", p.Paths[0].WireLengthM, 12.63987, 1e-5},
		{"Paths[0].CutLengthM", p.Paths[0].CutLengthM, 13.25987, 1e-5},
		{"Paths[0].Ohm20C", p.Paths[0].Ohm20C, 1.153807, 1e-6},
		{"PhaseResistance20C", p.PhaseResistance20C, 1.152734, 1e-6},
		{"PhaseResistanceAmbient", p.PhaseResistanceAmbient, 1.152734, 1e-6},
		{"CopperLengthM", p.CopperLengthM, 39.38295, 1e-5},
		{"CopperMassKg", p.CopperMassKg, 0.0687448, 1e-7},
		{"BuyLengthM", p.BuyLengthM, 43.71724, 1e-5},
		{"BuyMassKg", p.BuyMassKg, 0.0763105, 1e-7},
		{"CurrentDensityAmm2", p.CurrentDensityAmm2, 5.09296, 1e-5},
		{"CopperLossAmbientW", p.CopperLossAmbientW, 3.458202, 1e-5},
		{"hv_withstand voltage", testNamed(p, TestHighVoltage).Voltage, 550, 0},
	}
	for _, c := range cases {
		if math.Abs(c.got-c.want) > c.tol {
			t.Errorf("Build(worked example).%s = %.7g; want %.7g (±%g)", c.name, c.got, c.want, c.tol)
		}
	}
	if p.TurnsPerCoil != 40 || p.TurnsSolved || p.EMF != nil {
		t.Errorf("Build(worked example) turns = %d solved %v EMF %v; want 40 as given, no EMF (no flux)", p.TurnsPerCoil, p.TurnsSolved, p.EMF)
	}
}

func testNamed(p *Plan, name string) Test {
	t, _ := p.TestNamed(name)
	return t
}

// withFlux replaces the [turns] table of the demo geometry with given turns
// and a flux source, at a rated speed of 500 rpm.
func withFlux(t *testing.T, flux string) *Plan {
	t.Helper()
	src := string(job.DemoTOML())
	i := strings.Index(src, "[turns]")
	k := strings.Index(src, "[rating]")
	src = src[:i] + "[turns]\nper_coil = 18\n\n" + flux + "\n" + src[k:]
	return mustPlan(t, mustJob(t, src))
}

// TestEMFDirect compares the plan's phase EMF with a direct sum of the coil
// EMF phasors of phase U: each tooth coil of N turns gives
// √2·π·f·N·k_p·Φ at angle −p·(k−1)·360/Q (plus 180° when wound ccw), k_p =
// sin(p·π/Q) the pitch factor of a coil spanning one slot pitch (textbook).
// The sum needs no winding factor, so it also checks the engine's k_w.
func TestEMFDirect(t *testing.T) {
	const phi, rpm = 2.0e-4, 500.0
	p := withFlux(t, "[flux]\nper_pole_wb = 2.0e-4\n")
	l := p.Layout
	q, pp := float64(l.Spec.Slots), float64(l.Spec.Poles/2)
	f := pp * rpm / 60
	kp := math.Abs(math.Sin(pp * math.Pi / q))
	var sum complex128
	for _, c := range l.Coils {
		if c.Phase != 0 {
			continue
		}
		ang := -pp * float64(c.Tooth-1) * 2 * math.Pi / q
		if c.Direction == winding.CCW {
			ang += math.Pi
		}
		sum += cmplx.Rect(math.Sqrt2*math.Pi*f*18*kp*phi, ang)
	}
	want := cmplx.Abs(sum)
	if got := p.EMF.PhaseRMSAtRated; math.Abs(got-want) > 1e-9*want {
		t.Errorf("Build(demo, Φ = 0.2 mWb).EMF.PhaseRMSAtRated = %.9f; direct phasor sum %.9f", got, want)
	}
	if got := p.EMF.LineRMSAtRated; math.Abs(got-math.Sqrt(3)*want) > 1e-9*want {
		t.Errorf("Build(demo).EMF.LineRMSAtRated = %.6f; want √3·%.6f (star)", got, want)
	}
}

// TestTestCoilMethod checks the shop method against a direct EMF computation.
// A 20-turn test coil on one tooth of the demo stator (24/28, k_p =
// sin(14·180°/24) = sin 105° = 0.9659258) in a flux of 0.2 mWb per pole at
// 300 rpm (f = 14·300/60 = 70 Hz) reads √2·π·70·20·0.9659258·2e-4 =
// 1.2016187 V. A plan given that reading must give the same EMF as one given
// the flux itself, and E_phase = V_t·(n/n_t)·(N_series/N_t)·k_d with k_d =
// k_w/k_p.
func TestTestCoilMethod(t *testing.T) {
	direct := withFlux(t, "[flux]\nper_pole_wb = 2.0e-4\n")
	shop := withFlux(t, "[flux.test_coil]\nturns = 20\nspeed_rpm = 300\nvolts_rms = 1.2016187044809425\n")
	if d, s := direct.EMF.PhaseRMSAtRated, shop.EMF.PhaseRMSAtRated; math.Abs(d-s) > 1e-9*d {
		t.Errorf("phase EMF from test coil = %.9f; from flux per pole %.9f", s, d)
	}
	if got := shop.EMF.FluxPerPoleWb; math.Abs(got-2e-4) > 1e-12 {
		t.Errorf("FluxFromTestCoil = %.6g; want 2e-4", got)
	}
	l := shop.Layout
	kd := l.WindingFactor / l.PitchFactor
	shopRule := 1.2016187044809425 * (500.0 / 300) * (18.0 * 8 / 20) * kd
	if got := shop.EMF.PhaseRMSAtRated; math.Abs(got-shopRule) > 1e-9*got {
		t.Errorf("phase EMF = %.9f; shop rule V_t·(n/n_t)·(N/N_t)·k_d = %.9f", got, shopRule)
	}
}

// Air gap: B = 0.8 T flat-top under magnets of arc 0.8 on the demo rotor
// (D = 150 mm, 2p = 28, L = 30 mm): τ = π·150/28 = 16.830 mm, B1 =
// (4/π)·0.8·sin 72° = 0.96874 T, Φ = (2/π)·0.96874·0.016830·0.030 = 0.31138 mWb.
func TestFluxFromAirGap(t *testing.T) {
	p := withFlux(t, "[flux]\nair_gap_tesla = 0.8\nmagnet_arc = 0.8\n")
	if got := p.EMF.FluxPerPoleWb; math.Abs(got-3.113801e-4) > 1e-9 {
		t.Errorf("FluxFromAirGap(0.8 T, 0.8, 150 mm, 30 mm, 28) = %.7g; want 3.113801e-4", got)
	}
}

// The demo solves its turns for a DC bus: the smallest whole number whose
// peak line EMF √2·V_LL reaches the battery plus the diodes, 26 + 1.6 V, at
// 300 rpm (peak conduction into a stiff DC voltage; Mohan, Undeland, Robbins,
// Power Electronics, ch. 5, from memory). Worked by hand: V_LL = 27.6/√2 =
// 19.516 V, V_ph = 11.268 V; the test coil gives 0.65683 V per turn per coil
// at 300 rpm, so 11.268/0.65683 = 17.16 turns, rounded up to 18.
func TestDemoSolvedTurns(t *testing.T) {
	p := mustPlan(t, job.Demo())
	e := p.EMF
	if !p.TurnsSolved || e == nil {
		t.Fatalf("Build(demo): turns not solved")
	}
	if p.TurnsPerCoil != 18 {
		t.Errorf("Build(demo).TurnsPerCoil = %d; want 18", p.TurnsPerCoil)
	}
	need := 26 + 1.6
	peak := func(turns float64) float64 {
		return math.Sqrt2 * math.Sqrt(3) * e.VoltsPerRPMPhase / float64(p.TurnsPerCoil) * turns * 300
	}
	if got := peak(float64(p.TurnsPerCoil)); got < need {
		t.Errorf("Build(demo): peak line EMF at 300 rpm = %.3f V; want at least %.1f", got, need)
	}
	if fewer := peak(float64(p.TurnsPerCoil - 1)); fewer >= need {
		t.Errorf("Build(demo): %d turns; one fewer gives %.3f V peak, enough", p.TurnsPerCoil, fewer)
	}
	if math.Abs(e.AtTargetV-(peak(float64(p.TurnsPerCoil))-1.6)) > 1e-9 {
		t.Errorf("Build(demo).EMF.AtTargetV = %.4f; want the peak line EMF less 1.6 V", e.AtTargetV)
	}
	if math.Abs(e.PeakLineAtCutIn-need) > 1e-9 || math.Abs(e.LineRMSAtCutIn-need/math.Sqrt2) > 1e-9 {
		t.Errorf("Build(demo).EMF cut-in line %.4f V rms, peak %.4f V; want %.4f and %.1f", e.LineRMSAtCutIn, e.PeakLineAtCutIn, need/math.Sqrt2, need)
	}
	if r := e.LineRMSAtRated / (e.VoltsPerRPMPhase * math.Sqrt(3) * 500); math.Abs(r-1) > 1e-9 {
		t.Errorf("EMF at 500 rpm / (k·500) = %.6f; want 1 (EMF is proportional to speed)", r)
	}
}

// TestCutInBuiltWinding: the cut-in reported is the built winding's, where
// the peak line EMF √2·k_LL·n reaches V_bus + V_diodes, so n = (V_bus +
// V_diodes)/(√2·k_LL), below the target speed when the turns were rounded up.
// The demo by hand: k_LL = √3·0.0394098 = 0.0682597 V/rpm; n = 27.6/(√2·
// 0.0682597) = 285.9 rpm. With a test coil reading 5.0 V instead of 1.70 V the
// flux is 2.94 times larger and far fewer turns are needed; the rounding then
// moves the cut-in more.
func TestCutInBuiltWinding(t *testing.T) {
	five := strings.Replace(string(job.DemoTOML()), "volts_rms = 1.70", "volts_rms = 5.0", 1)
	cases := []struct {
		name   string
		src    string
		byHand float64 // rpm, 0 where not worked by hand
	}{
		{"demo", string(job.DemoTOML()), 285.9},
		{"demo, test coil 5.0 V", five, 0},
	}
	for _, c := range cases {
		p := mustPlan(t, mustJob(t, c.src))
		e := p.EMF
		kLL := e.LineRMSAtRated / e.RatedSpeedRPM
		want := (26 + 1.6) / (math.Sqrt2 * kLL)
		if math.Abs(e.CutInSpeedRPM-want) > 0.01*want {
			t.Errorf("%s: EMF.CutInSpeedRPM = %.2f; want (V_bus+V_d)/(√2·k_LL) = %.2f", c.name, e.CutInSpeedRPM, want)
		}
		if c.byHand > 0 && math.Abs(e.CutInSpeedRPM-c.byHand) > 0.1 {
			t.Errorf("%s: EMF.CutInSpeedRPM = %.2f; want %.1f worked by hand", c.name, e.CutInSpeedRPM, c.byHand)
		}
		if e.CutInSpeedRPM > 300 {
			t.Errorf("%s: cut-in %.1f rpm is above the 300 rpm target; the turns were rounded the wrong way", c.name, e.CutInSpeedRPM)
		}
		// One turn fewer would cut in above the target.
		fewer := e.CutInSpeedRPM * float64(p.TurnsPerCoil) / float64(p.TurnsPerCoil-1)
		if p.TurnsPerCoil > 1 && fewer <= 300 {
			t.Errorf("%s: %d turns; %d would cut in at %.1f rpm, already within the target", c.name, p.TurnsPerCoil, p.TurnsPerCoil-1, fewer)
		}
	}
}

// TestCopperLossHot: the copper loss is m·I²·R(T) at the working
// temperature, R(T) = R20·(234.5 + T)/254.5 (IEC 60028), T the reference
// temperature of IEC 60034-1 for the thermal class (from memory: 105 (A)
// 75 °C, 130 (B) 95 °C, 155 (F) 115 °C, 180 (H) 135 °C) or the job's own.
// The worked example (R20 = 1.152734 Ω, 3 phases at 1 A) by hand: at 95 °C
// 3·1²·1.152734·329.5/254.5 = 4.477319 W; at 20 °C 3.458202 W.
func TestCopperLossHot(t *testing.T) {
	cases := []struct {
		name  string
		extra string
		tempC float64
		lossW float64 // by hand, 0 where not worked
	}{
		{"class not given: 130 (B)", "", 95, 4.477319},
		{"class 155 (F)", "thermal_class = 155\n", 115, 3 * 1.152734 * 349.5 / 254.5},
		{"class 105 (A)", "thermal_class = 105\n", 75, 3 * 1.152734 * 309.5 / 254.5},
		{"measured 60 °C", "copper_temperature_c = 60\n", 60, 3 * 1.152734 * 294.5 / 254.5},
	}
	for _, c := range cases {
		src := strings.Replace(handJob, "voltage_v = 24\n", "voltage_v = 24\n"+c.extra, 1)
		p := mustPlan(t, mustJob(t, src))
		if p.CopperLossTemperatureC != c.tempC {
			t.Errorf("%s: CopperLossTemperatureC = %g; want %g", c.name, p.CopperLossTemperatureC, c.tempC)
		}
		want := 3 * p.PhaseResistance20C * (234.5 + c.tempC) / 254.5
		if math.Abs(p.CopperLossW-want) > 1e-9*want {
			t.Errorf("%s: CopperLossW = %.6f; want m·I²·R(T) = %.6f", c.name, p.CopperLossW, want)
		}
		if math.Abs(p.CopperLossW-c.lossW) > 2e-5 {
			t.Errorf("%s: CopperLossW = %.6f; want %.6f by hand", c.name, p.CopperLossW, c.lossW)
		}
		if math.Abs(p.CopperLossAmbientW-3*p.PhaseResistance20C) > 1e-9 {
			t.Errorf("%s: CopperLossAmbientW = %.6f; want 3·R20 = %.6f at 20 °C", c.name, p.CopperLossAmbientW, 3*p.PhaseResistance20C)
		}
	}
	// The demo: 6.5 A in each of 3 phases at 95 °C, the ambient 15 °C.
	p := mustPlan(t, job.Demo())
	want := 3 * 6.5 * 6.5 * p.PhaseResistance20C * (234.5 + 95) / 254.5
	if p.CopperLossTemperatureC < 75 || math.Abs(p.CopperLossW-want) > 1e-9*want {
		t.Errorf("Build(demo).CopperLossW = %.4f at %g °C; want %.4f at 95 °C", p.CopperLossW, p.CopperLossTemperatureC, want)
	}
	if r := p.CopperLossW / p.CopperLossAmbientW; math.Abs(r-329.5/249.5) > 1e-9 {
		t.Errorf("Build(demo) hot/ambient copper loss = %.5f; want 329.5/249.5 (95 °C over 15 °C)", r)
	}
}

func TestHVTestVolts(t *testing.T) {
	cases := []struct {
		name   string
		pw, un float64
		want   float64
	}{
		{"small and low voltage: 500 + 2·24", 200, 24, 550},
		{"small and low voltage: 500 + 2·34.1 = 568.2", 250, 34.1, 570},
		{"1 kW: 1000 + 2·48, at least 1500", 1000, 48, 1500},
		{"small power, 230 V: 1000 + 460 → 1500", 500, 230, 1500},
		{"400 V: 1000 + 800", 5000, 400, 1800},
	}
	for _, c := range cases {
		if got := HVTestVolts(c.pw, c.un); got != c.want {
			t.Errorf("%s: HVTestVolts(%g, %g) = %g; want %g", c.name, c.pw, c.un, got, c.want)
		}
	}
}

func TestRefusals(t *testing.T) {
	cases := []struct {
		name     string
		from, to string
		field    string
		contains string
	}{
		{"turns do not fit", "per_coil = 40", "per_coil = 120", "turns.per_coil", "a fill of 0.76, above the 0.71"},
		{"wire wider than opening", "opening_mm = 2", "opening_mm = 0.5", "wire", "wider than the slot opening (0.50 mm)"},
		{"no balanced winding", "poles = 10", "poles = 12", "winding.poles", "nearest feasible"},
		{"paths the layout cannot balance", "poles = 10", "poles = 10\npaths = 3", "winding.paths", "feasible: [1 2]"},
	}
	for _, c := range cases {
		_, err := Build(mustJob(t, strings.Replace(handJob, c.from, c.to, 1)))
		var fe *job.FieldError
		if !errors.As(err, &fe) || fe.Field != c.field || !strings.Contains(err.Error(), c.contains) {
			t.Errorf("%s: Build = %v; want a FieldError on %s containing %q", c.name, err, c.field, c.contains)
			continue
		}
		if fe.Line == 0 {
			t.Errorf("%s: Build error %q has no line", c.name, err)
		}
	}
	if _, err := Build(nil); err == nil {
		t.Errorf("Build(nil) = nil error; want a refusal")
	}
}

func TestWarnings(t *testing.T) {
	p := mustPlan(t, mustJob(t, strings.Replace(handJob, "per_coil = 40", "per_coil = 70", 1)))
	if !hasWarning(p, "beyond the practical 0.40") {
		t.Errorf("Build(70 turns).Warnings = %q; want a fill warning", p.Warnings)
	}
	p = mustPlan(t, mustJob(t, strings.Replace(handJob, "current_a = 1", "current_a = 2.5", 1)))
	if !hasWarning(p, "A/mm² at rated current is beyond") {
		t.Errorf("Build(12.7 A/mm²).Warnings = %q; want a current-density warning", p.Warnings)
	}
}

func hasWarning(p *Plan, s string) bool {
	for _, w := range p.Warnings {
		if strings.Contains(w, s) {
			return true
		}
	}
	return false
}

func TestBuildDoesNotChangeTheJob(t *testing.T) {
	j := &job.Job{}
	*j = *job.Demo()
	j.Winding.Phases, j.Build.SpoolMargin = 0, 0
	if _, err := Build(j); err != nil {
		t.Fatalf("Build(demo without defaults) = %v", err)
	}
	if j.Winding.Phases != 0 || j.Build.SpoolMargin != 0 {
		t.Errorf("Build changed its job: phases %d, margin %g", j.Winding.Phases, j.Build.SpoolMargin)
	}
}

func TestStepJSON(t *testing.T) {
	p := mustPlan(t, job.Demo())
	for _, s := range p.Steps {
		if s.Kind != StepJumper {
			continue
		}
		b, err := json.Marshal(s)
		if err != nil {
			t.Fatal(err)
		}
		got := string(b)
		for _, want := range []string{`"kind":"jumper"`, `"jumper":{"from_tooth":1,"to_tooth":2,"span_teeth":1,"reverses_sense":true,"leaves_slot":24,"enters_slot":1,"slot_pitches":1,"way":"ccw",`, `"index":6`} {
			if !strings.Contains(got, want) {
				t.Errorf("json.Marshal(first jumper step) = %s; want it to contain %s", got, want)
			}
		}
		if strings.Contains(got, "FromTooth") {
			t.Errorf("json.Marshal(jumper step) = %s; Go field names leak", got)
		}
		return
	}
	t.Error("demo plan has no jumper step")
}

// A slot given by its area alone is taken as square for its liner, separator
// and coil build: A = 70 mm², side √70 = 8.36660 mm; lined perimeter
// 2·8.36660 + 8.36660 + (8.36660 − 2) = 31.46640 mm; liner 0.2·31.46640 =
// 6.29328 mm²; separator 0.2·(8.36660 − 0.2) = 1.63332 mm²; usable 62.07340 mm².
func TestAreaOnlySlot(t *testing.T) {
	src := strings.NewReplacer("depth_mm = 10\n", "area_mm2 = 70\n", "width_top_mm = 6\n", "", "width_bottom_mm = 8\n", "").Replace(handJob)
	p := mustPlan(t, mustJob(t, src))
	s := p.Slot
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"DepthMM", s.DepthMM, 8.36660}, {"LinedPerimeterMM", s.LinedPerimeterMM, 31.46640},
		{"LinerAreaMM2", s.LinerAreaMM2, 6.29328}, {"SeparatorAreaMM2", s.SeparatorAreaMM2, 1.63332},
		{"UsableAreaMM2", s.UsableAreaMM2, 62.07340},
	} {
		if math.Abs(c.got-c.want) > 2e-5 {
			t.Errorf("Build(area-only slot).Slot.%s = %.5f; want %.5f", c.name, c.got, c.want)
		}
	}
	if !s.DepthEstimated || !hasWarning(p, "taken as square") {
		t.Errorf("Build(area-only slot): DepthEstimated %v, warnings %q; want the estimate said", s.DepthEstimated, p.Warnings)
	}
}
