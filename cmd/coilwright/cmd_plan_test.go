package main

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/pelletier/go-toml/v2"
)

func TestPlanText(t *testing.T) {
	code, out, errs := runCLI(t, "plan", "--demo")
	if code != 0 {
		t.Fatalf("plan --demo = %d (%s)", code, errs)
	}
	golden(t, "plan", "demo.txt", out)
}

// TestPlanDemoIndependent is the check of issue 3: write the demo with `new`,
// plan it with --json, and recompute the main results from the job file and
// the layout alone, with the sources' values written out here.
func TestPlanDemoIndependent(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "demo.toml")
	if code, _, errs := runCLI(t, "new", "--demo", "-o", path); code != 0 {
		t.Fatalf("new --demo = %d (%s)", code, errs)
	}
	code, out, errs := runCLI(t, "plan", path, "--json")
	if code != 0 {
		t.Fatalf("plan --json = %d (%s)", code, errs)
	}
	var p struct {
		Layout struct {
			Slots int `json:"slots"`
			Coils []struct {
				Tooth     int    `json:"tooth"`
				Direction string `json:"direction"`
			} `json:"coils"`
			Chains []struct {
				Phase   string `json:"phase"`
				Jumpers []struct {
					From int `json:"from_tooth"`
					To   int `json:"to_tooth"`
				} `json:"jumpers"`
			} `json:"chains"`
		} `json:"layout"`
		Connection string `json:"connection"`
		Turns      int    `json:"turns_per_coil"`
		Wire       struct {
			Bare    float64 `json:"bare_diameter_mm"`
			Overall float64 `json:"overall_diameter_mm"`
			Strands int     `json:"strands_in_hand"`
			Area    float64 `json:"copper_area_mm2"`
		} `json:"wire"`
		MLT   float64 `json:"mean_turn_length_mm"`
		Fill  float64 `json:"slot_fill"`
		Paths []struct {
			Phase  string  `json:"phase"`
			Coils  int     `json:"coils"`
			Length float64 `json:"wire_length_m"`
		} `json:"paths"`
		R20   float64 `json:"phase_resistance_20c_ohm"`
		Mass  float64 `json:"copper_mass_kg"`
		Steps []struct {
			Kind string `json:"kind"`
			Coil *struct {
				Tooth int `json:"tooth"`
			} `json:"coil"`
		} `json:"steps"`
		Tests []struct {
			Name, Unit, Source string
			Limit              *float64
		} `json:"tests"`
	}
	if err := json.Unmarshal([]byte(out), &p); err != nil {
		t.Fatalf("plan --json: %v", err)
	}
	var raw map[string]any
	data, _ := os.ReadFile(path)
	if err := toml.Unmarshal(data, &raw); err != nil {
		t.Fatal(err)
	}
	get := func(keys ...string) float64 {
		var v any = raw
		for _, k := range keys {
			v = v.(map[string]any)[k]
		}
		switch x := v.(type) {
		case int64:
			return float64(x)
		case float64:
			return x
		}
		t.Fatalf("%v is %T", keys, v)
		return 0
	}
	d, strands := get("wire", "bare_diameter_mm"), get("wire", "strands_in_hand")
	stack, tooth, liner, sep := get("stator", "stack_length_mm"), get("stator", "tooth_width_mm"), get("stator", "liner_mm"), get("stator", "separator_mm")
	depth, top, bottom, opening := get("stator", "slot", "depth_mm"), get("stator", "slot", "width_top_mm"), get("stator", "slot", "width_bottom_mm"), get("stator", "slot", "opening_mm")
	dia, q := get("stator", "diameter_mm"), get("winding", "slots")
	lead, slack := get("build", "lead_length_mm"), get("build", "jumper_slack_mm")
	n := float64(p.Turns)

	// IEC 60317-0-1 Table 1: 1.000 mm grade 2 is at most 1.094 mm overall.
	const overall = 1.094
	area := strands * math.Pi * d * d / 4
	// Slot trapezoid, liner round walls, bottom and tip undersides, separator across the depth.
	slot := depth * (top + bottom) / 2
	perimeter := 2*math.Hypot(depth, (top-bottom)/2) + bottom + (top - opening)
	usable := slot - liner*perimeter - sep*(depth-liner)
	fill := 2 * n * area / usable
	// Mean turn: tooth grown by the liner on each face, plus π times the coil build.
	build := n * strands * overall * overall / (depth - liner)
	mlt := 2*(stack+2*liner) + 2*(tooth+2*liner) + math.Pi*build
	// Outer rotor: jumpers at mid slot depth, slot to slot. Facing tooth k from
	// outside with the lead end up, slot k is on the right: a cw coil goes down
	// slot k and up slot k-1, a ccw coil down k-1 and up k. A jumper leaves the
	// up slot of one coil and enters the down slot of the next, the shorter way.
	pitch := 2 * math.Pi * (dia/2 - depth/2) / q
	sense := map[int]string{}
	for _, c := range p.Layout.Coils {
		sense[c.Tooth] = c.Direction
	}
	nq := int(q)
	slotOf := func(k int) int { return (k-1+nq)%nq + 1 }
	downUp := func(k int) (int, int) {
		if sense[k] == "cw" {
			return slotOf(k), slotOf(k - 1)
		}
		return slotOf(k - 1), slotOf(k)
	}
	const rho = 1.0 / 58 // IEC 60028, Ω·mm²/m
	const density = 8.89 // g/cm³, IEC 60028 (from memory)

	check := func(name string, got, want, tol float64) {
		t.Helper()
		if math.Abs(got-want) > tol*math.Abs(want) {
			t.Errorf("plan --json %s = %.6g; independent computation %.6g", name, got, want)
		}
	}
	check("wire.overall_diameter_mm", p.Wire.Overall, overall, 1e-9)
	check("wire.copper_area_mm2", p.Wire.Area, area, 1e-9)
	check("slot_fill", p.Fill, fill, 1e-9)
	check("mean_turn_length_mm", p.MLT, mlt, 1e-9)
	var mass, rSum float64
	for i, path := range p.Paths {
		var jumpers float64
		for _, jp := range p.Layout.Chains[i].Jumpers {
			_, leave := downUp(jp.From)
			enter, _ := downUp(jp.To)
			n := ((enter-leave)%nq + nq) % nq
			jumpers += float64(min(n, nq-n))*pitch + slack
		}
		length := (float64(path.Coils)*n*mlt + jumpers) / 1000
		check("paths["+path.Phase+"].wire_length_m", path.Length, length, 1e-9)
		// The meter reads at the ends of the leads: the path and its two
		// leads, R = ρ·L/A (IEC 60028); one path per phase on the demo.
		rSum += rho * (length + 2*lead/1000) / area
		mass += (length + 2*lead/1000) * area * density / 1000
	}
	check("phase_resistance_20c_ohm", p.R20, rSum/3, 1e-9)
	check("copper_mass_kg", p.Mass, mass, 1e-9)

	coilSteps := map[int]bool{}
	for _, s := range p.Steps {
		if s.Kind == "coil" && s.Coil != nil {
			coilSteps[s.Coil.Tooth] = true
		}
	}
	for _, c := range p.Layout.Coils {
		if !coilSteps[c.Tooth] {
			t.Errorf("plan --json: no step for the coil on tooth %d", c.Tooth)
		}
	}
	if len(p.Layout.Coils) != 24 || len(coilSteps) != 24 {
		t.Errorf("plan --json: %d coils, %d coil steps; want 24 each", len(p.Layout.Coils), len(coilSteps))
	}
	if len(p.Tests) < 6 {
		t.Errorf("plan --json: %d tests; want at least 6", len(p.Tests))
	}
	for _, ts := range p.Tests {
		if ts.Source == "" || ts.Unit == "" || ts.Limit == nil {
			t.Errorf("plan --json test %q: limit %v unit %q source %q; want all three", ts.Name, ts.Limit, ts.Unit, ts.Source)
		}
	}
}

