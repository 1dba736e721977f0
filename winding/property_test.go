package winding

import (
	"math"
	"sort"
	"testing"
)

// phasorOf is an independent computation of a coil's EMF phasor at spatial
// order nu, straight from the geometry: tooth k at mechanical angle
// (k-1)*2*pi/Q, time phase -nu*theta, sign from the direction.
func phasorOf(c Coil, q, nu int) complex128 {
	theta := 2 * math.Pi * float64(c.Tooth-1) / float64(q)
	z := complex(math.Cos(-float64(nu)*theta), math.Sin(-float64(nu)*theta))
	if c.Direction == CCW {
		z = -z
	}
	return z
}

func phaseSum(l *Layout, phase, path, nu int) (complex128, int) {
	var s complex128
	n := 0
	for _, c := range l.Coils {
		if c.Phase == phase && (path == 0 || c.Path == path) {
			s += phasorOf(c, l.Spec.Slots, nu)
			n++
		}
	}
	return s, n
}

func angleDiff(a, b complex128) float64 {
	d := math.Atan2(imag(a), real(a)) - math.Atan2(imag(b), real(b))
	for d > math.Pi {
		d -= 2 * math.Pi
	}
	for d <= -math.Pi {
		d += 2 * math.Pi
	}
	return d
}

// checkBalanceAndSequence: equal magnitudes, each phase lagging the one before
// by 360/m (the phase sequence of the package doc), tooth 1 a CW coil of phase U starting a
// run of U coils.
func checkBalanceAndSequence(t *testing.T, l *Layout) {
	t.Helper()
	p := l.Spec.PolePairs()
	m := l.Spec.Phases
	s0, n0 := phaseSum(l, 0, 0, p)
	for k := 1; k < m; k++ {
		sk, nk := phaseSum(l, k, 0, p)
		if nk != n0 || math.Abs(abs128(sk)-abs128(s0)) > 1e-9 {
			t.Errorf("%v: phase %d has %d coils |E| %.6f; phase 0 has %d, %.6f", l.Spec, k, nk, abs128(sk), n0, abs128(s0))
		}
		if d := angleDiff(sk, s0) + 2*math.Pi*float64(k)/float64(m); math.Abs(math.Remainder(d, 2*math.Pi)) > 1e-9 {
			t.Errorf("%v: phase %d is at %.4f rad from phase 0; want -%d*2pi/%d", l.Spec, k, angleDiff(sk, s0), k, m)
		}
	}
	c1 := l.Coils[0]
	if c1.Tooth != 1 || c1.Phase != 0 || c1.Direction != CW {
		t.Errorf("%v: tooth 1 carries %+v; want phase U, cw", l.Spec, c1)
	}
	if last := l.Coils[len(l.Coils)-1]; last.Phase == 0 {
		t.Errorf("%v: the coil before tooth 1 (tooth %d) is also phase U; tooth 1 should start the run", l.Spec, last.Tooth)
	}
}

func abs128(z complex128) float64 { return math.Hypot(real(z), imag(z)) }

// bestPhaseBand is the textbook bound for the distribution factor: fold every
// coil phasor onto a half circle (a reversed coil), count the distinct
// directions n_dir (they are equally spaced, 180/n_dir apart, each with the same
// count); a phase can at best take n_dir/m adjacent directions, so
// k_d = sin(n/2 * delta) / (n * sin(delta/2)), n = n_dir/m, delta = 180/n_dir
// (the distribution factor of a phase band, e.g. Pyrhönen et al., ch. 2).
// It reports false where the folded star is not equally spaced.
func bestPhaseBand(l *Layout) (float64, bool) {
	q := l.Spec.Slots
	p := l.Spec.PolePairs()
	var dirs []float64
	for _, c := range l.Coils {
		a := math.Mod(-2*math.Pi*float64(p)*float64(c.Tooth-1)/float64(q), math.Pi)
		if a < 0 {
			a += math.Pi
		}
		dirs = append(dirs, a)
	}
	sort.Float64s(dirs)
	var uniq []float64
	count := map[int]int{}
	for _, a := range dirs {
		if len(uniq) == 0 || a-uniq[len(uniq)-1] > 1e-9 {
			if len(uniq) > 0 && math.Pi-a < 1e-9 && uniq[0] < 1e-9 {
				count[0]++
				continue
			}
			uniq = append(uniq, a)
		}
		count[len(uniq)-1]++
	}
	nd := len(uniq)
	for i := range uniq {
		if count[i] != count[0] {
			return 0, false
		}
		if i > 0 && math.Abs(uniq[i]-uniq[i-1]-math.Pi/float64(nd)) > 1e-9 {
			return 0, false
		}
	}
	m := l.Spec.Phases
	if nd%m != 0 {
		return 0, false
	}
	n := float64(nd / m)
	delta := math.Pi / float64(nd)
	return math.Sin(n*delta/2) / (n * math.Sin(delta/2)), true
}

