package winding

import "fmt"

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

// Sequence is the developed layout on one line: a letter per tooth, upper case
// for CW and lower case for CCW, "-" for an unwound tooth.
func (l *Layout) Sequence() string {
	b := make([]byte, 0, 2*l.Spec.Slots)
	for t := 1; t <= l.Spec.Slots; t++ {
		if t > 1 {
			b = append(b, ' ')
		}
		c, ok := l.CoilOn(t)
		if !ok {
			b = append(b, '-')
			continue
		}
		name := l.PhaseNames[c.Phase]
		if c.Direction == CCW {
			name = lower(name)
		}
		b = append(b, name...)
	}
	return string(b)
}

func lower(s string) string {
	b := []byte(s)
	for i, c := range b {
		if c >= 'A' && c <= 'Z' {
			b[i] = c + 'a' - 'A'
		}
	}
	return string(b)
}

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