func TestPlanJSONContract(t *testing.T) {
	_, out, _ := runCLI(t, "plan", "--demo", "--json")
	var m map[string]json.RawMessage
	if err := json.Unmarshal([]byte(out), &m); err != nil {
		t.Fatal(err)
	}
	for _, k := range []string{"layout", "connection", "turns_per_coil", "wire", "mean_turn_length_mm", "slot_fill",
		"paths", "phase_resistance_20c_ohm", "copper_mass_kg", "steps", "tests"} {
		if _, ok := m[k]; !ok {
			t.Errorf("plan --json lacks %q (README contract)", k)
		}
	}
	var w map[string]any
	_ = json.Unmarshal(m["wire"], &w)
	for _, k := range []string{"bare_diameter_mm", "overall_diameter_mm", "strands_in_hand", "copper_area_mm2"} {
		if _, ok := w[k]; !ok {
			t.Errorf("plan --json wire lacks %q", k)
		}
	}
	var paths []map[string]any
	_ = json.Unmarshal(m["paths"], &paths)
	for _, k := range []string{"phase", "path", "coils", "wire_length_m"} {
		if len(paths) == 0 || paths[0][k] == nil {
			t.Errorf("plan --json paths[0] lacks %q", k)
		}
	}
	var tests []map[string]any
	_ = json.Unmarshal(m["tests"], &tests)
	for _, k := range []string{"name", "limit", "unit", "source"} {
		if len(tests) == 0 || tests[0][k] == nil {
			t.Errorf("plan --json tests[0] lacks %q", k)
		}
	}
}

