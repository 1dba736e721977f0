package winding

import (
	"fmt"
	"math"
	"slices"
)

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

// star is the star of slots under construction. Tooth indices are 0-based here.
type star struct {
	s      Spec
	step   int   // 1 for two layers, 2 for one layer (odd teeth wound)
	phase  []int // per tooth index; -1 unwound
	sign   []int // +1 CW, -1 CCW, 0 unwound
	trig   trigTable
	sumsRe []float64
	sumsIm []float64
	counts []int
}

func newStar(s Spec, tt trigTable) *star {
	st := &star{s: s, step: 3 - s.Layers, trig: tt}
	st.phase = make([]int, s.Slots)
	st.sign = make([]int, s.Slots)
	return st
}

// fundamentalAngle is the angle of the EMF phasor of tooth index i with sign
// sg, at the working harmonic, in steps of 180/Q degrees (0..2Q-1).
func fundamentalAngle(i, sg int, s Spec) int {
	q2 := 2 * s.Slots
	a := (-2 * (s.PolePairs() % s.Slots) * i) % q2
	if sg < 0 {
		a += s.Slots
	}
	a %= q2
	if a < 0 {
		a += q2
	}
	return a
}

// assign gives each wound tooth the nearest of the 2m phase axes and reports
// whether the result is balanced.
//
// On a circle of W = 4mQ steps, tooth index i lies at -p*i*4m; the axes lie at
// j*2Q (j = 0..2m-1), each owning the half-open sector [j*2Q-Q, j*2Q+Q). Axis
// j is phase ((s*m-j)/2) mod m with sign s = j mod 2 (negative when s = 1):
// phase k's positive axis lies at -k*360/m, so V lags U (DESIGN.md).
func (st *star) assign() bool {
	s := st.s
	m, q := s.Phases, s.Slots
	w := 4 * m * q
	pp := s.PolePairs() % q
	for i := range st.phase {
		st.phase[i], st.sign[i] = -1, 0
	}
	for i := 0; i < q; i += st.step {
		a := (-pp * i * 4 * m) % w
		if a < 0 {
			a += w
		}
		j := ((a + q) / (2 * q)) % (2 * m)
		neg := j % 2
		ph := ((neg*m-j)/2%m + m) % m
		st.phase[i] = ph
		st.sign[i] = 1 - 2*neg
	}
	return st.balanced()
}

// balanced sums the coil phasors of each phase at the working harmonic and
// checks that the sums have one magnitude, are 360/m apart in sequence, and
// that each phase has the same number of coils.
func (st *star) balanced() bool {
	m := st.s.Phases
	st.sumsRe = make([]float64, m)
	st.sumsIm = make([]float64, m)
	st.counts = make([]int, m)
	q := st.s.Slots
	q2 := 2 * q
	turn := (2 * (st.s.PolePairs() % q) * st.step) % q2 // phasor turn per wound tooth, clockwise
	base := 0                                           // angle of tooth i before its sign
	for i := 0; i < q; i += st.step {
		ph := st.phase[i]
		a := base
		if st.sign[i] < 0 {
			a += q
			if a >= q2 {
				a -= q2
			}
		}
		base -= turn
		if base < 0 {
			base += q2
		}
		st.sumsRe[ph] += st.trig.cos[a]
		st.sumsIm[ph] += st.trig.sin[a]
		st.counts[ph]++
	}
	n := st.counts[0]
	tol := 1e-9 * float64(n+1)
	if math.Hypot(st.sumsRe[0], st.sumsIm[0]) < 1e-6 {
		return false
	}
	for k := 1; k < m; k++ {
		if st.counts[k] != n {
			return false
		}
		// Expected: S_k = S_0 * exp(-j*k*2*pi/m).
		c, sn := math.Cos(-2*math.Pi*float64(k)/float64(m)), math.Sin(-2*math.Pi*float64(k)/float64(m))
		er := st.sumsRe[0]*c - st.sumsIm[0]*sn
		ei := st.sumsRe[0]*sn + st.sumsIm[0]*c
		if math.Abs(er-st.sumsRe[k]) > tol || math.Abs(ei-st.sumsIm[k]) > tol {
			return false
		}
	}
	return true
}

