package main

import (
	"encoding/json"
	"math"
	"strings"
	"testing"
)

func TestLayoutText(t *testing.T) {
	for _, c := range []struct {
		name string
		args []string
	}{
		{"layout-12-10.txt", []string{"layout", "--slots", "12", "--poles", "10"}},
		{"layout-24-28-paths2.txt", []string{"layout", "--slots", "24", "--poles", "28", "--paths", "2"}},
		{"layout-9-8.txt", []string{"layout", "--slots", "9", "--poles", "8"}},
	} {
		code, out, errOut := runCLI(t, c.args...)
		if code != 0 {
			t.Fatalf("%v: exit %d, stderr %q", c.args, code, errOut)
		}
		golden(t, "cli", c.name, out)
	}
}

// The JSON contract of the README: every listed field present, with values an
// independent computation agrees with (12/10: Libert & Soulard 2004, from
// memory: k_w 0.933; t = gcd(12,5) = 1; LCM(12,10) = 60; 2pQ/LCM = 2).
func TestLayoutJSONContract(t *testing.T) {
	code, out, errOut := runCLI(t, "layout", "--slots", "12", "--poles", "10", "--paths", "2", "--json")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var m map[string]any
	if err := json.Unmarshal([]byte(out), &m); err != nil {
		t.Fatal(err)
	}
	for _, k := range []string{"slots", "poles", "phases", "layers", "phase_names", "coils_per_phase", "periodicity", "lcm",
		"cogging_factor", "radial_force_balanced", "winding_factor", "harmonics", "parallel_paths", "paths", "coils"} {
		if _, ok := m[k]; !ok {
			t.Errorf("layout --json lacks %q", k)
		}
	}
	if m["periodicity"].(float64) != 1 || m["lcm"].(float64) != 60 || m["cogging_factor"].(float64) != 2 || m["paths"].(float64) != 2 {
		t.Errorf("layout --json figures = t %v lcm %v cogging %v paths %v; want 1 60 2 2", m["periodicity"], m["lcm"], m["cogging_factor"], m["paths"])
	}
	if kw := m["winding_factor"].(float64); math.Abs(kw-0.933) > 0.0005 {
		t.Errorf("winding_factor = %v; want 0.933", kw)
	}
	if h := m["harmonics"].([]any); len(h) < 36 {
		t.Errorf("%d harmonics; want at least 3*max(Q,p) = 36", len(h))
	}
	coils := m["coils"].([]any)
	first := coils[0].(map[string]any)
	if len(coils) != 12 || first["tooth"].(float64) != 1 || first["phase"] != "U" || first["direction"] != "cw" || first["path"].(float64) != 1 || first["position"].(float64) != 1 {
		t.Errorf("coils[0] = %v of %d; want tooth 1 U cw path 1 position 1 of 12", first, len(coils))
	}
}

func TestLayoutRefusals(t *testing.T) {
	cases := []struct {
		args []string
		want string // in the message
	}{
		{[]string{"layout", "--slots", "10", "--poles", "8"}, "slots = 10"},
		{[]string{"layout", "--slots", "12", "--poles", "12"}, "no balanced"},
		{[]string{"layout", "--slots", "9", "--poles", "8", "--layers", "1"}, "even slot count"},
		{[]string{"layout", "--slots", "12", "--poles", "9"}, "2p must be even"},
		{[]string{"layout", "--slots", "0", "--poles", "10"}, "slots = 0"},
		{[]string{"layout", "--slots", "-3", "--poles", "10"}, "slots = -3"},
		{[]string{"layout", "--slots", "twelve", "--poles", "10"}, "twelve"},
		{[]string{"layout", "--poles", "10"}, "--slots is required"},
		{[]string{"layout", "--slots", "12", "--poles", "10", "--paths", "3"}, "feasible: [1 2]"},
		// A zero is refused, not read as the default.
		{[]string{"layout", "--slots", "12", "--poles", "10", "--phases", "0"}, "--phases 0"},
		{[]string{"layout", "--slots", "12", "--poles", "10", "--layers", "0"}, "--layers 0"},
		{[]string{"layout", "--slots", "12", "--poles", "10", "--paths", "0"}, "--paths 0"},
		{[]string{"pairs", "--max-slots", "12"}, "--max-poles is required"},
		{[]string{"pairs", "--max-slots", "12", "--max-poles", "12", "--layers", "3"}, "--layers"},
		{[]string{"pairs", "--max-slots", "0", "--max-poles", "12"}, "max-slots"},
		{[]string{"layuot", "--slots", "12"}, "unknown command"},
		{[]string{"layout", "--slots", "12", "--poles", "10", "--colour"}, "unknown flag"},
	}
	for _, c := range cases {
		code, out, errOut := runCLI(t, c.args...)
		if code != 2 || out != "" || !strings.Contains(errOut, c.want) || strings.Count(strings.TrimSpace(errOut), "\n") != 0 {
			t.Errorf("%v: exit %d, stdout %q, stderr %q; want exit 2, one line on stderr containing %q", c.args, code, out, errOut, c.want)
		}
	}
}