// TestPlanBrokenFiles: a broken, truncated, mistyped or mis-valued job exits 2
// with one message naming the field and its line.
func TestPlanBrokenFiles(t *testing.T) {
	dir := t.TempDir()
	demo := string(mustRead(t, filepath.Join("..", "..", "testdata", "job", "demo.toml")))
	cases := []struct {
		name, src string
		want      []string
	}{
		{"unknown key", strings.Replace(demo, "slots = 24", "slot_count = 24", 1), []string{"winding.slot_count", ":16:", `unknown key "slot_count"`}},
		{"truncated at a line", demo[:strings.Index(demo, `rotor = "outer"`)], []string{"stator.rotor", "must be"}},
		{"truncated in a value", demo[:strings.Index(demo, `rotor = "outer"`)+11], []string{"(syntax)", ":24:"}},
		{"mistyped value", strings.Replace(demo, "slots = 24", `slots = "24"`, 1), []string{"winding.slots", ":16:", "whole number"}},
		{"mis-valued", strings.Replace(demo, "poles = 28", "poles = 27", 1), []string{"winding.poles = 27", ":17:", "even"}},
		{"no balanced winding", strings.Replace(demo, "poles = 28", "poles = 24", 1), []string{"winding.poles = 24", ":17:", "nearest feasible"}},
		{"turns do not fit", strings.Replace(demo, "volts = 26", "volts = 70", 1), []string{"turns.target", ":52:", "above the"}},
		{"wire wider than opening", strings.Replace(demo, "opening_mm = 3.0", "opening_mm = 1.0", 1), []string{"wire = 1.094 mm overall", "wider than the slot opening"}},
		{"empty", "", []string{"is empty"}},
		{"binary", "\x00\x01\x02[[[", []string{"(syntax)"}},
	}
	for _, c := range cases {
		path := filepath.Join(dir, strings.ReplaceAll(c.name, " ", "_")+".toml")
		if err := os.WriteFile(path, []byte(c.src), 0o644); err != nil {
			t.Fatal(err)
		}
		code, out, errs := runCLI(t, "plan", path)
		if code != 2 || out != "" || strings.Count(strings.TrimSpace(errs), "\n") != 0 {
			t.Errorf("%s: plan = %d, stdout %d bytes, stderr %q; want 2 and one line on stderr", c.name, code, len(out), errs)
		}
		for _, w := range c.want {
			if !strings.Contains(errs, w) {
				t.Errorf("%s: plan stderr %q; want it to contain %q", c.name, errs, w)
			}
		}
	}
	for _, args := range [][]string{{"plan"}, {"plan", "--demo", "x.toml"}, {"plan", filepath.Join(dir, "missing.toml")}, {"plan", "a", "b"}} {
		if code, _, _ := runCLI(t, args...); code != 2 {
			t.Errorf("%v = %d; want 2", args, code)
		}
	}
}

