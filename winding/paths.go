package winding

import "sort"

// feasiblePaths lists every number of parallel paths a for which the coils of
// each phase split into a groups of identical make-up: the same count of coils
// at each signed phasor angle. Such paths have the same EMF phasor at the
// working harmonic and at every odd multiple of it (the rotor's own
// harmonics), so no current circulates between them. The engine does not
// accept paths whose fundamental sums agree by coincidence while their make-up
// differs: their higher harmonics would differ and drive circulating current.
func feasiblePaths(l *Layout) []int {
	m := l.Spec.Phases
	n := l.CoilsPerPhase
	// counts[phase][angle] = number of coils
	counts := make([]map[int]int, m)
	for i := range counts {
		counts[i] = map[int]int{}
	}
	for _, c := range l.Coils {
		counts[c.Phase][c.angle]++
	}
	var out []int
	for a := 1; a <= n; a++ {
		if n%a != 0 {
			continue
		}
		ok := true
		for _, byAngle := range counts {
			for _, k := range byAngle {
				if k%a != 0 {
					ok = false
					break
				}
			}
			if !ok {
				break
			}
		}
		if ok {
			out = append(out, a)
		}
	}
	return out
}

// assignPaths gives each coil its path and its position along the path.
// Within a phase, the coils of each signed phasor angle are shared out in
// tooth order, the first 1/a of them to path 1 and so on, so each path keeps
// to one stretch of the stator where the symmetry allows; positions follow
// tooth order from the start terminal.
func (l *Layout) assignPaths() {
	a := l.Spec.Paths
	m := l.Spec.Phases
	type key struct{ phase, angle int }
	total := map[key]int{}
	for _, c := range l.Coils {
		total[key{c.Phase, c.angle}]++
	}
	seen := map[key]int{}
	for i := range l.Coils {
		c := &l.Coils[i]
		k := key{c.Phase, c.angle}
		c.Path = seen[k]*a/total[k] + 1
		seen[k]++
	}
	pos := make(map[[2]int]int, m*a)
	for i := range l.Coils {
		c := &l.Coils[i]
		k := [2]int{c.Phase, c.Path}
		pos[k]++
		c.Position = pos[k]
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
	FromTooth, ToTooth int
	Span               int
	ReversesSense      bool // the next coil is wound the other way round
}

func buildChains(l *Layout) []Chain {
	q := l.Spec.Slots
	var chains []Chain
	for ph := 0; ph < l.Spec.Phases; ph++ {
		for path := 1; path <= l.Spec.Paths; path++ {
			var cs []Coil
			for _, c := range l.Coils {
				if c.Phase == ph && c.Path == path {
					cs = append(cs, c)
				}
			}
			sort.Slice(cs, func(i, j int) bool { return cs[i].Position < cs[j].Position })
			ch := Chain{Phase: ph, Path: path,
				Start: l.PhaseNames[ph] + "1", Finish: l.PhaseNames[ph] + "2"}
			for i, c := range cs {
				ch.Teeth = append(ch.Teeth, c.Tooth)
				if i > 0 {
					prev := cs[i-1]
					ch.Jumpers = append(ch.Jumpers, Jumper{
						FromTooth: prev.Tooth, ToTooth: c.Tooth,
						Span:          ((c.Tooth-prev.Tooth)%q + q) % q,
						ReversesSense: prev.Direction != c.Direction,
					})
				}
			}
			chains = append(chains, ch)
		}
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
