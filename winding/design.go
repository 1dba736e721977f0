package winding

import "math"

// Design lays out the winding for a Spec by the star of slots and analyses it.
// It refuses a Spec with a *SpecError that wraps ErrInvalid (values out of
// range) or ErrInfeasible (no balanced winding, or paths that cannot be equal).
func Design(s Spec) (*Layout, error) {
	return design(s.Normalize(), true, trigTable{})
}

// design does the work; full=false is for sweeps over many pairs: it skips the
// nearest-pair suggestions of a refusal, the harmonic spectrum, the warnings
// and the winding order of the paths.
//
// tt may hold the trig table of s.Slots (sweeps reuse one per slot count);
// an empty one is built here.
func design(s Spec, full bool, tt trigTable) (*Layout, error) {
	if err := s.checkRange(); err != nil {
		if se, ok := err.(*SpecError); ok && se.kind == ErrInfeasible && full {
			se.Nearest = nearestFeasible(s)
		}
		return nil, err
	}
	if len(tt.cos) != 2*s.Slots {
		tt = newTrigTable(s.Slots)
	}
	st := newStar(s, tt)
	if !st.assign() {
		if !full {
			return nil, ErrInfeasible
		}
		e := infeasible("poles", s.Poles, "no balanced %s winding exists for %d slots and %d poles (%s)",
			layerWord(s.Layers), s.Slots, s.Poles, st.whyUnbalanced())
		e.Nearest = nearestFeasible(s)
		return nil, e
	}
	st.renumberFromRunStart()
	l := st.layout()
	l.analyseSymmetry()
	l.ParallelPaths = feasiblePaths(l)
	if !contains(l.ParallelPaths, s.Paths) {
		return nil, infeasible("paths", s.Paths,
			"the coils of each phase cannot be split into %d paths with equal EMF phasors; feasible: %v", s.Paths, l.ParallelPaths)
	}
	if full {
		l.assignPaths()
		l.Harmonics = harmonicSpectrum(l, 3*max(s.Slots, s.PolePairs()), st.trig)
		l.Warnings = warningsFor(l)
	}
	return l, nil
}

func layerWord(layers int) string {
	if layers == 1 {
		return "single-layer"
	}
	return "double-layer"
}

func (st *star) layout() *Layout {
	s := st.s
	l := &Layout{Spec: s, PhaseNames: PhaseNamesFor(s.Phases)}
	l.Coils = make([]Coil, 0, s.Slots/st.step)
	for i := 0; i < s.Slots; i += st.step {
		l.Coils = append(l.Coils, Coil{
			Tooth:     i + 1,
			Phase:     st.phase[i],
			Direction: Direction(st.sign[i]),
			angle:     fundamentalAngle(i, st.sign[i], s),
		})
	}
	l.CoilsPerPhase = len(l.Coils) / s.Phases
	p := s.PolePairs()
	l.Q = NewFraction(s.Slots, s.Poles*s.Phases)
	l.Periodicity = gcd(s.Slots, p)
	l.LCM = lcm(s.Slots, s.Poles)
	l.CoggingFactor = s.Poles * s.Slots / l.LCM
	l.PitchFactor = snap(math.Abs(st.trig.sin[p%(2*s.Slots)]))
	l.DistFactor = snap(phaseSpread(l, 0, p, st.trig))
	l.WindingFactor = snap(l.PitchFactor * l.DistFactor)
	return l
}

func contains(xs []int, v int) bool {
	for _, x := range xs {
		if x == v {
			return true
		}
	}
	return false
}