// rotationSymmetryBrute tests every rotation by s = 1..Q-1 teeth, not only
// divisors, with the rotor's poles shifted by p*s*360/Q electrical degrees.
func rotationSymmetryBrute(l *Layout) int {
	q := l.Spec.Slots
	p := l.Spec.PolePairs()
	for s := 1; s < q; s++ {
		shift := math.Mod(float64(p*s)*360/float64(q), 360)
		var want int
		switch {
		case math.Abs(shift) < 1e-9:
			want = 1
		case math.Abs(shift-180) < 1e-9:
			want = -1
		default:
			continue
		}
		ok := true
		for k := 1; k <= q && ok; k++ {
			a, okA := l.CoilOn(k)
			b, okB := l.CoilOn((k+s-1)%q + 1)
			ok = okA == okB && (!okA || (a.Phase == b.Phase && int(a.Direction)*want == int(b.Direction)))
		}
		if ok {
			return q / s
		}
	}
	return 1
}

func divisors(n int) []int {
	var d []int
	for i := 1; i <= n; i++ {
		if n%i == 0 {
			d = append(d, i)
		}
	}
	return d
}

func gcdLoop(a, b int) int {
	g := 1
	for d := 1; d <= a && d <= b; d++ {
		if a%d == 0 && b%d == 0 {
			g = d
		}
	}
	return g
}

// TestEveryPair enumerates every three-phase pair up to 120 slots and 120
// poles, both layer counts, and checks each feasible layout against
// independent computations: balance and sequence, the best winding factor
// that exists (phase-band bound), periodicity, LCM and cogging factor,
// rotational symmetry by brute force, harmonic winding factors recomputed from
// the geometry, and equal path phasors for every feasible path count.
func TestEveryPair(t *testing.T) {
	maxQ, maxP := 120, 120
	if testing.Short() {
		maxQ, maxP = 48, 48
	}
	feasible := 0
	for layers := 1; layers <= 2; layers++ {
		for q := 1; q <= maxQ; q++ {
			for poles := 2; poles <= maxP; poles += 2 {
				s := Spec{Slots: q, Poles: poles, Layers: layers}
				l, err := Design(s)
				// Independent feasibility: the coils (all teeth, or the odd
				// teeth) form Q' phasors of t' = gcd(Q', p) repeats of Q'/t'
				// spokes; balance needs Q'/(m t') whole (Bianchi et al. 2006,
				// applied to the wound teeth only for one layer).
				qq := q
				if layers == 1 {
					qq = q / 2
				}
				want := (layers == 2 || q%2 == 0) && qq > 0 && qq%3 == 0 && (qq/gcdLoop(qq, poles/2))%3 == 0
				if (err == nil) != want {
					t.Errorf("Design(%v) err = %v; want feasible = %v", s, err, want)
					continue
				}
				if err != nil {
					continue
				}
				feasible++
				checkLayout(t, l)
			}
		}
	}
	t.Logf("%d feasible pairs checked", feasible)
}

