package plan

import (
	"math"
	"math/cmplx"

	"coilwright/winding"
)

// Mu0 is the magnetic constant, 4π·10⁻⁷ H/m (to the precision that matters
// here; CODATA 2018 differs in the tenth figure).
const Mu0 = 4 * math.Pi * 1e-7

// Inductance is the synchronous inductance of one phase as the sum of its
// parts, each in mH, with the figures they were computed from.
type Inductance struct {
	MagnetisingMH       float64 `json:"magnetising_mh"`       // the working harmonic (order p) across the air gap
	HarmonicLeakageMH   float64 `json:"harmonic_leakage_mh"`  // every other order of the winding's MMF across the air gap
	SlotLeakageMH       float64 `json:"slot_leakage_mh"`      // across the slot, over the coil sides
	ToothTipLeakageMH   float64 `json:"tooth_tip_leakage_mh"` // tip to tip, across the slot opening and through the gap
	EndWindingLeakageMH float64 `json:"end_winding_leakage_mh"`

	EffectiveAirGapMM     float64 `json:"effective_air_gap_mm"` // Carter factor × (gap + magnet/μ_rec)
	CarterFactor          float64 `json:"carter_factor"`
	HarmonicLeakageFactor float64 `json:"harmonic_leakage_factor"` // σ_δ = Σ_ν≠p (k_ν/ν)² / (k_p/p)²
	SlotPermeance         float64 `json:"slot_permeance"`          // λ of the conductor region (SlotPermeance; h/(3b) for parallel sides)
	ToothTipPermeance     float64 `json:"tooth_tip_permeance"`     // λ of the opening and the tip-to-tip gap field
	SlotCoupling          float64 `json:"slot_coupling"`           // Σ over the phase's coil sides of Re(Σ slot currents / own current)
	EndWindingPermeance   float64 `json:"end_winding_permeance"`   // λ per metre of end turn
}

// Total returns the phase inductance in mH: the sum of the parts.
func (i Inductance) Total() float64 {
	return i.MagnetisingMH + i.HarmonicLeakageMH + i.SlotLeakageMH + i.ToothTipLeakageMH + i.EndWindingLeakageMH
}

// EndWindingPermeance is the permeance factor of a tooth coil's end turns
// per metre of end-turn length: short end windings close to the iron lie at
// about 0.2–0.5 (Pyrhönen, Jokinen, Hrabovcová, Design of Rotating Electrical
// Machines, ch. 4, end-winding leakage; from memory); 0.3 is taken.
const EndWindingPermeance = 0.3

// CarterFactor returns Carter's coefficient of a slotted surface of slot
// pitch tauS with openings b0 facing a gap g (all in the same unit):
// k_C = τ_s/(τ_s − γ·g), γ = (b0/g)²/(5 + b0/g) (Pyrhönen et al., ch. 3;
// from memory).
func CarterFactor(tauS, b0, g float64) float64 {
	if g <= 0 || b0 <= 0 {
		return 1
	}
	r := b0 / g
	den := tauS - r*r/(5+r)*g
	if den <= 0 {
		return math.Inf(1) // an opening as wide as the pitch: no tooth face
	}
	return tauS / den
}

// SlotPermeance returns the leakage permeance factor λ of the conductor
// region of a slot h deep whose width runs from bBottom at its closed end
// (the yoke) to bTop under the tooth tips, the conductors filling it
// evenly: the field across the slot at a height y above the bottom carries
// the current of the conductors below y, so λ = ∫₀^h (A(y)/A)²/b(y) dy, A(y)
// the area below y (the slot's magnetic energy over μ0·l·(N·I)²/2;
// Pyrhönen, Jokinen, Hrabovcová, Design of Rotating Electrical Machines,
// ch. 4, slot leakage; from memory). A parallel slot gives h/(3b); a slot
// narrow at the yoke less, one narrow under the tips more. Any width ≤ 0
// gives 0. The integral is taken by Simpson's rule over 64 strips, exact to
// about 10⁻⁹ for any trapezoid of a real stator.
func SlotPermeance(h, bTop, bBottom float64) float64 {
	if !(h > 0) || !(bTop > 0) || !(bBottom > 0) {
		return 0
	}
	area := h * (bTop + bBottom) / 2
	f := func(y float64) float64 {
		b := bBottom + (bTop-bBottom)*y/h
		a := y * (bBottom + b) / 2 / area
		return a * a / b
	}
	const n = 64
	dy := h / n
	sum := f(0) + f(h)
	for i := 1; i < n; i++ {
		w := 2.0
		if i%2 == 1 {
			w = 4
		}
		sum += w * f(float64(i)*dy)
	}
	return sum * dy / 3
}

