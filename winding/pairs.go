package winding

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
//
// Pairs is RankPairs with every row expanded; a long sweep is better read
// through RankPairs, row by row.
func Pairs(sw Sweep) ([]Summary, error) {
	rows, err := RankPairs(sw, nil)
	if err != nil {
		return nil, err
	}
	out := make([]Summary, len(rows))
	for i, r := range rows {
		out[i] = r.Summary(nil)
	}
	return out, nil
}

// RankPairs appends to dst every feasible pair of the sweep as a compact
// row, best first (the ranking of Pairs), and returns the extended slice:
// a caller that sweeps again passes the slice back to reuse its storage.
func RankPairs(sw Sweep, dst []PairRow) ([]PairRow, error) {
	if sw.Phases == 0 {
		sw.Phases = 3
	}
	if len(sw.Layers) == 0 {
		sw.Layers = []int{1, 2}
	}
	probe := Spec{Slots: max(sw.MaxSlots, 1), Poles: 2, Phases: sw.Phases, Layers: 2, Paths: 1}
	if err := probe.checkRange(); err != nil && err.(*SpecError).Field != "slots" {
		return dst, err
	}
	switch {
	case sw.MaxSlots < 1 || sw.MaxSlots > MaxSlots:
		return dst, invalid("max-slots", sw.MaxSlots, "must be between 1 and %d", MaxSlots)
	case sw.MaxPoles < 2 || sw.MaxPoles > MaxPoles:
		return dst, invalid("max-poles", sw.MaxPoles, "must be between 2 and %d", MaxPoles)
	}
	for _, ly := range sw.Layers {
		if ly != 1 && ly != 2 {
			return dst, invalid("layers", ly, "layers must be 1 or 2")
		}
	}
	base := len(dst)
	dst = sweepAll(sw, dst)
	rankRows(dst[base:], sw.Layers)
	return dst, nil
}
