package wire

import (
	"errors"
	"math"
	"testing"
)

// IEC 60028 (International Annealed Copper Standard): resistivity 1/58
// Ω·mm²/m = 0.017241 at 20 °C, temperature coefficient 0.00393 /K at 20 °C.
func TestCopperConstantsIEC60028(t *testing.T) {
	cases := []struct {
		name      string
		got, want float64
		tol       float64
	}{
		{"resistivity at 20 °C (IEC 60028)", Resistivity20, 0.017241, 5e-7},
		{"coefficient = 1/(234.5+20) (IEC 60028)", 1 / (InferredZeroC + 20), Alpha20, 1e-6},
		{"density g/cm³ (IEC 60028, from memory)", DensityGPerCm3, 8.89, 0},
	}
	for _, c := range cases {
		if math.Abs(c.got-c.want) > c.tol {
			t.Errorf("%s = %.7f; want %.7f", c.name, c.got, c.want)
		}
	}
}

// R_T = R_20·(234.5+T)/254.5 (IEC 60028), checked against the linear form
// R_20·(1 + 0.00393·(T−20)) of the same standard, which agrees to a few parts
// in 10⁵ since 0.00393 is 1/254.5 rounded.
func TestResistanceAt(t *testing.T) {
	cases := []struct {
		name string
		temp float64
		want float64 // R_T / R_20
	}{
		{"at 20 °C", 20, 1},
		{"at 0 °C: 234.5/254.5", 0, 0.921415},
		{"at 15 °C: 249.5/254.5", 15, 0.980354},
		{"at 40 °C: 274.5/254.5", 40, 1.078585},
		{"at 75 °C: 309.5/254.5", 75, 1.216110},
		{"at 115 °C: 349.5/254.5", 115, 1.373281},
	}
	for _, c := range cases {
		got := ResistanceAt(1, c.temp)
		if math.Abs(got-c.want) > 2e-6 {
			t.Errorf("ResistanceAt(1, %g) = %.6f; want %.6f", c.temp, got, c.want)
		}
		lin := 1 + Alpha20*(c.temp-20)
		if math.Abs(got-lin) > 1e-4 {
			t.Errorf("ResistanceAt(1, %g) = %.6f; linear IEC 60028 form gives %.6f", c.temp, got, lin)
		}
		if back := To20(got, c.temp); math.Abs(back-1) > 1e-12 {
			t.Errorf("To20(ResistanceAt(1, %g)) = %.12f; want 1", c.temp, back)
		}
	}
}

// Worked by hand: 100 m of 1.000 mm wire: A = π/4 = 0.785398 mm²,
// R = 100/58/0.785398 = 2.195 Ω; mass = 100 m × 0.785398 mm² = 78.54 cm³ ×
// 8.89 g/cm³ = 698.2 g.
func TestResistanceAndMass(t *testing.T) {
	a := Area(1)
	if math.Abs(a-0.785398) > 1e-6 {
		t.Errorf("Area(1) = %.6f; want 0.785398", a)
	}
	if r := Resistance20(100, a); math.Abs(r-2.19525) > 1e-5 {
		t.Errorf("Resistance20(100, %.6f) = %.5f; want 2.19525", a, r)
	}
	if m := MassKg(100, a); math.Abs(m-0.69822) > 1e-5 {
		t.Errorf("MassKg(100, %.6f) = %.5f; want 0.69822", a, m)
	}
	if r := Resistance20(1, 0); !math.IsInf(r, 1) {
		t.Errorf("Resistance20(1, 0) = %g; want +Inf", r)
	}
}

// ASTM B258: d = 0.127 mm · 92^((36−n)/39). The values below are the
// standard's table to three decimals (from memory; each follows from the
// formula).
func TestAWGDiameterASTMB258(t *testing.T) {
	cases := []struct {
		awg  int
		want float64
	}{
		{-3, 11.684}, // 0000
		{0, 8.252},
		{10, 2.588},
		{14, 1.628},
		{18, 1.024},
		{20, 0.812},
		{24, 0.511},
		{30, 0.255},
		{36, 0.127},
		{40, 0.0799},
	}
	for _, c := range cases {
		got, err := AWGDiameter(c.awg)
		if err != nil {
			t.Errorf("AWGDiameter(%d): %v", c.awg, err)
			continue
		}
		if math.Abs(got-c.want) > 0.0006 {
			t.Errorf("AWGDiameter(%d) = %.4f; want %.4f", c.awg, got, c.want)
		}
	}
	for _, n := range []int{-4, 57, 1000} {
		_, err := AWGDiameter(n)
		var re *RangeError
		if !errors.As(err, &re) {
			t.Errorf("AWGDiameter(%d) error = %v; want *RangeError", n, err)
		}
	}
	// Every six gauges halve the diameter, about (ASTM B258 construction: 92^(6/39) = 2.006).
	d10, _ := AWGDiameter(10)
	d16, _ := AWGDiameter(16)
	if r := d10 / d16; math.Abs(r-2.006) > 0.001 {
		t.Errorf("AWGDiameter(10)/AWGDiameter(16) = %.4f; want 2.006", r)
	}
}