func checkLayout(t *testing.T, l *Layout) {
	t.Helper()
	s := l.Spec
	q, p := s.Slots, s.PolePairs()
	checkBalanceAndSequence(t, l)
	if kd, ok := bestPhaseBand(l); !ok {
		t.Errorf("%v: folded star not equally spaced", s)
	} else if want := math.Abs(math.Sin(float64(p)*math.Pi/float64(q))) * kd; math.Abs(l.WindingFactor-want) > 1e-9 {
		t.Errorf("%v: WindingFactor = %.9f; want best phase band %.9f", s, l.WindingFactor, want)
	}
	if g := gcdLoop(q, p); l.Periodicity != g {
		t.Errorf("%v: Periodicity = %d; want %d", s, l.Periodicity, g)
	}
	if l.LCM%q != 0 || l.LCM%s.Poles != 0 || l.CoggingFactor != gcdLoop(q, s.Poles) {
		t.Errorf("%v: LCM %d cogging %d; want a common multiple and gcd %d", s, l.LCM, l.CoggingFactor, gcdLoop(q, s.Poles))
	}
	if r := rotationSymmetryBrute(l); r != l.Symmetry || l.RadialForceBalanced != (r >= 2) {
		t.Errorf("%v: Symmetry %d balanced %v; brute force gives %d", s, l.Symmetry, l.RadialForceBalanced, r)
	}
	// Double layer: the machine is symmetric unless t = 1 and Q is odd, i.e.
	// radial forces cancel iff gcd(Q, 2p) >= 2 (Zhu et al. 2007, from memory).
	if s.Layers == 2 && l.RadialForceBalanced != (gcdLoop(q, s.Poles) >= 2) {
		t.Errorf("%v: RadialForceBalanced = %v; gcd(Q,2p) = %d", s, l.RadialForceBalanced, gcdLoop(q, s.Poles))
	}
	if len(l.Harmonics) != 3*max(q, p) {
		t.Errorf("%v: %d harmonics; want %d", s, len(l.Harmonics), 3*max(q, p))
	}
	orders := []int{1, 2, 3, p, p + 1, 2*p + 1, 3 * p, q / 2, q/2 + 1, q - 1, q, q + 1, len(l.Harmonics)}
	if q <= 36 {
		orders = orders[:0]
		for nu := 1; nu <= len(l.Harmonics); nu++ {
			orders = append(orders, nu)
		}
	}
	for _, nu := range orders {
		if nu < 1 || nu > len(l.Harmonics) {
			continue
		}
		sum, n := phaseSum(l, 0, 0, nu)
		want := math.Abs(math.Sin(float64(nu)*math.Pi/float64(q))) * abs128(sum) / float64(n)
		if got := l.Harmonics[nu-1]; got.Order != nu || math.Abs(got.WindingFactor-want) > 1e-9 {
			t.Errorf("%v: harmonic %d = %+v; want k_w %.9f", s, nu, got, want)
		}
	}
	// Paths: the feasible counts are the divisors of the symmetry order
	// that divide the coils per phase (orbits of identical coils), and
	// every path of each phase has the same phasor.
	var want []int
	for _, d := range divisors(l.Symmetry) {
		if l.CoilsPerPhase%d == 0 {
			want = append(want, d)
		}
	}
	if !equalInts(l.ParallelPaths, want) {
		t.Errorf("%v: ParallelPaths = %v; want %v (divisors of symmetry order %d)", s, l.ParallelPaths, want, l.Symmetry)
	}
	for _, a := range l.ParallelPaths[1:] {
		s2 := s
		s2.Paths = a
		l2, err := Design(s2)
		if err != nil {
			t.Errorf("Design(%v, paths %d) = %v", s, a, err)
			continue
		}
		checkPaths(t, l2)
	}
}

func checkPaths(t *testing.T, l *Layout) {
	t.Helper()
	p := l.Spec.PolePairs()
	for ph := 0; ph < l.Spec.Phases; ph++ {
		ref, nref := phaseSum(l, ph, 1, p)
		for path := 2; path <= l.Spec.Paths; path++ {
			sum, n := phaseSum(l, ph, path, p)
			if n != nref || abs128(sum-ref) > 1e-9 {
				t.Errorf("%v paths %d: phase %d path %d phasor %v (%d coils); path 1 %v (%d)", l.Spec, l.Spec.Paths, ph, path, sum, n, ref, nref)
			}
		}
	}
	seen := map[int]bool{}
	for _, ch := range l.Chains {
		for i, tooth := range ch.Teeth {
			c, ok := l.CoilOn(tooth)
			if !ok || seen[tooth] || c.Phase != ch.Phase || c.Path != ch.Path || c.Position != i+1 {
				t.Errorf("%v: chain %s path %d tooth %d (coil %+v) out of place", l.Spec, ch.Start, ch.Path, tooth, c)
			}
			seen[tooth] = true
		}
	}
	if len(seen) != len(l.Coils) {
		t.Errorf("%v: chains hold %d coils; want %d", l.Spec, len(seen), len(l.Coils))
	}
}

func equalInts(a, b []int) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if a[i] != b[i] {
			return false
		}
	}
	return true
}
