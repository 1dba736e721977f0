package verify_test

import (
	"errors"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"coilwright/winding/verify"
)

const fileDir = "../../testdata/verify"

func TestParseReadings(t *testing.T) {
	cases := []struct {
		file     string
		wantErr  bool
		haveTemp bool
		check    func(verify.Readings) bool
	}{
		{"full.toml", false, true, func(r verify.Readings) bool {
			return r.TempC == 22.5 && r.UV == 0.2861 && r.FourWire && r.Insulation.IR10MOhm == 2100 &&
				r.Withstand.Passed && r.EMF.RPM == 300
		}},
		{"per-phase-open.toml", false, true, func(r verify.Readings) bool {
			return len(r.PerPhase) == 3 && math.IsInf(r.PerPhase[2], 1) && r.LeadOhm == 0.012
		}},
		{"unknown-key.toml", true, false, nil},
		{"bad-type.toml", true, false, nil},
	}
	for _, c := range cases {
		data, err := os.ReadFile(filepath.Join(fileDir, c.file))
		if err != nil {
			t.Fatal(err)
		}
		r, haveTemp, err := verify.ParseReadings(data)
		var fe *verify.FileError
		if c.wantErr {
			if !errors.As(err, &fe) {
				t.Errorf("ParseReadings(%s) err = %v; want a FileError", c.file, err)
			}
			continue
		}
		if err != nil || haveTemp != c.haveTemp || !c.check(r) {
			t.Errorf("ParseReadings(%s) = %+v, %v, %v; want the file's values", c.file, r, haveTemp, err)
		}
	}
}

func FuzzParseReadings(f *testing.F) {
	entries, err := os.ReadDir(fileDir)
	if err != nil {
		f.Fatal(err)
	}
	for _, e := range entries {
		data, err := os.ReadFile(filepath.Join(fileDir, e.Name()))
		if err != nil {
			f.Fatal(err)
		}
		f.Add(data)
	}
	p := demoPlan(f)
	f.Fuzz(func(t *testing.T, data []byte) {
		r, _, err := verify.ParseReadings(data)
		if err != nil {
			return
		}
		// Whatever parses is either refused as input or judged without panic.
		rep, err := verify.Check(p, r)
		if err == nil && rep.Verdict == "" {
			t.Fatalf("Check(%+v) gave no verdict", r)
		}
	})
}

// An open circuit is written as the meter shows it, OL (or open), in the
// file as on the command line; anything else that is not a number is refused
// naming the file's own key.
func TestParseReadingsOL(t *testing.T) {
	r, _, err := verify.ParseReadings([]byte("temp = 20\nuv = 0.29\nvw = \"OL\"\nwu = 0.29\nper_phase = [0.14, \"open\", 0.14]\n"))
	if err != nil || !math.IsInf(r.VW, 1) || len(r.PerPhase) != 3 || !math.IsInf(r.PerPhase[1], 1) || r.UV != 0.29 {
		t.Errorf("ParseReadings(vw = \"OL\", per_phase open) = %+v, %v; want vw and per_phase[2] open", r, err)
	}
	_, _, err = verify.ParseReadings([]byte("uv = \"high\"\n"))
	var fe *verify.FileError
	if !errors.As(err, &fe) || !strings.Contains(fe.Reason, `uv = "high"`) || !strings.Contains(fe.Reason, "OL") {
		t.Errorf("ParseReadings(uv = \"high\") err = %v; want a FileError naming uv and offering OL", err)
	}
}

func TestFileKey(t *testing.T) {
	for field, want := range map[string]string{
		"hv-volts": "[withstand] volts", "ir-volts": "[insulation] volts", "ir1": "[insulation] ir1",
		"emf-vw": "[emf] vw", "rpm": "[emf] rpm", "lead-ohm": "lead_ohm", "per-phase U": "per_phase U", "uv": "uv", "temp": "temp",
	} {
		if got := verify.FileKey(field); got != want {
			t.Errorf("FileKey(%q) = %q; want %q", field, got, want)
		}
	}
}

// TestParseReadingsErrorsNameFileKeys: a measurements file's errors name the
// key as the file writes it, its table and line, and what it takes; never
// the program's own field names or Go types.
func TestParseReadingsErrorsNameFileKeys(t *testing.T) {
	cases := []struct {
		name, file string
		line       int
		want       []string
	}{
		{"unknown at top", "temp = 20\nuvx = 0.3\n", 2, []string{`unknown key "uvx" at the top of the file`, "uv, vw, wu"}},
		{"unknown in table", "[insulation]\nir1 = 100\nir_10 = 300\n", 3, []string{`unknown key "ir_10" in [insulation]`, "ir1, ir10, volts"}},
		{"text for a number", "temp = \"warm\"\n", 1, []string{"temp takes the winding temperature in °C as a number"}},
		{"text in a table", "[emf]\nuv = 30\nrpm = \"fast\"\n", 3, []string{"[emf] rpm takes the speed in rpm as a number"}},
		{"number for true or false", "four_wire = 1\n", 1, []string{"four_wire takes true or false"}},
	}
	for _, c := range cases {
		_, _, err := verify.ParseReadings([]byte(c.file))
		var fe *verify.FileError
		if !errors.As(err, &fe) {
			t.Errorf("%s: err = %v; want a FileError", c.name, err)
			continue
		}
		if fe.Line != c.line {
			t.Errorf("%s: line %d; want %d", c.name, fe.Line, c.line)
		}
		msg := fe.Error()
		for _, w := range c.want {
			if !strings.Contains(msg, w) {
				t.Errorf("%s: %q; want it to say %q", c.name, msg, w)
			}
		}
		for _, bad := range []string{"struct field", "readingsFile", "float64", "unknown field"} {
			if strings.Contains(msg, bad) {
				t.Errorf("%s: %q speaks of the program's insides (%q)", c.name, msg, bad)
			}
		}
	}
}
