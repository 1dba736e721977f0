package wire

import (
	"fmt"
	"sort"
)

// enamelRow is one line of IEC 60317-0-1 Table 1 for enamelled round copper
// wire: the nominal bare diameter, its tolerance (±) and the maximum overall
// diameter of grade 1 and grade 2 enamel. Values partly from memory,
// cross-checked against the Indian adoption of the same standard,
// IS 13730-0-1. Grade 1 at 0.400 mm is given as 0.439 (0.441 in one reading).
type enamelRow struct {
	nominal, tol, grade1, grade2 float64
}

var enamelTable = []enamelRow{
	{0.200, 0.003, 0.226, 0.239},
	{0.250, 0.004, 0.281, 0.297},
	{0.315, 0.004, 0.349, 0.367},
	{0.400, 0.005, 0.439, 0.459},
	{0.500, 0.005, 0.544, 0.566},
	{0.630, 0.006, 0.679, 0.704},
	{0.800, 0.008, 0.855, 0.884},
	{0.900, 0.009, 0.959, 0.989},
	{1.000, 0.010, 1.062, 1.094},
	{1.120, 0.011, 1.184, 1.217},
	{1.250, 0.013, 1.316, 1.349},
	{1.600, 0.016, 1.670, 1.706},
	{2.000, 0.020, 2.074, 2.112},
}

// Range of bare diameters the enamel table covers, in mm.
const (
	MinEnamelMM = 0.200
	MaxEnamelMM = 2.000
)

// Enamel is the build of one enamelled wire.
type Enamel struct {
	BareMM       float64 // nominal bare diameter
	Grade        int     // 1 or 2
	TolMM        float64 // tolerance on the bare diameter, ±
	MaxOverallMM float64 // maximum overall diameter with enamel
	// Interpolated is true when the bare diameter is not a row of the table and
	// the tolerance and enamel increase were interpolated linearly between the
	// neighbouring rows (the intermediate sizes of the standard follow the same
	// smooth progression; common practice).
	Interpolated bool
}

// EnamelFor returns the IEC 60317-0-1 tolerance and maximum overall diameter of
// a bare diameter in mm and an enamel grade (1 or 2).
func EnamelFor(bareMM float64, grade int) (Enamel, error) {
	if grade != 1 && grade != 2 {
		return Enamel{}, &RangeError{Quantity: "grade", Value: float64(grade),
			Reason: "IEC 60317 enamel grade must be 1 (thin) or 2 (thick); or give the measured overall diameter"}
	}
	if !(bareMM >= MinEnamelMM-1e-9 && bareMM <= MaxEnamelMM+1e-9) {
		return Enamel{}, &RangeError{Quantity: "bare diameter", Value: bareMM,
			Reason: fmt.Sprintf("outside the enamel table (%.3f to %.3f mm); give the measured overall diameter instead", MinEnamelMM, MaxEnamelMM)}
	}
	i := sort.Search(len(enamelTable), func(i int) bool { return enamelTable[i].nominal >= bareMM-1e-9 })
	r := enamelTable[i]
	pick := func(r enamelRow) float64 {
		if grade == 1 {
			return r.grade1
		}
		return r.grade2
	}
	if abs(r.nominal-bareMM) < 1e-9 {
		return Enamel{BareMM: bareMM, Grade: grade, TolMM: r.tol, MaxOverallMM: pick(r)}, nil
	}
	lo := enamelTable[i-1]
	f := (bareMM - lo.nominal) / (r.nominal - lo.nominal)
	inc := (pick(lo) - lo.nominal) + f*((pick(r)-r.nominal)-(pick(lo)-lo.nominal))
	tol := lo.tol + f*(r.tol-lo.tol)
	return Enamel{BareMM: bareMM, Grade: grade, TolMM: tol, MaxOverallMM: bareMM + inc, Interpolated: true}, nil
}

// ToleranceFor returns the IEC 60317-0-1 tolerance on a bare diameter (±mm),
// interpolated between rows, or 1 % of the diameter outside the table (common
// practice for the finer and coarser sizes).
func ToleranceFor(bareMM float64) float64 {
	e, err := EnamelFor(bareMM, 1)
	if err != nil {
		return 0.01 * bareMM
	}
	return e.TolMM
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}
