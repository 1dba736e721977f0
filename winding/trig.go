package winding

import "math"

// trigTable holds cos and sin of k*180/Q degrees for k = 0..2Q-1.
type trigTable struct{ cos, sin []float64 }

// Only the first quarter is computed; the rest follows exactly from
// sin(pi-x) = sin x, cos(pi-x) = -cos x and sin(pi+x) = -sin x,
// cos(pi+x) = -cos x, so mirrored angles give mirrored values.
func newTrigTable(q int) trigTable {
	return trigTable{cos: make([]float64, 2*q), sin: make([]float64, 2*q)}.fill(q)
}

// fill computes the table of q in t's storage (len 2q).
func (t trigTable) fill(q int) trigTable {
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
