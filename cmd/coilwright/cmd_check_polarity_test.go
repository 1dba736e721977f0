package main

import (
	"encoding/json"
	"os"
	"path/filepath"
	"reflect"
	"strconv"
	"strings"
	"testing"

	"coilwright/winding/job"
	"coilwright/winding/journal"
	"coilwright/winding/plan"
)

// polarityFlags writes --polarity flags for every phase of a plan as a compass
// would read it with the coils on the given teeth reversed.
func polarityFlags(p *plan.Plan, reversed ...int) []string {
	flip := map[int]bool{}
	for _, t := range reversed {
		flip[t] = true
	}
	var out []string
	for _, name := range p.Layout.PhaseNames {
		var teeth []string
		for _, tp := range p.PolesOf(name) {
			pole := tp.Pole
			if flip[tp.Tooth] {
				pole = pole.Opposite()
			}
			teeth = append(teeth, strconv.Itoa(tp.Tooth)+string(pole))
		}
		out = append(out, "--polarity", name+"="+strings.Join(teeth, ","))
	}
	return out
}

// The polarity test's "done when", through the command line, for the demo
// and the demo with two parallel paths.
func TestCheckPolarityDoneWhen(t *testing.T) {
	dir := t.TempDir()
	twoPaths := filepath.Join(dir, "two-paths.toml")
	src := strings.Replace(string(job.DemoTOML()), "paths = 1 ", "paths = 2 ", 1)
	if src == string(job.DemoTOML()) {
		t.Fatal("demo job has no 'paths = 1' line to change")
	}
	if err := os.WriteFile(twoPaths, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name string
		job  []string
		p    *plan.Plan
	}{
		{"demo", []string{"--demo"}, mustDemoPlan(t, 1)},
		{"demo, two paths", []string{twoPaths}, mustDemoPlan(t, 2)},
	} {
		base := append([]string{"check"}, c.job...)
		code, m, errs := checkJSON(t, append(base, polarityFlags(c.p)...)...)
		if code != 0 || m["verdict"] != "pass" {
			t.Errorf("%s: check with every pole right = exit %d, %v (%s); want 0, pass", c.name, code, m["verdict"], errs)
		}
		for _, rev := range [][]int{{13}, {2, 17}} {
			code, m, errs := checkJSON(t, append(base, polarityFlags(c.p, rev...)...)...)
			if code != 0 || m["verdict"] != "fail" {
				t.Errorf("%s: teeth %v reversed = exit %d, %v (%s); want 0, fail", c.name, rev, code, m["verdict"], errs)
				continue
			}
			var named []int
			for _, f := range m["findings"].([]any) {
				f := f.(map[string]any)
				if f["severity"] != "fail" {
					continue
				}
				if f["test"] != "polarity" {
					t.Errorf("%s: finding test %v; want polarity", c.name, f["test"])
				}
				if n, ok := f["tooth"].(float64); ok {
					named = append(named, int(n))
				}
				if ts, ok := f["teeth"].([]any); ok {
					for _, n := range ts {
						named = append(named, int(n.(float64)))
					}
				}
			}
			if !reflect.DeepEqual(named, rev) {
				t.Errorf("%s: teeth %v reversed: findings name %v; want exactly %v", c.name, rev, named, rev)
			}
		}
	}
	for _, bad := range []struct{ arg, says string }{
		{"U=1X", `"U=1X"`},
		{"U=3S", "carries phase W"},
		{"Q=1S", "no phase Q"},
		{"U1S", `"U1S"`},
	} {
		code, out, errs := runCLI(t, "check", "--demo", "--polarity", bad.arg)
		if code != 2 || out != "" || !strings.Contains(errs, bad.says) || strings.Count(strings.TrimSpace(errs), "\n") != 0 {
			t.Errorf("check --polarity %s = exit %d, stdout %q, stderr %q; want 2 and one line saying %s", bad.arg, code, out, errs, bad.says)
		}
	}
}

// The readings file takes the poles under [polarity]; a flag replaces the
// file's phase.
func TestCheckPolarityReadingsFile(t *testing.T) {
	dir := t.TempDir()
	file := filepath.Join(dir, "bench.toml")
	os.WriteFile(file, []byte("[polarity]\nU = \"1S 2N 7N 8S 13S 14N 19N 20N\"\nV = \"5S 6N\"\n"), 0o644)
	code, m, errs := checkJSON(t, "check", "--demo", "--readings", file)
	if code != 0 || m["verdict"] != "fail" {
		t.Fatalf("check --readings with tooth 20 reversed = exit %d, %v (%s); want fail", code, m["verdict"], errs)
	}
	code, m, errs = checkJSON(t, "check", "--demo", "--readings", file, "--polarity", "U=1S,2N,7N,8S,13S,14N,19N,20S")
	if code != 0 || m["verdict"] != "warn" {
		t.Errorf("check --readings with U replaced by a right flag = exit %d, %v (%s); want warn (V read in part)", code, m["verdict"], errs)
	}
}

func mustDemoPlan(t *testing.T, paths int) *plan.Plan {
	t.Helper()
	j := job.Demo()
	j.Winding.Paths = paths
	p, err := plan.Build(j)
	if err != nil {
		t.Fatal(err)
	}
	return p
}

// --record keeps the poles in the progress record on the polarity step of
// the phase read, where the bench guide shows them.
func TestCheckPolarityRecord(t *testing.T) {
	rec := filepath.Join(t.TempDir(), "demo.progress")
	p := mustDemoPlan(t, 1)
	args := append([]string{"check", "--demo", "--record", "--progress", rec}, polarityFlags(p, 7)[:2]...)
	if code, _, errs := runCLI(t, args...); code != 0 {
		t.Fatalf("check --polarity --record = exit %d (%s)", code, errs)
	}
	data, err := os.ReadFile(rec)
	if err != nil {
		t.Fatal(err)
	}
	uStep := 0
	for _, s := range p.Steps {
		if s.Test == plan.TestPolarity && len(s.Phases) == 1 && s.Phases[0] == "U" {
			uStep = s.Index
		}
	}
	var found bool
	for _, line := range strings.Split(strings.TrimSpace(string(data)), "\n") {
		var ev journal.Event
		if err := json.Unmarshal([]byte(line), &ev); err != nil {
			t.Fatal(err)
		}
		if ev.Test == plan.TestPolarity {
			found = true
			if ev.Step != uStep || ev.Verdict != "fail" || ev.Readings["tooth_1"] != -1 || ev.Readings["tooth_7"] != -1 || len(ev.Readings) != 8 {
				t.Errorf("polarity event %+v; want step %d, fail, tooth_1 -1 (S), tooth_7 -1 (S, reversed), 8 teeth", ev, uStep)
			}
		}
	}
	if !found {
		t.Errorf("no polarity event in the record:\n%s", data)
	}
}
