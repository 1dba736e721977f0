package verify

import (
	"math"

	"coilwright/winding"
	"coilwright/winding/plan"
)

// StarPhases returns the phase resistances of a star winding from its
// line-to-line readings: R_UV = R_U + R_V and rotations, so
// R_U = (R_UV + R_WU − R_VW)/2, R_V = (R_UV + R_VW − R_WU)/2,
// R_W = (R_VW + R_WU − R_UV)/2. An open reading gives +Inf for both phases it
// touches (and NaN is never returned: a phase whose value cannot be told is +Inf).
func StarPhases(uv, vw, wu float64) [3]float64 {
	if math.IsInf(uv, 1) || math.IsInf(vw, 1) || math.IsInf(wu, 1) {
		return starOpen(uv, vw, wu)
	}
	return [3]float64{(uv + wu - vw) / 2, (uv + vw - wu) / 2, (vw + wu - uv) / 2}
}

// starOpen: a phase is open when both readings that include it are open; the
// others are half the finite reading that joins them (if any).
func starOpen(uv, vw, wu float64) [3]float64 {
	inf := math.Inf(1)
	ou, ov, ow := math.IsInf(uv, 1) && math.IsInf(wu, 1), math.IsInf(uv, 1) && math.IsInf(vw, 1), math.IsInf(vw, 1) && math.IsInf(wu, 1)
	out := [3]float64{inf, inf, inf}
	switch {
	case ou && !ov && !ow:
		out[1], out[2] = vw/2, vw/2
	case ov && !ou && !ow:
		out[0], out[2] = wu/2, wu/2
	case ow && !ou && !ov:
		out[0], out[1] = uv/2, uv/2
	}
	return out
}

// StarLines is the forward conversion: the line-to-line readings of a star
// winding of phases u, v, w (UV, VW, WU).
func StarLines(ph [3]float64) [3]float64 {
	return [3]float64(plan.LineOhms(winding.Star, ph[:]))
}

// DeltaLines is the forward conversion for a delta of phases Ru (between lines
// U and V), Rv (V–W), Rw (W–U): across each phase the other two are in
// parallel with it, so R_UV = Ru(Rv+Rw)/S, R_VW = Rv(Rw+Ru)/S,
// R_WU = Rw(Ru+Rv)/S with S = Ru+Rv+Rw.
func DeltaLines(ph [3]float64) [3]float64 {
	return [3]float64(plan.LineOhms(winding.Delta, ph[:]))
}

// DeltaPhases inverts DeltaLines exactly.
//
// Derivation. A delta seen from its three terminals is the same network as a
// star of legs a (at U), b (at V), c (at W) with a = Ru·Rw/S, b = Ru·Rv/S,
// c = Rv·Rw/S (the delta–star transform: each leg is the product of the two
// phases meeting at that terminal over S). Line readings of that star are
// R_UV = a + b, R_VW = b + c, R_WU = c + a — check: a + b = Ru(Rw + Rv)/S, the
// parallel formula above. So a, b, c follow from StarPhases. Back to the delta:
// ab + bc + ca = Ru·Rv·Rw·(Rw + Rv + Ru)/S² = Ru·Rv·Rw/S, and dividing by c
// = Rv·Rw/S leaves Ru. Hence Ru = Σ/c, Rv = Σ/a, Rw = Σ/b with
// Σ = ab + bc + ca. A leg a, b or c at or below zero means the readings fit no
// delta of positive phases: the phases opposite it read +Inf (open).
//
// Check on a balanced delta of R: R_LL = R·2R/3R = 2R/3, a = b = c = R/3,
// Σ = R²/3, Σ/c = R.
func DeltaPhases(uv, vw, wu float64) [3]float64 {
	inf := math.Inf(1)
	if math.IsInf(uv, 1) || math.IsInf(vw, 1) || math.IsInf(wu, 1) {
		// An open line reading in a delta needs two open phases; tell nothing more.
		return [3]float64{inf, inf, inf}
	}
	leg := StarPhases(uv, vw, wu) // a (U), b (V), c (W)
	a, b, c := leg[0], leg[1], leg[2]
	sum := a*b + b*c + c*a
	div := func(x float64) float64 {
		if x <= 0 || sum <= 0 {
			return inf
		}
		return sum / x
	}
	return [3]float64{div(c), div(a), div(b)}
}

// IRTo40C corrects an insulation resistance measured at tempC to 40 °C by
// IEEE 43's approximation that it halves for every 10 K rise:
// IR_40 = IR_T · 0.5^((40 − T)/10) (IEEE 43-2013 clause on temperature
// correction, from memory; the standard prefers measured curves).
func IRTo40C(mohm, tempC float64) float64 {
	return mohm * math.Pow(0.5, (40-tempC)/10)
}
