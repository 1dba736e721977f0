package winding

import (
	"errors"
	"fmt"
	"math"
	"reflect"
	"slices"
	"testing"
)

// straightPairs is the straightforward sweep the fast one must equal: Design
// on every pair, its figures copied, the list sorted stably by the ranking
// written out on the figures themselves.
func straightPairs(t *testing.T, sw Sweep) []Summary {
	t.Helper()
	var out []Summary
	for _, ly := range sw.Layers {
		for q := 1; q <= sw.MaxSlots; q++ {
			for poles := 2; poles <= sw.MaxPoles; poles += 2 {
				l, err := Design(Spec{Slots: q, Poles: poles, Phases: sw.Phases, Layers: ly, Paths: 1})
				if errors.Is(err, ErrInfeasible) {
					continue
				}
				if err != nil {
					t.Fatalf("%d/%d %dL: %v", q, poles, ly, err)
				}
				if l.WindingFactor < sw.MinWindingFactor || sw.BalancedOnly && !l.RadialForceBalanced {
					continue
				}
				out = append(out, Summary{Spec: l.Spec, Q: l.Q, WindingFactor: l.WindingFactor,
					Periodicity: l.Periodicity, LCM: l.LCM, CoggingFactor: l.CoggingFactor,
					RadialForceBalanced: l.RadialForceBalanced, ParallelPaths: l.ParallelPaths})
			}
		}
	}
	sortStableBy(out, straightBetter)
	return out
}

func straightBetter(a, b Summary) bool {
	if d := a.WindingFactor - b.WindingFactor; math.Abs(d) > 1e-9 {
		return d > 0
	}
	if a.CoggingFactor != b.CoggingFactor {
		return a.CoggingFactor < b.CoggingFactor
	}
	if a.RadialForceBalanced != b.RadialForceBalanced {
		return a.RadialForceBalanced
	}
	if len(a.ParallelPaths) != len(b.ParallelPaths) {
		return len(a.ParallelPaths) > len(b.ParallelPaths)
	}
	if a.Spec.Slots != b.Spec.Slots {
		return a.Spec.Slots < b.Spec.Slots
	}
	if a.Spec.Poles != b.Spec.Poles {
		return a.Spec.Poles < b.Spec.Poles
	}
	return a.Spec.Layers > b.Spec.Layers
}

// The fast sweep gives the same pairs, figures (to the last bit) and order
// as Design pair by pair, for Q, 2p <= 120 and a few other sweeps.
func TestPairsMatchDesignPerPair(t *testing.T) {
	sweeps := []Sweep{
		{MaxSlots: 120, MaxPoles: 120, Phases: 3, Layers: []int{1, 2}},
		{MaxSlots: 90, MaxPoles: 110, Phases: 3, Layers: []int{2, 1}, MinWindingFactor: 0.9},
		{MaxSlots: 100, MaxPoles: 60, Phases: 3, Layers: []int{2}, BalancedOnly: true},
		{MaxSlots: 100, MaxPoles: 100, Phases: 5, Layers: []int{1, 2}},
		{MaxSlots: 84, MaxPoles: 90, Phases: 7, Layers: []int{1, 2}},
	}
	if testing.Short() {
		sweeps = sweeps[1:3]
	}
	for _, sw := range sweeps {
		t.Run(fmt.Sprintf("%+v", sw), func(t *testing.T) {
			want := straightPairs(t, sw)
			got, err := Pairs(sw)
			if err != nil {
				t.Fatal(err)
			}
			if len(got) != len(want) {
				t.Errorf("fast sweep lists %d pairs; Design per pair %d", len(got), len(want))
			}
			for i := range min(len(got), len(want)) {
				if !reflect.DeepEqual(got[i], want[i]) {
					t.Fatalf("rank %d: fast sweep %+v; Design per pair %+v", i+1, got[i], want[i])
				}
			}
		})
	}
}

// rankRows must give what a stable sort by better gives on the rows in
// sweep order, also where winding factors differ by less than the 1e-9 that
// better treats as a tie: a run of such factors within 1e-9 end to end (one
// class), a chain wider than that (better is then no order) and none.
func TestRankRowsAsStableSortByBetter(t *testing.T) {
	factors := map[string][]float64{
		"apart":      {0.95, 0.9, 0.866, 0.5},
		"close run":  {0.9536, 0.9536 - 4e-10, 0.9536 - 7e-10, 0.9},
		"wide chain": {0.9536, 0.9536 - 8e-10, 0.9536 - 16e-10, 0.9536 - 24e-10, 0.9},
	}
	for name, fs := range factors {
		t.Run(name, func(t *testing.T) {
			var rows []PairRow
			i := 0
			for q := 3; q <= 30; q += 3 {
				for poles := 2; poles <= 20; poles += 2 {
					i++
					opts := 1 + i%3
					rows = append(rows, newPairRow(q, poles, 3, 2, fs[(i*7)%len(fs)], i%5 != 0, opts, opts))
				}
			}
			want := slices.Clone(rows)
			sortStableBy(want, better)
			rankRows(rows, []int{2})
			if !slices.Equal(rows, want) {
				t.Errorf("rankRows differs from a stable sort by better:\n got %v\nwant %v", rows, want)
			}
		})
	}
}
