package wire_test

import (
	"fmt"

	"coilwright/winding/wire"
)

func ExampleAWGDiameter() {
	d, _ := wire.AWGDiameter(20)
	fmt.Printf("AWG 20 = %.3f mm, %.3f mm²\n", d, wire.Area(d))
	// Output: AWG 20 = 0.812 mm, 0.518 mm²
}

func ExampleResistanceAt() {
	r20 := wire.Resistance20(12.5, wire.Area(0.8)) // 12.5 m of 0.8 mm wire
	fmt.Printf("%.4f Ω at 20 °C, %.4f Ω at 40 °C\n", r20, wire.ResistanceAt(r20, 40))
	// Output: 0.4288 Ω at 20 °C, 0.4625 Ω at 40 °C
}

func ExampleEnamelFor() {
	e, _ := wire.EnamelFor(0.5, 2)
	fmt.Printf("0.500 mm grade 2: at most %.3f mm overall, bare ±%.3f mm\n", e.MaxOverallMM, e.TolMM)
	// Output: 0.500 mm grade 2: at most 0.566 mm overall, bare ±0.005 mm
}

func ExampleTo20() {
	// 0.1430 Ω read at 27 °C is 0.1392 Ω at 20 °C (IEC 60028 copper).
	fmt.Printf("%.4f\n", wire.To20(0.1430, 27))
	// Output:
	// 0.1392
}
