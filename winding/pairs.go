package winding

import (
	"runtime"
	"slices"
	"sync"
	"sync/atomic"
)

// Summary is the figure of merit of one feasible pair, for sweeps.
type Summary struct {
	Spec                Spec
	Q                   Fraction
	WindingFactor       float64
	Periodicity         int
	LCM                 int
	CoggingFactor       int
	RadialForceBalanced bool
	ParallelPaths       []int
}

// Sweep is a request for every feasible pair in a range.
type Sweep struct {
	MaxSlots, MaxPoles int
	Layers             []int // e.g. {1, 2}
	Phases             int
	MinWindingFactor   float64
	BalancedOnly       bool // only radially balanced pairs
}

// Pairs lists every feasible pair of the sweep, best first. The ranking: higher
// fundamental winding factor first (compared to 1e-9); then lower cogging
// factor; then radially balanced before unbalanced; then more parallel-path
// options; then fewer slots, fewer poles, two layers before one.
func Pairs(sw Sweep) ([]Summary, error) {
	if sw.Phases == 0 {
		sw.Phases = 3
	}
	if len(sw.Layers) == 0 {
		sw.Layers = []int{1, 2}
	}
	probe := Spec{Slots: max(sw.MaxSlots, 1), Poles: 2, Phases: sw.Phases, Layers: 2, Paths: 1}
	if err := probe.checkRange(); err != nil && err.(*SpecError).Field != "slots" {
		return nil, err
	}
	switch {
	case sw.MaxSlots < 1 || sw.MaxSlots > MaxSlots:
		return nil, invalid("max-slots", sw.MaxSlots, "must be between 1 and %d", MaxSlots)
	case sw.MaxPoles < 2 || sw.MaxPoles > MaxPoles:
		return nil, invalid("max-poles", sw.MaxPoles, "must be between 2 and %d", MaxPoles)
	}
	for _, ly := range sw.Layers {
		if ly != 1 && ly != 2 {
			return nil, invalid("layers", ly, "layers must be 1 or 2")
		}
	}
	// One job per (layers, Q); the jobs run on every core and their results
	// are joined in job order, so the output does not depend on scheduling.
	type job struct{ layers, slots int }
	var jobs []job
	for _, ly := range sw.Layers {
		for q := sw.Phases; q <= sw.MaxSlots; q++ {
			// The coil count must be a multiple of the phase count
			// (checkRange says so with a message; skip it unformatted).
			if (ly == 1 && q%2 != 0) || (q/(3-ly))%sw.Phases != 0 {
				continue
			}
			jobs = append(jobs, job{ly, q})
		}
	}
	results := make([][]Summary, len(jobs))
	var next atomic.Int64
	var wg sync.WaitGroup
	for w := 0; w < runtime.GOMAXPROCS(0); w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for {
				i := int(next.Add(1) - 1)
				if i >= len(jobs) {
					return
				}
				results[i] = sweepSlots(sw, jobs[i].layers, jobs[i].slots)
			}
		}()
	}
	wg.Wait()
	var out []Summary
	for _, r := range results {
		out = append(out, r...)
	}
	slices.SortStableFunc(out, func(a, b Summary) int {
		switch {
		case better(a, b):
			return -1
		case better(b, a):
			return 1
		}
		return 0
	})
	return out, nil
}

// sweepSlots lays out every pole count for one slot count and layer count.
func sweepSlots(sw Sweep, layers, q int) []Summary {
	var out []Summary
	tt := newTrigTable(q)
	for poles := 2; poles <= sw.MaxPoles; poles += 2 {
		l, err := design(Spec{Slots: q, Poles: poles, Phases: sw.Phases, Layers: layers, Paths: 1}, false, tt)
		if err != nil {
			continue
		}
		if l.WindingFactor < sw.MinWindingFactor || (sw.BalancedOnly && !l.RadialForceBalanced) {
			continue
		}
		out = append(out, Summary{Spec: l.Spec, Q: l.Q, WindingFactor: l.WindingFactor,
			Periodicity: l.Periodicity, LCM: l.LCM, CoggingFactor: l.CoggingFactor,
			RadialForceBalanced: l.RadialForceBalanced, ParallelPaths: l.ParallelPaths})
	}
	return out
}

func better(a, b Summary) bool {
	if d := a.WindingFactor - b.WindingFactor; d > 1e-9 || d < -1e-9 {
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
