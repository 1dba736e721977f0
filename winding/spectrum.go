package winding

import "math"

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
