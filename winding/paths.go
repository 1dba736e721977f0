package winding

import "sync"

var scratchInts = sync.Pool{New: func() any { return new([]int) }}

// feasiblePaths lists every number of parallel paths a for which the coils of
// each phase split into a groups of identical make-up: the same count of coils
// at each signed phasor angle. Such paths have the same EMF phasor at the
// working harmonic and at every odd multiple of it (the rotor's own
// harmonics), so no current circulates between them. The engine does not
// accept paths whose fundamental sums agree by coincidence while their make-up
// differs: their higher harmonics would differ and drive circulating current.
func feasiblePaths(l *Layout) []int {
	m := l.Spec.Phases
	q2 := 2 * l.Spec.Slots
	// coils by phase*2Q + signed angle; a scratch slice from a pool, as
	// sweeps call this thousands of times. The slice is all zero between
	// calls: the gcd pass clears what the count touched.
	buf := scratchInts.Get().(*[]int)
	defer scratchInts.Put(buf)
	if len(*buf) < m*q2 {
		*buf = make([]int, m*q2)
	}
	counts := *buf
	for _, c := range l.Coils {
		counts[c.Phase*q2+c.angle]++
	}
	// a is feasible when it divides every count: the divisors of their gcd
	// that divide the coils per phase.
	g := 0
	for _, c := range l.Coils {
		k := c.Phase*q2 + c.angle
		g = gcdStep(g, counts[k])
		counts[k] = 0
	}
	return appendPathCounts(nil, g, l.CoilsPerPhase)
}

// gcdStep folds one more count into a running gcd g (0 before the first);
// a count of 0 (already taken) leaves g as it is. It divides only when the
// count differs from g and g is not already 1.
func gcdStep(g, c int) int {
	if c == 0 || c == g || g == 1 {
		return g
	}
	return gcd(g, c)
}

// appendPathCounts appends the feasible numbers of parallel paths, in
// ascending order, for coil counts whose gcd is g and n coils per phase: the
// divisors of gcd(g, n). None when g is 0 (no coils).
func appendPathCounts(dst []int, g, n int) []int {
	if g == 0 {
		return dst
	}
	g = gcd(g, n)
	for a := 1; a <= g; a++ {
		if g%a == 0 {
			dst = append(dst, a)
		}
	}
	return dst
}

// assignPaths gives each coil its path and its position along the path.
// Within a phase, the coils of each signed phasor angle are shared out in
// tooth order, the first 1/a of them to path 1 and so on, so each path keeps
// to one stretch of the stator where the symmetry allows; positions follow
// tooth order from the start terminal.
func (l *Layout) assignPaths() {
	a := l.Spec.Paths
	m := l.Spec.Phases
	q2 := 2 * l.Spec.Slots
	total := make([]int, m*q2) // by phase*2Q + angle
	for _, c := range l.Coils {
		total[c.Phase*q2+c.angle]++
	}
	seen := make([]int, m*q2)
	pos := make([]int, m*a) // by phase*a + path-1
	for i := range l.Coils {
		c := &l.Coils[i]
		k := c.Phase*q2 + c.angle
		c.Path = seen[k]*a/total[k] + 1
		seen[k]++
		pk := c.Phase*a + c.Path - 1
		pos[pk]++
		c.Position = pos[pk]
	}
	l.Chains = buildChains(l)
}

// Chain is one path of one phase in winding order: the teeth from the start
// terminal to the finish terminal and the jumpers between consecutive coils.
// A path is wound from one continuous wire.
type Chain struct {
	Phase   int
	Path    int
	Start   string   // terminal mark at the start, e.g. "U1"
	Finish  string   // terminal mark at the finish, e.g. "U2"
	Teeth   []int    // in winding order
	Jumpers []Jumper // len(Teeth)-1, Jumpers[i] joins Teeth[i] to Teeth[i+1]
}

// Jumper is the wire carried from the finish of one coil to the start of the
// next in the same path. Whole turns start and finish at the lead end, so
// jumpers run round the lead end. Span is the count of tooth pitches it
// covers going counter-clockwise (up the tooth numbers).
type Jumper struct {
	FromTooth     int  `json:"from_tooth"`
	ToTooth       int  `json:"to_tooth"`
	Span          int  `json:"span_teeth"`
	ReversesSense bool `json:"reverses_sense"` // the next coil is wound the other way round
}

// buildChains groups the coils by phase and path. Coils are in tooth order and
// positions rise with the tooth, so each chain is already in winding order.
func buildChains(l *Layout) []Chain {
	q := l.Spec.Slots
	a := l.Spec.Paths
	chains := make([]Chain, l.Spec.Phases*a)
	for ph := 0; ph < l.Spec.Phases; ph++ {
		for path := 1; path <= a; path++ {
			n := l.CoilsPerPhase / a
			chains[ph*a+path-1] = Chain{Phase: ph, Path: path,
				Start: l.PhaseNames[ph] + "1", Finish: l.PhaseNames[ph] + "2",
				Teeth: make([]int, 0, n), Jumpers: make([]Jumper, 0, max(n-1, 0))}
		}
	}
	last := make([]Coil, len(chains))
	for _, c := range l.Coils {
		ch := &chains[c.Phase*a+c.Path-1]
		if len(ch.Teeth) > 0 {
			prev := last[c.Phase*a+c.Path-1]
			ch.Jumpers = append(ch.Jumpers, Jumper{
				FromTooth: prev.Tooth, ToTooth: c.Tooth,
				Span:          ((c.Tooth-prev.Tooth)%q + q) % q,
				ReversesSense: prev.Direction != c.Direction,
			})
		}
		ch.Teeth = append(ch.Teeth, c.Tooth)
		last[c.Phase*a+c.Path-1] = c
	}
	return chains
}

// ChainOf returns the chain of a phase and path (1-based path).
func (l *Layout) ChainOf(phase, path int) (Chain, bool) {
	for _, ch := range l.Chains {
		if ch.Phase == phase && ch.Path == path {
			return ch, true
		}
	}
	return Chain{}, false
}