// IEC 60317-0-1 Table 1 (partly from memory, cross-checked against its
// Indian adoption IS 13730-0-1).
func TestEnamelIEC60317(t *testing.T) {
	cases := []struct {
		bare         float64
		tol, g1, g2  float64
		interpolated bool
		tolerance    float64
		name         string
	}{
		{0.200, 0.003, 0.226, 0.239, false, 1e-9, "0.200 mm"},
		{0.250, 0.004, 0.281, 0.297, false, 1e-9, "0.250 mm"},
		{0.315, 0.004, 0.349, 0.367, false, 1e-9, "0.315 mm"},
		{0.400, 0.005, 0.439, 0.459, false, 1e-9, "0.400 mm"},
		{0.500, 0.005, 0.544, 0.566, false, 1e-9, "0.500 mm"},
		{0.630, 0.006, 0.679, 0.704, false, 1e-9, "0.630 mm"},
		{0.800, 0.008, 0.855, 0.884, false, 1e-9, "0.800 mm"},
		{0.900, 0.009, 0.959, 0.989, false, 1e-9, "0.900 mm"},
		{1.000, 0.010, 1.062, 1.094, false, 1e-9, "1.000 mm"},
		{1.120, 0.011, 1.184, 1.217, false, 1e-9, "1.120 mm"},
		{1.250, 0.013, 1.316, 1.349, false, 1e-9, "1.250 mm"},
		{1.600, 0.016, 1.670, 1.706, false, 1e-9, "1.600 mm"},
		{2.000, 0.020, 2.074, 2.112, false, 1e-9, "2.000 mm"},
		// Intermediate sizes of the standard, interpolated here; the
		// standard lists 0.710 mm: ±0.007, 0.762 / 0.789 (from memory), and
		// 1.400 mm: ±0.014, 1.468 / 1.502 (from memory).
		{0.710, 0.007, 0.762, 0.789, true, 0.003, "0.710 mm interpolated"},
		{1.400, 0.014, 1.468, 1.502, true, 0.003, "1.400 mm interpolated"},
	}
	for _, c := range cases {
		for grade, want := range map[int]float64{1: c.g1, 2: c.g2} {
			e, err := EnamelFor(c.bare, grade)
			if err != nil {
				t.Errorf("EnamelFor(%g, %d): %v", c.bare, grade, err)
				continue
			}
			if math.Abs(e.MaxOverallMM-want) > c.tolerance {
				t.Errorf("%s: EnamelFor(%g, %d).MaxOverallMM = %.4f; want %.3f", c.name, c.bare, grade, e.MaxOverallMM, want)
			}
			if math.Abs(e.TolMM-c.tol) > math.Max(c.tolerance, 1e-9) {
				t.Errorf("%s: EnamelFor(%g, %d).TolMM = %.4f; want %.3f", c.name, c.bare, grade, e.TolMM, c.tol)
			}
			if e.Interpolated != c.interpolated {
				t.Errorf("%s: EnamelFor(%g, %d).Interpolated = %v; want %v", c.name, c.bare, grade, e.Interpolated, c.interpolated)
			}
		}
	}
}

func TestEnamelRefusals(t *testing.T) {
	cases := []struct {
		name  string
		bare  float64
		grade int
	}{
		{"grade 3 does not exist here", 0.5, 3},
		{"grade 0", 0.5, 0},
		{"finer than the table", 0.1, 1},
		{"coarser than the table", 2.5, 2},
		{"NaN", math.NaN(), 1},
	}
	for _, c := range cases {
		_, err := EnamelFor(c.bare, c.grade)
		var re *RangeError
		if !errors.As(err, &re) {
			t.Errorf("%s: EnamelFor(%g, %d) error = %v; want *RangeError", c.name, c.bare, c.grade, err)
		}
	}
	if tol := ToleranceFor(3); math.Abs(tol-0.03) > 1e-12 {
		t.Errorf("ToleranceFor(3) = %g; want 0.03 (1 %% outside the table)", tol)
	}
}
