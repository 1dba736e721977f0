package wire

import "math"

// Annealed copper, IEC 60028 (International Annealed Copper Standard).
const (
	// Resistivity20 is the resistivity at 20 °C in Ω·mm²/m: 1/58 (IEC 60028).
	Resistivity20 = 1.0 / 58
	// Alpha20 is the temperature coefficient of resistance at 20 °C in 1/K
	// (IEC 60028): 0.00393, the reciprocal of 254.5 K.
	Alpha20 = 0.00393
	// InferredZeroC is the temperature at which the resistance of annealed
	// copper would extrapolate to zero: 234.5 °C below zero (IEC 60028;
	// 1/Alpha20 - 20). IEC 60034-1 rounds it to 235 in its resistance method
	// (from memory).
	InferredZeroC = 234.5
	// DensityGPerCm3 is the density of annealed copper in g/cm³, 8.89
	// (IEC 60028, from memory).
	DensityGPerCm3 = 8.89
)

// Area returns the cross-section in mm² of a round conductor of diameter d mm.
func Area(d float64) float64 { return math.Pi * d * d / 4 }

// Resistance20 returns the resistance at 20 °C of lengthM metres of copper of
// total cross-section areaMM2: R = ρ·L/A (IEC 60028 resistivity).
func Resistance20(lengthM, areaMM2 float64) float64 {
	if areaMM2 <= 0 {
		return math.Inf(1)
	}
	return Resistivity20 * lengthM / areaMM2
}

// ResistanceAt corrects a resistance at 20 °C to tempC:
// R_T = R_20·(234.5 + T)/(234.5 + 20) (IEC 60028).
func ResistanceAt(r20, tempC float64) float64 {
	return r20 * (InferredZeroC + tempC) / (InferredZeroC + 20)
}

// To20 refers a resistance measured at tempC back to 20 °C, the inverse of
// ResistanceAt.
func To20(r, tempC float64) float64 {
	return r * (InferredZeroC + 20) / (InferredZeroC + tempC)
}

// MassKg returns the mass of lengthM metres of copper of cross-section
// areaMM2 (density from IEC 60028): 1 m of 1 mm² is 1 cm³.
func MassKg(lengthM, areaMM2 float64) float64 {
	return lengthM * areaMM2 * DensityGPerCm3 / 1000
}