func mustRead(t *testing.T, path string) []byte {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// TestPlanMachineJSON reads the machine figures of the demo as a script
// would: the inductance in a plausible range, K_t = m·E_ph/ω_m, the tooth
// flux density, the losses by kind with the hot copper loss of the plan,
// the efficiency from them, and a charging curve that starts at zero.
func TestPlanMachineJSON(t *testing.T) {
	code, out, errs := runCLI(t, "plan", "--demo", "--json")
	if code != 0 {
		t.Fatalf("plan --demo --json = %d (%s)", code, errs)
	}
	var p struct {
		CopperLossW float64 `json:"copper_loss_w"`
		CopperTempC float64 `json:"copper_loss_temperature_c"`
		RatedPowerW float64 `json:"rated_power_w"`
		EMF         struct {
			Phase float64 `json:"phase_rms_at_rated_v"`
			Speed float64 `json:"rated_speed_rpm"`
			CutIn float64 `json:"cut_in_speed_rpm"`
		} `json:"emf"`
		Machine struct {
			L      float64            `json:"phase_inductance_mh"`
			Kt     float64            `json:"torque_constant_nm_per_a"`
			Bt     float64            `json:"tooth_flux_density_t"`
			Losses map[string]float64 `json:"losses_w"`
			Eff    float64            `json:"efficiency"`
			Curve  []struct {
				Speed float64 `json:"speed_rpm"`
				Idc   float64 `json:"dc_current_a"`
				P     float64 `json:"power_w"`
			} `json:"load_curve"`
		} `json:"machine"`
	}
	if err := json.Unmarshal([]byte(out), &p); err != nil {
		t.Fatal(err)
	}
	m := p.Machine
	wm := 2 * math.Pi * p.EMF.Speed / 60
	total := m.Losses["copper"] + m.Losses["iron"] + m.Losses["mechanical"]
	switch {
	case m.L < 0.2 || m.L > 3:
		t.Errorf("machine.phase_inductance_mh = %g; want 0.2 to 3", m.L)
	case math.Abs(m.Kt-3*p.EMF.Phase/wm) > 0.01*m.Kt:
		t.Errorf("machine.torque_constant_nm_per_a = %g; want m·E_ph/ω_m = %g", m.Kt, 3*p.EMF.Phase/wm)
	case m.Bt < 0.8 || m.Bt > 1.9:
		t.Errorf("machine.tooth_flux_density_t = %g; want 0.8 to 1.9", m.Bt)
	case m.Losses["iron"] <= 0 || m.Losses["copper"] != p.CopperLossW || p.CopperTempC < 75:
		t.Errorf("machine.losses_w = %v; want positive iron and copper = copper_loss_w %g at %g °C (≥ 75)", m.Losses, p.CopperLossW, p.CopperTempC)
	case math.Abs(m.Eff-p.RatedPowerW/(p.RatedPowerW+total)) > 0.01:
		t.Errorf("machine.efficiency = %g; want P/(P + Σ losses) = %g", m.Eff, p.RatedPowerW/(p.RatedPowerW+total))
	case len(m.Curve) == 0 || m.Curve[0].Speed >= p.EMF.CutIn || m.Curve[0].Idc != 0:
		t.Errorf("machine.load_curve starts %v; want zero below the cut-in %g rpm", m.Curve, p.EMF.CutIn)
	}
}
