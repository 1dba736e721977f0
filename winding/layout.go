package winding

import (
	"fmt"
	"strings"
)

// Direction is the sense in which the wire goes round a tooth, seen from the air
// gap looking at the tooth face, following the path from its start terminal.
type Direction int

const (
	CW  Direction = 1
	CCW Direction = -1
)

func (d Direction) String() string {
	if d == CCW {
		return "ccw"
	}
	return "cw"
}

// Sign is +1 for CW and -1 for CCW.
func (d Direction) Sign() int { return int(d) }

// Coil is the coil on one wound tooth.
type Coil struct {
	Tooth     int       // 1..Q
	Phase     int       // 0..m-1 (index into Layout.PhaseNames)
	Direction Direction // CW or CCW
	Path      int       // 1..Paths
	Position  int       // 1.. order along its path from the start terminal

	angle int // signed phasor angle at the working harmonic, in steps of 360/(2Q)
}

// Layout is a complete, balanced tooth-coil winding and its analysis. It is
// plain data: every field is computed by Design and never changed after.
type Layout struct {
	Spec       Spec
	PhaseNames []string
	Coils      []Coil // one per wound tooth, in tooth order

	CoilsPerPhase int
	Q             Fraction // slots per pole and phase, Q/(2p*m)
	Periodicity   int      // t = gcd(Q, p)
	Antiperiodic  bool     // half a period maps onto itself with every coil and pole reversed
	Symmetry      int      // order r of the largest rotation (360/r) that maps the machine onto itself; 1 if none
	LCM           int      // LCM(Q, 2p): cogging periods per revolution
	CoggingFactor int      // 2p*Q/LCM(Q, 2p)

	RadialForceBalanced bool

	WindingFactor float64    // at the working harmonic (spatial order p)
	PitchFactor   float64    // at the working harmonic
	DistFactor    float64    // distribution factor at the working harmonic
	Harmonics     []Harmonic // spatial orders 1..N, N = 3*max(Q, p)

	ParallelPaths []int   // every feasible number of parallel paths
	Chains        []Chain // per phase and path, in phase then path order
	Warnings      []Warning
}

// Harmonic is the winding factor at one spatial order (pole pairs of the wave).
type Harmonic struct {
	Order            int
	WindingFactor    float64 // of phase U
	MMFWindingFactor float64 // of the m-phase rotating MMF; 0 where the phases cancel
}

// Wound reports whether a tooth carries a coil in a layout of the given layers.
func Wound(tooth, layers int) bool { return layers == 2 || tooth%2 == 1 }

// CoilOn returns the coil on a tooth, and false for an unwound tooth or one out
// of range.
func (l *Layout) CoilOn(tooth int) (Coil, bool) {
	if tooth < 1 || tooth > l.Spec.Slots || !Wound(tooth, l.Spec.Layers) {
		return Coil{}, false
	}
	return l.Coils[(tooth-1)/(3-l.Spec.Layers)], true
}

// PhaseName returns the name of phase i ("U", "V", "W" for three phases).
func (l *Layout) PhaseName(i int) string { return l.PhaseNames[i] }

// Unwound is the token of a tooth that carries no coil (the idle teeth of a
// single-layer winding) in a developed sequence.
const Unwound = "0"

// SequenceTokens is the developed layout as signed tokens, one per tooth from
// tooth 1: the upper-case phase letter with a sign glued to it, "+U" for a coil
// wound CW and "-U" for one wound CCW, and Unwound for a tooth without a coil.
// This is the signed form of the phase (winding) matrix of tooth-coil windings,
// where +1 and -1 mark the sense of each coil of a phase (common practice).
// Letter case never carries meaning.
func (l *Layout) SequenceTokens() []string {
	out := make([]string, 0, l.Spec.Slots)
	for t := 1; t <= l.Spec.Slots; t++ {
		c, ok := l.CoilOn(t)
		if !ok {
			out = append(out, Unwound)
			continue
		}
		out = append(out, SenseToken(l.PhaseNames[c.Phase], c.Direction))
	}
	return out
}

// SenseToken writes one coil as a signed token: "+U" for phase U wound CW,
// "-U" wound CCW (ASCII hyphen-minus).
func SenseToken(phase string, d Direction) string {
	if d == CCW {
		return "-" + phase
	}
	return "+" + phase
}

// SenseLegend explains the signed tokens of SequenceTokens in one line, for
// every text that shows them.
const SenseLegend = "+ wound clockwise, - counter-clockwise, seen from the air gap following the path from its start terminal; " + Unwound + " no coil"

// Sequence is the developed layout on one line: the SequenceTokens separated
// by single spaces, e.g. "+U -U -V +V +W -W ..." for 12 slots and 10 poles.
func (l *Layout) Sequence() string { return strings.Join(l.SequenceTokens(), " ") }

// SlotsOf returns the two slots that hold the sides of the coil on a tooth:
// the slot before it (between tooth-1 and tooth) and the slot after it.
func SlotsOf(tooth, slots int) (before, after int) {
	before = tooth - 1
	if before == 0 {
		before = slots
	}
	return before, tooth
}

// PhaseNamesFor returns the phase names of an m-phase winding: U, V, W for three
// phases (IEC 60034-8); for other counts the letters from A in sequence order.
func PhaseNamesFor(m int) []string {
	if m == 3 {
		return []string{"U", "V", "W"}
	}
	names := make([]string, m)
	for i := range names {
		names[i] = fmt.Sprintf("%c", 'A'+i)
	}
	return names
}
