package winding

import (
	"bytes"
	"encoding/binary"
)

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
	codes := make([]byte, len(l.Coils))
	for i, c := range l.Coils {
		codes[i] = coilCode(c.Phase, c.Direction == CCW)
	}
	rs := rotations{q: q, p: p, step: 3 - l.Spec.Layers, codes: codes}
	l.Symmetry = 1
	for s := 1; s < q; s++ {
		if q%s == 0 && rs.maps(s) {
			l.Symmetry = q / s
			break
		}
	}
	l.RadialForceBalanced = l.Symmetry >= 2
	t := l.Periodicity
	if (q/t)%2 == 0 {
		half := q / (2 * t)
		l.Antiperiodic = (p*half)%q*2 == q && rs.maps(half)
	}
}

// coilCode packs a coil's phase and sense into one byte, phase*2 + 1 for a
// reversed (CCW) coil, so that a reversed coil of the same phase differs in
// the lowest bit only.
func coilCode(phase int, reversed bool) byte {
	c := byte(phase) * 2
	if reversed {
		c++
	}
	return c
}

// rotations tests rotations of a layout given as the codes of its coils in
// tooth order (coilCode; with one layer, the coils of the odd teeth).
type rotations struct {
	q, p, step int
	codes      []byte
}

// maps tests a rotation by s teeth; see analyseSymmetry.
func (r rotations) maps(s int) bool {
	x := (r.p * s) % r.q
	var reversed bool // the rotor turns onto itself with every pole reversed
	switch {
	case x == 0:
	case 2*x == r.q:
		reversed = true
	default:
		return false
	}
	// With one layer an odd rotation carries wound teeth onto unwound ones.
	if r.step == 2 && s%2 != 0 {
		return false
	}
	return rotatedEqual(r.codes, s/r.step, reversed)
}

// rotatedEqual reports whether codes[(i+c) mod n] is codes[i] for every i,
// or codes[i] reversed (lowest bit flipped) when reversed is set.
func rotatedEqual(codes []byte, c int, reversed bool) bool {
	n := len(codes)
	if reversed {
		return equalReversed(codes[:n-c], codes[c:]) && equalReversed(codes[n-c:], codes[:c])
	}
	return bytes.Equal(codes[:n-c], codes[c:]) && bytes.Equal(codes[n-c:], codes[:c])
}

// equalReversed reports whether b[i] is a[i] with its lowest bit flipped for
// every i (len(a) == len(b)), eight codes at a time.
func equalReversed(a, b []byte) bool {
	const ones = 0x0101010101010101
	i := 0
	for ; i+8 <= len(a); i += 8 {
		if binary.LittleEndian.Uint64(a[i:])^binary.LittleEndian.Uint64(b[i:]) != ones {
			return false
		}
	}
	for ; i < len(a); i++ {
		if a[i]^b[i] != 1 {
			return false
		}
	}
	return true
}
