package job

import (
	"bytes"
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

func TestDemoAndTemplateParse(t *testing.T) {
	for name, data := range map[string][]byte{"demo": DemoTOML(), "template": TemplateTOML()} {
		j, err := Parse(data, name)
		if err != nil {
			t.Errorf("Parse(%s) = %v; want no error", name, err)
			continue
		}
		if j.Name == "" {
			t.Errorf("Parse(%s).Name is empty", name)
		}
	}
	d := Demo()
	if d.Winding.Slots != 24 || d.Winding.Poles != 28 || d.Stator.Rotor != RotorOuter || d.Turns.Target != TargetDCBus || d.Flux.TestCoil == nil {
		t.Errorf("Demo() = %+v; want the 24/28 outer-rotor charger solved from a test coil", d)
	}
	if want := time.Date(2026, 11, 20, 0, 0, 0, 0, time.UTC); !d.Date.Equal(want) || d.Date.Location() != time.UTC {
		t.Errorf("Demo().Date = %v; want %v", d.Date, want)
	}
	seed, err := os.ReadFile(filepath.Join("..", "..", "testdata", "job", "demo.toml"))
	if err != nil || !bytes.Equal(seed, DemoTOML()) {
		t.Errorf("testdata/job/demo.toml differs from the embedded demo (err %v); copy winding/job/demo.toml there", err)
	}
}

func TestDefaults(t *testing.T) {
	j, err := Parse([]byte(minimal), "min")
	if err != nil {
		t.Fatalf("Parse(minimal) = %v", err)
	}
	w := j.Winding
	if w.Phases != 3 || w.Layers != 2 || w.Paths != 1 || w.Connection != "star" {
		t.Errorf("defaults of winding = %+v; want 3 phases, 2 layers, 1 path, star", w)
	}
	if j.Wire.StrandsInHand != 1 || j.Build.SpoolMargin != DefaultSpoolMargin || j.Build.PracticalFill != DefaultPracticalFill || j.Build.Ambient() != 20 {
		t.Errorf("defaults of wire/build = %+v %+v; want 1 strand, margin 0.10, fill 0.40, 20 °C", j.Wire, j.Build)
	}
}

// minimal is the smallest valid job: turns given, rated voltage given.
const minimal = `name = "min"
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
`

// TestRefusals mutates the minimal job and checks that each refusal names the
// field and, where the key is written, its line.
func TestRefusals(t *testing.T) {
	cases := []struct {
		name     string
		from, to string // replace in minimal; from "" appends to
		field    string
		line     int // 0: not checked
		contains string
		unsup    bool
	}{
		{"unknown key at top", "name = \"min\"", "name = \"min\"\ncolour = \"red\"", "colour", 2, `unknown key "colour" at the top level`, false},
		{"unknown key in table", "poles = 10", "pole = 10", "winding.pole", 4, "known keys there: connection, layers, paths, phases, poles, slots", false},
		{"unknown key in sub-table", "opening_mm = 2", "openning_mm = 2", "stator.slot.openning_mm", 16, "unknown key", false},
		{"string for a number", "slots = 12", `slots = "12"`, "winding.slots", 3, "a whole number is needed", false},
		{"float for an integer", "slots = 12", "slots = 12.5", "winding.slots", 3, "a whole number is needed", false},
		{"number for text", `rotor = "inner"`, "rotor = 1", "stator.rotor", 6, "text in double quotes", false},
		{"unterminated string", `rotor = "inner"`, `rotor = "inner`, "(syntax)", 6, "not valid TOML", false},
		{"date in quotes", "name = \"min\"", "name = \"min\"\ndate = \"2026-01-01\"", "date", 2, "TOML date", false},
		{"missing name", "name = \"min\"", "", "name", 0, "is missing", false},
		{"zero slots", "slots = 12", "slots = 0", "winding.slots", 3, "1 to 1200", false},
		{"odd poles", "poles = 10", "poles = 11", "winding.poles", 4, "even", false},
		{"even phases", "poles = 10", "poles = 10\nphases = 4", "winding.phases", 5, "odd", false},
		{"three layers", "poles = 10", "poles = 10\nlayers = 3", "winding.layers", 5, "1 (alternate", false},
		{"bad connection", "poles = 10", "poles = 10\nconnection = \"zigzag\"", "winding.connection", 5, `"star" or "delta"`, false},
		{"bad rotor", `rotor = "inner"`, `rotor = "side"`, "stator.rotor", 6, `"inner"`, false},
		{"negative diameter", "diameter_mm = 60", "diameter_mm = -60", "stator.diameter_mm", 7, "more than 0", false},
		{"tooth wider than pitch", "tooth_width_mm = 6", "tooth_width_mm = 16", "stator.tooth_width_mm", 9, "tooth pitch", false},
		{"liner too thick", "liner_mm = 0.2", "liner_mm = 2.5", "stator.liner_mm", 10, "between 0 and 2", false},
		{"area and shape both", "depth_mm = 10", "depth_mm = 10\narea_mm2 = 70", "stator.slot.area_mm2", 14, "either the slot area or its shape", false},
		{"opening wider than slot", "opening_mm = 2", "opening_mm = 7", "stator.slot.opening_mm", 16, "wider than the slot", false},
		{"no wire size", "bare_diameter_mm = 0.5", "", "wire", 17, "size is missing", false},
		{"awg and diameter", "bare_diameter_mm = 0.5", "bare_diameter_mm = 0.5\nawg = 24", "wire.awg", 19, "not both", false},
		{"awg out of range", "bare_diameter_mm = 0.5", "awg = 70", "wire.awg", 18, "ASTM B258", false},
		{"grade 3", "grade = 2", "grade = 3", "wire.grade", 19, "1 or 2", false},
		{"grade off the table", "bare_diameter_mm = 0.5", "bare_diameter_mm = 3", "wire.grade", 19, "enamel table", false},
		{"overall below bare", "grade = 2", "overall_diameter_mm = 0.4", "wire.overall_diameter_mm", 19, "more than the bare", false},
		{"no turns", "per_coil = 40", "", "turns", 20, "neither the turns nor a target", false},
		{"turns and target", "per_coil = 40", "per_coil = 40\ntarget = \"dc_bus\"", "turns.target", 22, "not both", false},
		{"bad target", "per_coil = 40", "target = \"ac\"", "turns.target", 21, `"phase_emf"`, false},
		{"target without flux", "per_coil = 40", "target = \"line_emf\"\nvolts = 24\nspeed_rpm = 1000", "flux", 0, "no flux source", false},
		{"two flux sources", "per_coil = 40", "per_coil = 40\n[flux]\nper_pole_wb = 1e-4\nair_gap_tesla = 0.8\nmagnet_arc = 0.8", "flux", 22, "one flux source", false},
		{"magnet arc above 1", "per_coil = 40", "per_coil = 40\n[flux]\nair_gap_tesla = 0.8\nmagnet_arc = 1.5", "flux.magnet_arc", 24, "at most 1", false},
		{"test coil without turns", "per_coil = 40", "per_coil = 40\n[flux.test_coil]\nspeed_rpm = 100\nvolts_rms = 1", "flux.test_coil.turns", 22, "at least 1", false},
		{"dc bus on five phases", "poles = 10", "poles = 10\nphases = 5", "turns.target", 0, "three-phase", true},
		{"no current", "current_a = 1", "", "rating.current_a", 0, "missing", false},
		{"thermal class without a reference temperature", "current_a = 1", "current_a = 1\nthermal_class = 120", "rating.thermal_class", 24, "105, 130, 155 or 180", false},
		{"negative air gap", "lead_length_mm = 250", "lead_length_mm = 250\n[machine]\nair_gap_mm = -1", "machine.air_gap_mm", 28, "more than 0", false},
		{"stacking factor above 1", "lead_length_mm = 250", "lead_length_mm = 250\n[machine]\nstacking_factor = 1.2", "machine.stacking_factor", 28, "between 0.5 and 1", false},
		{"operation neither", "lead_length_mm = 250", "lead_length_mm = 250\n[machine]\noperation = \"pump\"", "machine.operation", 28, `"generator" or "motor"`, false},
		{"copper hotter than any class", "current_a = 1", "current_a = 1\ncopper_temperature_c = 400", "rating.copper_temperature_c", 24, "-40 and 250", false},
		{"fill beyond range", "lead_length_mm = 250", "lead_length_mm = 250\npractical_fill = 0.9", "build.practical_fill", 27, "0.30 to 0.45", false},
		{"ambient too hot", "lead_length_mm = 250", "lead_length_mm = 250\nambient_c = 400", "build.ambient_c", 27, "-40 and 150", false},
		{"no lead", "lead_length_mm = 250", "", "build.lead_length_mm", 0, "missing", false},
		{"duplicate table", "[build]", "[winding]\nslots = 3\n[build]", "winding", 25, "already exists", false},
	}
	for _, c := range cases {
		src := strings.Replace(minimal, c.from, c.to, 1)
		if c.name == "dc bus on five phases" {
			src = strings.Replace(src, "per_coil = 40", "target = \"dc_bus\"\nvolts = 24\nspeed_rpm = 100\n[flux]\nper_pole_wb = 1e-4", 1)
		}
		_, err := Parse([]byte(src), "job.toml")
		var fe *FieldError
		if !errors.As(err, &fe) {
			t.Errorf("%s: Parse = %v; want a *FieldError", c.name, err)
			continue
		}
		if fe.Field != c.field {
			t.Errorf("%s: Parse error field = %q; want %q (%v)", c.name, fe.Field, c.field, err)
		}
		if c.line != 0 && fe.Line != c.line {
			t.Errorf("%s: Parse error line = %d; want %d (%v)", c.name, fe.Line, c.line, err)
		}
		if !strings.Contains(err.Error(), c.contains) {
			t.Errorf("%s: Parse error = %q; want it to contain %q", c.name, err, c.contains)
		}
		if !strings.HasPrefix(err.Error(), "job: job.toml") {
			t.Errorf("%s: Parse error = %q; want the prefix \"job: job.toml\"", c.name, err)
		}
		want := ErrInvalid
		if c.unsup {
			want = ErrUnsupported
		}
		if !errors.Is(err, want) {
			t.Errorf("%s: errors.Is(%v, %v) = false", c.name, err, want)
		}
	}
}

func TestEmptyAndLarge(t *testing.T) {
	for name, data := range map[string][]byte{
		"empty":      nil,
		"blank":      []byte("  \n\n# only a comment\n"[:4]),
		"too large":  bytes.Repeat([]byte("#"), MaxFileSize+1),
		"only names": []byte("name = \"x\"\n"),
	} {
		if _, err := Parse(data, name); err == nil {
			t.Errorf("Parse(%s) = nil error; want a refusal", name)
		}
	}
}

func TestLoad(t *testing.T) {
	dir := t.TempDir()
	if _, err := Load(filepath.Join(dir, "none.toml")); err == nil || !strings.Contains(err.Error(), "cannot read") {
		t.Errorf("Load(missing) = %v; want a cannot-read error", err)
	}
	if _, err := Load(dir); err == nil || !strings.Contains(err.Error(), "directory") {
		t.Errorf("Load(dir) = %v; want a directory error", err)
	}
	path := filepath.Join(dir, "demo.toml")
	if err := os.WriteFile(path, DemoTOML(), 0o644); err != nil {
		t.Fatal(err)
	}
	j, err := Load(path)
	if err != nil || j.Name != Demo().Name {
		t.Errorf("Load(demo) = %v, %v; want the demo", j, err)
	}
}

func TestPositions(t *testing.T) {
	src := "name = \"x\"\n[stator]\n  rotor = \"inner\"\n[stator.slot]\nopening_mm = 2\n[flux]\ntest_coil = { turns = 20, speed_rpm = 300 }\n"
	pos := positions([]byte(src))
	cases := []struct {
		key  string
		want Pos
	}{
		{"name", Pos{1, 1}},
		{"stator", Pos{2, 1}},
		{"stator.rotor", Pos{3, 3}},
		{"stator.slot.opening_mm", Pos{5, 1}},
		{"flux.test_coil", Pos{7, 1}},
		{"flux.test_coil.turns", Pos{7, 15}},
		{"flux.test_coil.speed_rpm", Pos{7, 27}},
	}
	for _, c := range cases {
		if got := pos[c.key]; got != c.want {
			t.Errorf("positions()[%q] = %v; want %v", c.key, got, c.want)
		}
	}
}

func TestFailWithoutParse(t *testing.T) {
	var j Job
	e := j.Fail("winding.slots", "0", "is zero", "")
	if e.Line != 0 || e.Error() != "job: winding.slots = 0: is zero" {
		t.Errorf("Fail on a Job built in code = %q line %d; want no position", e.Error(), e.Line)
	}
}

// A job file saved with a UTF-8 byte-order mark (some editors write one) is
// read as if it had none, positions unchanged; UTF-16 is refused saying so.
func TestByteOrderMark(t *testing.T) {
	plain, err := Parse(TemplateTOML(), "plain")
	if err != nil {
		t.Fatal(err)
	}
	j, err := Parse(append([]byte("\xef\xbb\xbf"), TemplateTOML()...), "bom")
	if err != nil {
		t.Fatalf("Parse(template with a UTF-8 BOM) = %v; want it read", err)
	}
	if j.Winding != plain.Winding || j.Name != plain.Name {
		t.Errorf("Parse(template with a BOM) = %+v; want the template %+v", j.Winding, plain.Winding)
	}
	_, err = Parse([]byte("\xff\xfen\x00a\x00"), "utf16")
	var fe *FieldError
	if !errors.As(err, &fe) || !strings.Contains(fe.Reason, "UTF-16") {
		t.Errorf("Parse(UTF-16) = %v; want a refusal that says UTF-16", err)
	}
}