// whyUnbalanced names the failed condition for the refusal message.
func (st *star) whyUnbalanced() string {
	s := st.s
	coils := s.Slots / st.step
	p := s.PolePairs()
	tp := gcd(coils, p)
	if math.Hypot(st.sumsRe[0], st.sumsIm[0]) < 1e-6 {
		return "every coil EMF cancels within its phase"
	}
	if s.Layers == 1 {
		return fmt.Sprintf("with alternate teeth wound, (Q/2)/(m*gcd(Q/2, p)) = %d/(%d*%d) is not a whole number", coils, s.Phases, tp)
	}
	return fmt.Sprintf("Q/(m*t) = %d/(%d*%d) is not a whole number, t = gcd(Q, p)", coils, s.Phases, tp)
}

// renumberFromRunStart renumbers the teeth (a rotation of the numbering, which
// changes nothing physical) so that tooth 1 carries phase U and starts a run
// of adjacent U coils, and flips every direction if needed so that tooth 1 is
// CW. Both keep the balance and the phase sequence: every phasor turns by the
// same angle.
func (st *star) renumberFromRunStart() {
	q := st.s.Slots
	start := 0
	for i := 0; i < q; i += st.step {
		prev := (i - st.step + q) % q
		if st.phase[i] == 0 && st.phase[prev] != 0 {
			start = i
			break
		}
	}
	rotateLeft(st.phase, start)
	rotateLeft(st.sign, start)
	if st.sign[0] < 0 {
		for i := range st.sign {
			st.sign[i] = -st.sign[i]
		}
	}
}

