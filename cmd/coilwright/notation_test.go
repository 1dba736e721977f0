package main

import (
	"encoding/json"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"coilwright/winding/sensetest"
)

// The developed line of `layout` gives every tooth its signed token ("+U" a
// coil of phase U wound cw, "-U" ccw, "0" no coil), and the tokens agree
// tooth by tooth with coils[] of `layout --json` and with its sequence array.
func TestDevelopedTokensMatchCoils(t *testing.T) {
	for _, args := range [][]string{
		{"--slots", "12", "--poles", "10"},
		{"--slots", "9", "--poles", "8"},
		{"--slots", "24", "--poles", "22", "--layers", "1"},
		{"--slots", "20", "--poles", "18", "--phases", "5"},
	} {
		code, text, errOut := runCLI(t, append([]string{"layout"}, args...)...)
		if code != 0 {
			t.Fatalf("layout %v: exit %d, %s", args, code, errOut)
		}
		if bad := sensetest.CaseCoded(text); len(bad) > 0 {
			t.Errorf("layout %v writes sense by letter case: %q", args, bad)
		}
		lines := strings.Split(text, "\n")
		i := slices.IndexFunc(lines, func(s string) bool { return strings.HasPrefix(s, "Developed") })
		if i < 0 || i+1 >= len(lines) {
			t.Fatalf("layout %v has no developed line:\n%s", args, text)
		}
		got := strings.Fields(lines[i+1])

		code, out, errOut := runCLI(t, append([]string{"layout", "--json"}, args...)...)
		if code != 0 {
			t.Fatalf("layout --json %v: exit %d, %s", args, code, errOut)
		}
		var l struct {
			Slots    int      `json:"slots"`
			Sequence []string `json:"sequence"`
			Coils    []struct {
				Tooth     int    `json:"tooth"`
				Phase     string `json:"phase"`
				Direction string `json:"direction"`
			} `json:"coils"`
		}
		if err := json.Unmarshal([]byte(out), &l); err != nil {
			t.Fatal(err)
		}
		want := make([]string, l.Slots)
		for k := range want {
			want[k] = "0"
		}
		for _, c := range l.Coils {
			sign := map[string]string{"cw": "+", "ccw": "-"}[c.Direction]
			if sign == "" || c.Tooth < 1 || c.Tooth > l.Slots {
				t.Fatalf("layout --json %v: coil %+v", args, c)
			}
			want[c.Tooth-1] = sign + c.Phase
		}
		if !slices.Equal(got, want) {
			t.Errorf("layout %v developed line\n  %v\nwant (from coils[])\n  %v", args, got, want)
		}
		if !slices.Equal(l.Sequence, want) {
			t.Errorf("layout --json %v sequence %q; want %q", args, l.Sequence, want)
		}
	}
}

// No text of `plan` writes a coil's sense by letter case, for the demo and
// every loadable job under testdata/job (single layer and delta among them).
func TestPlanTextWritesSenseBySign(t *testing.T) {
	runs := [][]string{{"plan", "--demo"}}
	for _, f := range []string{"demo.toml", "single_layer_perpole.toml", "delta_paths_airgap.toml", "awg_area_slot.toml"} {
		runs = append(runs, []string{"plan", filepath.Join("..", "..", "testdata", "job", f)})
	}
	for _, args := range runs {
		code, out, errOut := runCLI(t, args...)
		if code != 0 {
			t.Fatalf("%v: exit %d, %s", args, code, errOut)
		}
		if !strings.Contains(out, "+U") {
			t.Errorf("%v: no signed token +U in the plan text", args)
		}
		if bad := sensetest.CaseCoded(out); len(bad) > 0 {
			t.Errorf("%v writes sense by letter case: %q", args, bad)
		}
	}
}
