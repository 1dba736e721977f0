package winding

// PairRow is one feasible pair of a sweep in compact form: fixed size and
// free of pointers, so a sweep of hundreds of thousands of pairs keeps and
// ranks its rows cheaply. Summary expands one.
type PairRow struct {
	WindingFactor float64
	// key packs the rest of the ranking, smaller is better: cogging
	// factor, radial balance, parallel-path options, slots, poles, layers
	// (see rowKey).
	key     uint64
	pathGCD uint16 // the feasible parallel-path counts are its divisors
	phases  uint8
}

// Bit fields of PairRow.key, from the lowest bit up.
const (
	keyLayersBit   = 0  // 0: two layers, 1: one layer
	keyPolesShift  = 1  // 11 bits
	keySlotsShift  = 12 // 11 bits
	keyPathsShift  = 23 // 8 bits: 255 - number of path options
	keyUnbalBit    = 31 // 1: radial forces do not cancel
	keyCogShift    = 32 // 11 bits: cogging factor
	keyFieldMask   = 1<<11 - 1
	keyPathsMask   = 1<<8 - 1
	maxPathOptions = keyPathsMask
)

// newPairRow packs a pair's figures; pathGCD is the gcd whose divisors are
// the feasible parallel-path counts and options their number.
func newPairRow(slots, poles, phases, layers int, wf float64, balanced bool, pathGCD, options int) PairRow {
	k := uint64(poles)<<keyPolesShift | uint64(slots)<<keySlotsShift |
		uint64(maxPathOptions-options)<<keyPathsShift | uint64(gcd(slots, poles))<<keyCogShift
	if layers == 1 {
		k |= 1 << keyLayersBit
	}
	if !balanced {
		k |= 1 << keyUnbalBit
	}
	return PairRow{WindingFactor: wf, key: k, pathGCD: uint16(pathGCD), phases: uint8(phases)}
}

// Spec is the pair (one path).
func (r PairRow) Spec() Spec {
	return Spec{Slots: int(r.key>>keySlotsShift) & keyFieldMask, Poles: int(r.key>>keyPolesShift) & keyFieldMask,
		Phases: int(r.phases), Layers: 2 - int(r.key>>keyLayersBit&1), Paths: 1}
}

// CoggingFactor is 2pQ/LCM(Q, 2p) = gcd(Q, 2p).
func (r PairRow) CoggingFactor() int { return int(r.key>>keyCogShift) & keyFieldMask }

// RadialForceBalanced reports whether the radial forces on the rotor cancel.
func (r PairRow) RadialForceBalanced() bool { return r.key>>keyUnbalBit&1 == 0 }

// pathOptions is the number of feasible parallel-path counts.
func (r PairRow) pathOptions() int { return maxPathOptions - int(r.key>>keyPathsShift)&keyPathsMask }

// Summary expands the row; its ParallelPaths are appended to paths[:0], so a
// caller reading many rows passes one slice back each time.
func (r PairRow) Summary(paths []int) Summary {
	s := r.Spec()
	p := s.PolePairs()
	lcmQ := lcm(s.Slots, s.Poles)
	return Summary{Spec: s, Q: NewFraction(s.Slots, s.Poles*s.Phases), WindingFactor: r.WindingFactor,
		Periodicity: gcd(s.Slots, p), LCM: lcmQ, CoggingFactor: s.Poles * s.Slots / lcmQ,
		RadialForceBalanced: r.RadialForceBalanced(),
		ParallelPaths:       appendPathCounts(paths[:0], int(r.pathGCD), int(r.pathGCD))}
}
