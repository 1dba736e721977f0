package winding

// analyseSymmetry finds the machine's rotational symmetry by testing it: a
// rotation by s teeth is a symmetry when it maps every coil onto a coil of the
// same phase and the rotor onto itself (same directions, p*s/Q whole), or every
// coil onto a reversed coil of the same phase and the rotor onto itself with
// every pole reversed (p*s/Q a half-integer): the field is then the same or
// its negative everywhere, and forces, which go with its square, repeat. With
// such a symmetry of order r >= 2 the radial forces on the rotor cancel (Zhu,
// Ishak, Howe, Chen, IEEE Trans. Ind. Appl. 2007 discuss the unbalanced pull of
// machines without it, e.g. 9/8 and 3/2).
func (l *Layout) analyseSymmetry() {
	q := l.Spec.Slots
	p := l.Spec.PolePairs()
	l.Symmetry = 1
	for s := 1; s < q; s++ {
		if q%s != 0 {
			continue
		}
		if l.rotationMaps(s, p) {
			l.Symmetry = q / s
			break
		}
	}
	l.RadialForceBalanced = l.Symmetry >= 2
	t := l.Periodicity
	if (q/t)%2 == 0 {
		half := q / (2 * t)
		l.Antiperiodic = (p*half)%q*2 == q && l.rotationMaps(half, p)
	}
}

// rotationMaps tests a rotation by s teeth; see analyseSymmetry.
func (l *Layout) rotationMaps(s, p int) bool {
	q := l.Spec.Slots
	x := (p * s) % q
	var want int // +1: same coils, -1: reversed coils
	switch {
	case x == 0:
		want = 1
	case 2*x == q:
		want = -1
	default:
		return false
	}
	for t := 1; t <= q; t++ {
		a, okA := l.CoilOn(t)
		b, okB := l.CoilOn((t+s-1)%q + 1)
		if okA != okB {
			return false
		}
		if !okA {
			continue
		}
		if a.Phase != b.Phase || a.Direction.Sign()*want != b.Direction.Sign() {
			return false
		}
	}
	return true
}
