package main

import (
	"bufio"
	"bytes"
	"encoding/json"
	"io"
	"math"
	"strconv"
	"strings"
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

// pairs --json streams its rows one by one through encoding/json; the
// stream must be byte for byte what encoding/json gives for the whole list
// at once (writeJSON), empty list included.
func TestPairsJSONStreamIsEncodingJSON(t *testing.T) {
	for _, sw := range []winding.Sweep{
		{MaxSlots: 60, MaxPoles: 60, Layers: []int{1, 2}},
		{MaxSlots: 2, MaxPoles: 2},
	} {
		rows, err := winding.RankPairs(sw, nil)
		if err != nil {
			t.Fatal(err)
		}
		whole := make([]pairJSON, len(rows))
		for i, r := range rows {
			pairJSONOf(&whole[i], r, nil)
		}
		var want, got bytes.Buffer
		if err := writeJSON(&want, whole); err != nil {
			t.Fatal(err)
		}
		if err := writePairsJSON(&got, rows); err != nil {
			t.Fatal(err)
		}
		if got.String() != want.String() {
			t.Errorf("%d rows: streamed JSON differs from encoding/json:\n%s", len(rows), firstDiff(want.String(), got.String()))
		}
	}
}

// A zero phase count is refused, not taken as the default (exit 2).
func TestPairsRefusesZeroCounts(t *testing.T) {
	for _, args := range [][]string{
		{"--phases", "0"},
		{"--layers", "0"},
	} {
		code, _, errOut := runCLI(t, append([]string{"pairs", "--max-slots", "12", "--max-poles", "10"}, args...)...)
		if code != 2 || !strings.Contains(errOut, args[0]) || strings.Count(strings.TrimSpace(errOut), "\n") != 0 {
			t.Errorf("pairs %v: exit %d, stderr %q; want 2 and one line naming %s", args, code, errOut, args[0])
		}
	}
}

// Text mode counts what JSON lists, and writes one line per pair.
func TestPairsTextMatchesJSON(t *testing.T) {
	args := []string{"pairs", "--max-slots", "48", "--max-poles", "56", "--top", "40"}
	_, text, _ := runCLI(t, args...)
	_, js, _ := runCLI(t, append(args, "--json")...)
	var ps []pairJSON
	if err := json.Unmarshal([]byte(js), &ps); err != nil {
		t.Fatal(err)
	}
	lines := strings.Split(strings.TrimSuffix(text, "\n"), "\n")
	if len(ps) != 40 || len(lines) != 2+len(ps) || !strings.HasPrefix(lines[0], "40 feasible pairs") {
		t.Fatalf("text has %d lines (%q...) for %d pairs", len(lines), lines[0], len(ps))
	}
	for i, p := range ps {
		f := strings.Fields(lines[2+i])
		if f[0] != strconv.Itoa(p.Slots) || f[1] != strconv.Itoa(p.Poles) || f[3] != p.Q {
			t.Errorf("text line %d %q; JSON has %d/%d q %s", i+1, lines[2+i], p.Slots, p.Poles, p.Q)
		}
	}
}

// The output half of pairs --json at Q, 2p <= 720: ranked rows written
// through encoding/json row by row (the sweep itself is BenchmarkRankPairs).
func BenchmarkPairsJSON720(b *testing.B) {
	rows, err := winding.RankPairs(winding.Sweep{MaxSlots: 720, MaxPoles: 720, Layers: []int{1, 2}}, nil)
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for b.Loop() {
		w := bufio.NewWriterSize(io.Discard, 64<<10)
		if err := writePairsJSON(w, rows); err != nil {
			b.Fatal(err)
		}
		if err := w.Flush(); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(len(rows)), "pairs")
}