// rotateLeft moves xs[k] to xs[0] in place (three reversals).
func rotateLeft(xs []int, k int) {
	if k == 0 {
		return
	}
	slices.Reverse(xs[:k])
	slices.Reverse(xs[k:])
	slices.Reverse(xs)
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

// phaseSpread is the distribution factor of one phase at spatial order nu:
// |sum of signed coil phasors| / number of coils.
func phaseSpread(l *Layout, phase, nu int, tt trigTable) float64 {
	q := l.Spec.Slots
	q2 := 2 * q
	nr := nu % q2
	var re, im float64
	n := 0
	for _, c := range l.Coils {
		if c.Phase != phase {
			continue
		}
		a := (-2 * nr * (c.Tooth - 1)) % q2
		if c.Direction == CCW {
			a += q
		}
		a = ((a % q2) + q2) % q2
		re += tt.cos[a]
		im += tt.sin[a]
		n++
	}
	if n == 0 {
		return 0
	}
	return math.Hypot(re, im) / float64(n)
}

// harmonicSpectrum gives, at spatial orders 1..n, the winding factor of phase
// U and of the m-phase rotating MMF. Phase U: pitch factor |sin(nu*pi/Q)| (a
// coil spans one slot pitch) times the distribution factor of its coil phasors
// at that order. MMF: with balanced currents, the phase phasors W_k at order
// nu combine into waves of amplitude |sum_k W_k exp(+-j*2*pi*k/m)|; the larger
// of the two, over m times the coils per phase, times the pitch factor. Orders
// where the phases cancel (the triplens of a three-phase winding, mostly) have
// an MMF winding factor of 0 though the phase has one.
//
// The coil phasor at order nu turns by -2*nu*(k-1) steps of 180/Q degrees, so
// the spectrum repeats with period Q in nu: only the first Q orders are summed.
func harmonicSpectrum(l *Layout, n int, tt trigTable) []Harmonic {
	q := l.Spec.Slots
	m := l.Spec.Phases
	q2 := 2 * q
	rot := make([][2]float64, m) // exp(j*2*pi*k/m)
	for k := range rot {
		rot[k][1], rot[k][0] = math.Sincos(2 * math.Pi * float64(k) / float64(m))
	}
	// Per phase, per coil: step is the turn per order, ang the angle at the
	// current order (both in steps of 180/Q degrees).
	step := make([][]int, m)
	ang := make([][]int, m)
	for _, c := range l.Coils {
		a := 0
		if c.Direction == CCW {
			a = q
		}
		step[c.Phase] = append(step[c.Phase], (q2-2*(c.Tooth-1)%q2)%q2)
		ang[c.Phase] = append(ang[c.Phase], a)
	}
	re := make([]float64, m)
	im := make([]float64, m)
	nc := float64(l.CoilsPerPhase)
	out := make([]Harmonic, n)
	// Orders 1..Q/2 are summed (the angles advance one order per pass);
	// the rest follow: order Q-nu has the conjugate phasors of order nu, so
	// the same magnitudes, order Q+nu repeats nu, and at multiples of Q the
	// pitch factor sin(nu*pi/Q) is zero.
	for nu := 1; nu <= min(n, q/2); nu++ {
		for k := 0; k < m; k++ {
			var sr, si float64
			st, an := step[k], ang[k]
			for i := range an {
				a := an[i] + st[i]
				if a >= q2 {
					a -= q2
				}
				an[i] = a
				sr += tt.cos[a]
				si += tt.sin[a]
			}
			re[k], im[k] = sr, si
		}
		var fr, fi, br, bi float64
		for k := 0; k < m; k++ {
			c, s := rot[k][0], rot[k][1]
			fr += re[k]*c - im[k]*s
			fi += re[k]*s + im[k]*c
			br += re[k]*c + im[k]*s
			bi += -re[k]*s + im[k]*c
		}
		kp := math.Abs(tt.sin[nu%q2])
		mmf := math.Max(math.Hypot(fr, fi), math.Hypot(br, bi)) / (float64(m) * nc)
		out[nu-1] = Harmonic{Order: nu,
			WindingFactor:    snap(kp * math.Hypot(re[0], im[0]) / nc),
			MMFWindingFactor: snap(kp * mmf)}
	}
	for nu := q/2 + 1; nu <= n; nu++ {
		h := Harmonic{Order: nu}
		switch r := nu % q; {
		case r == 0:
		case 2*r > q:
			h.WindingFactor, h.MMFWindingFactor = out[q-r-1].WindingFactor, out[q-r-1].MMFWindingFactor
		default:
			h.WindingFactor, h.MMFWindingFactor = out[r-1].WindingFactor, out[r-1].MMFWindingFactor
		}
		out[nu-1] = h
	}
	return out
}

// snap rounds to 12 decimals so exact zeros and ones print as such.
func snap(x float64) float64 {
	r := math.Round(x*1e12) / 1e12
	if r == 0 {
		return 0
	}
	return r
}

// trigTable holds cos and sin of k*180/Q degrees for k = 0..2Q-1.
type trigTable struct{ cos, sin []float64 }

// Only the first quarter is computed; the rest follows exactly from
// sin(pi-x) = sin x, cos(pi-x) = -cos x and sin(pi+x) = -sin x,
// cos(pi+x) = -cos x, so mirrored angles give mirrored values.
func newTrigTable(q int) trigTable {
	t := trigTable{cos: make([]float64, 2*q), sin: make([]float64, 2*q)}
	for k := 0; 2*k <= q; k++ {
		sn, cs := math.Sincos(math.Pi * float64(k) / float64(q))
		t.sin[k], t.cos[k] = sn, cs
		if m := q - k; m != k && m < q {
			t.sin[m], t.cos[m] = sn, -cs
		}
	}
	if q >= 1 {
		t.sin[q], t.cos[q] = 0, -1
	}
	for k := 0; k < q; k++ {
		t.sin[k+q], t.cos[k+q] = -t.sin[k], -t.cos[k]
	}
	return t
}

func contains(xs []int, v int) bool {
	for _, x := range xs {
		if x == v {
			return true
		}
	}
	return false
}
