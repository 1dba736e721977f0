package winding

import "fmt"

func gcd(a, b int) int {
	if a < 0 {
		a = -a
	}
	if b < 0 {
		b = -b
	}
	for b != 0 {
		a, b = b, a%b
	}
	return a
}

func lcm(a, b int) int { return a / gcd(a, b) * b }

// Fraction is a reduced ratio of whole numbers, e.g. q = 2/5.
type Fraction struct{ Num, Den int }

// NewFraction reduces n/d (d > 0).
func NewFraction(n, d int) Fraction {
	g := gcd(n, d)
	if g == 0 {
		return Fraction{0, 1}
	}
	return Fraction{n / g, d / g}
}

// Float returns the value.
func (f Fraction) Float() float64 { return float64(f.Num) / float64(f.Den) }

func (f Fraction) String() string {
	if f.Den == 1 {
		return fmt.Sprintf("%d", f.Num)
	}
	return fmt.Sprintf("%d/%d", f.Num, f.Den)
}
