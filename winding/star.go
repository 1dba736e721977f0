package winding

import (
	"fmt"
	"math"
	"slices"
)

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
// phase k's positive axis lies at -k*360/m, so V lags U (the phase sequence
// of the package doc).
func (st *star) assign() bool {
	s := st.s
	m, q := s.Phases, s.Slots
	pp := s.PolePairs() % q
	for i := range st.phase {
		st.phase[i], st.sign[i] = -1, 0
	}
	for i := 0; i < q; i += st.step {
		a := (-pp * i) % q
		if a < 0 {
			a += q
		}
		ph, neg := nearestAxis(a, q, m)
		st.phase[i] = ph
		st.sign[i] = 1 - 2*neg
	}
	return st.balanced()
}

// nearestAxis gives the phase and sense of the coil whose phasor lies at
// k*4m steps of the circle of W = 4mQ steps (k = 0..Q-1): neg is 1 when the
// nearest axis is the phase's negative one (the coil is wound CCW).
func nearestAxis(k, q, m int) (phase, neg int) {
	a := k * 4 * m
	j := ((a + q) / (2 * q)) % (2 * m)
	neg = j % 2
	return ((neg*m-j)/2%m + m) % m, neg
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
	return balancedSums(st.sumsRe, st.sumsIm, st.counts, phaseTurns(m))
}

// turns holds exp(-j*k*2*pi/m) for k = 0..m-1: the turn from phase U's
// phasor sum to phase k's in a balanced winding.
type turns [MaxPhases][2]float64

// phaseTurns computes the turns of m phases.
func phaseTurns(m int) *turns {
	var t turns
	for k := 0; k < m; k++ {
		t[k][0], t[k][1] = math.Cos(-2*math.Pi*float64(k)/float64(m)), math.Sin(-2*math.Pi*float64(k)/float64(m))
	}
	return &t
}

// balancedSums decides balance from the phasor sums of the m phases (re, im)
// and their coil counts: the sums have one magnitude and are 360/m apart in
// sequence, each phase has as many coils, and the sums do not cancel.
func balancedSums(re, im []float64, counts []int, t *turns) bool {
	n := counts[0]
	tol := 1e-9 * float64(n+1)
	if math.Hypot(re[0], im[0]) < 1e-6 {
		return false
	}
	for k := 1; k < len(counts); k++ {
		if counts[k] != n {
			return false
		}
		// Expected: S_k = S_0 * exp(-j*k*2*pi/m).
		c, sn := t[k][0], t[k][1]
		er := re[0]*c - im[0]*sn
		ei := re[0]*sn + im[0]*c
		if math.Abs(er-re[k]) > tol || math.Abs(ei-im[k]) > tol {
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
