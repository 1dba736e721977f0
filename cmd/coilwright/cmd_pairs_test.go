package main

import (
	"bytes"
	"encoding/json"
	"math"
	"testing"

	"coilwright/winding"
)

func gcdTest(a, b int) int {
	for b != 0 {
		a, b = b, a%b
	}
	return a
}

// pairs over Q, 2p <= 120 lists exactly the feasible set: by the balance
// condition of Bianchi et al. (IEEE Trans. Ind. Appl. 42(4), 2006) applied to
// the wound teeth Q' (Q, or Q/2 for one layer): Q'/(3 gcd(Q', p)) whole.
func TestPairsFeasibleSet(t *testing.T) {
	code, out, errOut := runCLI(t, "pairs", "--max-slots", "120", "--max-poles", "120", "--json")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var ps []struct {
		Slots, Poles, Layers, Phases int
		WindingFactor                float64 `json:"winding_factor"`
		CoggingFactor                int     `json:"cogging_factor"`
		LCM                          int     `json:"lcm"`
	}
	if err := json.Unmarshal([]byte(out), &ps); err != nil {
		t.Fatal(err)
	}
	got := map[[3]int]bool{}
	for i, p := range ps {
		got[[3]int{p.Slots, p.Poles, p.Layers}] = true
		if i > 0 && p.WindingFactor > ps[i-1].WindingFactor+1e-9 {
			t.Errorf("pairs not ranked: %d/%d (%.4f) after %.4f", p.Slots, p.Poles, p.WindingFactor, ps[i-1].WindingFactor)
		}
		if p.CoggingFactor != gcdTest(p.Slots, p.Poles) || p.LCM != p.Slots*p.Poles/gcdTest(p.Slots, p.Poles) {
			t.Errorf("%d/%d: cogging %d lcm %d", p.Slots, p.Poles, p.CoggingFactor, p.LCM)
		}
	}
	n := 0
	for layers := 1; layers <= 2; layers++ {
		for q := 1; q <= 120; q++ {
			for poles := 2; poles <= 120; poles += 2 {
				qq := q
				if layers == 1 {
					if q%2 != 0 {
						continue
					}
					qq = q / 2
				}
				want := qq%3 == 0 && (qq/gcdTest(qq, poles/2))%3 == 0
				if want {
					n++
				}
				if got[[3]int{q, poles, layers}] != want {
					t.Errorf("pairs: %d/%d %d layers listed %v; want %v", q, poles, layers, !want, want)
				}
			}
		}
	}
	if n != len(ps) {
		t.Errorf("pairs lists %d; want %d", len(ps), n)
	}
	if math.Abs(ps[0].WindingFactor-1) > 0.05 {
		t.Errorf("best pair %v", ps[0])
	}
}

func TestPairsFilters(t *testing.T) {
	code, out, _ := runCLI(t, "pairs", "--max-slots", "36", "--max-poles", "40", "--layers", "2", "--balanced-only", "--min-winding-factor", "0.93", "--json")
	if code != 0 {
		t.Fatal(code)
	}
	var ps []map[string]any
	if err := json.Unmarshal([]byte(out), &ps); err != nil {
		t.Fatal(err)
	}
	if len(ps) == 0 {
		t.Fatal("no pairs")
	}
	for _, p := range ps {
		if p["layers"].(float64) != 2 || p["radial_force_balanced"] != true || p["winding_factor"].(float64) < 0.93 {
			t.Errorf("filtered pair %v breaks a filter", p)
		}
		for _, k := range []string{"slots", "poles", "layers", "phases", "winding_factor", "periodicity", "lcm", "cogging_factor", "radial_force_balanced", "parallel_paths"} {
			if _, ok := p[k]; !ok {
				t.Errorf("pair lacks %q", k)
			}
		}
	}
}

// The hand-written encoder of pairs --json must give exactly what
// encoding/json (the reference) gives for the same values, including the
// float forms it picks.
func TestPairsJSONMatchesEncodingJSON(t *testing.T) {
	ps, err := winding.Pairs(winding.Sweep{MaxSlots: 60, MaxPoles: 60, Layers: []int{1, 2}})
	if err != nil {
		t.Fatal(err)
	}
	in := pairsJSON(ps)
	in = append(in, pairJSON{Slots: 1, WindingFactor: 1e-7, Q: "1/2"}, pairJSON{WindingFactor: 0, ParallelPaths: []int{}},
		pairJSON{WindingFactor: 1e21}, pairJSON{WindingFactor: 0.1 + 0.2}, pairJSON{WindingFactor: 5e-324})
	var want bytes.Buffer
	if err := writeJSON(&want, in); err != nil {
		t.Fatal(err)
	}
	if got := string(appendPairsJSON(nil, in)); got != want.String() {
		t.Errorf("appendPairsJSON differs from encoding/json:\n%s", firstDiff(want.String(), got))
	}
	var empty bytes.Buffer
	_ = writeJSON(&empty, []pairJSON{})
	if got := string(appendPairsJSON(nil, nil)); got != empty.String() {
		t.Errorf("appendPairsJSON(nil) = %q; want %q", got, empty.String())
	}
}
