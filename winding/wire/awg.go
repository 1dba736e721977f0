package wire

import (
	"fmt"
	"math"
)

// AWG sizes this package accepts: 0000 (written -3) to 56, the range of the
// ASTM B258 formula's table.
const (
	MinAWG = -3
	MaxAWG = 56
)

// AWGDiameter returns the nominal bare diameter in mm of American Wire Gauge
// n (0 for AWG 0, -1 for 00, -2 for 000, -3 for 0000), by ASTM B258:
// d = 0.127 mm · 92^((36 − n)/39). AWG 20 is 0.812 mm, AWG 24 0.511 mm.
func AWGDiameter(n int) (float64, error) {
	if n < MinAWG || n > MaxAWG {
		return 0, &RangeError{Quantity: "awg", Value: float64(n),
			Reason: fmt.Sprintf("outside the ASTM B258 range %d (0000) to %d", MinAWG, MaxAWG)}
	}
	return 0.127 * math.Pow(92, float64(36-n)/39), nil
}

// RangeError reports a value outside the range of a table or formula.
type RangeError struct {
	Quantity string
	Value    float64
	Reason   string
}

func (e *RangeError) Error() string {
	return fmt.Sprintf("wire: %s = %g: %s", e.Quantity, e.Value, e.Reason)
}