// AirGapInductance returns the inductance of one phase of m phases, N series
// turns, across an effective gap gEff on a diameter d and stack length l
// (metres), from the m-phase MMF wave of spatial order nu (pole pairs) with
// winding factor k: L_ν = m·μ0·d·l·(N·k)²/(π·ν²·g_ef) (the magnetising
// inductance of Pyrhönen et al., ch. 4, written for any order ν; derived in
// the tests).
func AirGapInductance(m int, n, k float64, nu int, d, l, gEff float64) float64 {
	return float64(m) * Mu0 * d * l * (n * k) * (n * k) / (math.Pi * float64(nu*nu) * gEff)
}

// mmfSum returns Σ (k_ν/ν)² over every spatial order of the layout's m-phase
// MMF and its term at the working order p. The MMF winding factor repeats with
// period Q in ν (package winding), so orders beyond those listed are read from
// the first Q; the sum runs to 64·Q and the tail beyond is closed by its mean
// k² over a period times Σ_{ν>K} 1/ν² ≈ 1/K.
func mmfSum(l *winding.Layout) (total, working float64) {
	q := l.Spec.Slots
	p := l.Spec.Poles / 2
	k := make([]float64, q) // k[r] for ν ≡ r (mod Q)
	var mean float64
	for _, h := range l.Harmonics {
		if h.Order <= q {
			k[h.Order%q] = h.MMFWindingFactor
		}
	}
	for _, v := range k {
		mean += v * v
	}
	mean /= float64(q)
	kmax := 64 * q
	for nu := 1; nu <= kmax; nu++ {
		kv := k[nu%q]
		total += kv * kv / float64(nu*nu)
	}
	total += mean / float64(kmax)
	kp := k[p%q]
	return total, kp * kp / float64(p*p)
}

// slotCoupling returns, for the phase of index ph, the sum over its coil
// sides of Re(Σ currents in the same slot / its own current): with balanced
// currents each coil side's leakage flux across the slot is driven by every
// conductor in that slot. Side-by-side coil sides of a double-layer slot
// share the whole cross-slot field, so their mutual permeance equals the self
// permeance (the field at a height y encloses both sides' currents in the
// ratio y/h); a single-layer slot holds one side. A coil on tooth k carries
// its current one way in slot k and the other way in slot k−1.
func slotCoupling(l *winding.Layout, ph int) float64 {
	q := l.Spec.Slots
	m := float64(l.Spec.Phases)
	current := func(c winding.Coil) complex128 {
		i := cmplx.Rect(1, -2*math.Pi*float64(c.Phase)/m)
		if c.Direction == winding.CCW {
			i = -i
		}
		return i
	}
	right := func(c winding.Coil) int { return (c.Tooth - 1) % q }    // slot k, as an index
	left := func(c winding.Coil) int { return (c.Tooth - 2 + q) % q } // slot k−1
	slot := make([]complex128, q)                                     // Σ conductor currents per slot, unit phase current
	for _, c := range l.Coils {
		slot[right(c)] += current(c)
		slot[left(c)] -= current(c)
	}
	var sum float64
	for _, c := range l.Coils {
		if c.Phase != ph {
			continue
		}
		i := current(c)
		sum += real(slot[right(c)]/i) + real(slot[left(c)]/(-i))
	}
	return sum
}
