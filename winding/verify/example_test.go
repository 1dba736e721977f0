package verify_test

import (
	"fmt"

	"coilwright/winding/job"
	"coilwright/winding/plan"
	"coilwright/winding/verify"
	"coilwright/winding/wire"
)

func ExampleStarPhases() {
	// Line-to-line readings of a star winding, ohm.
	ph := verify.StarPhases(2.1, 2.3, 2.2)
	fmt.Printf("U %.2f  V %.2f  W %.2f\n", ph[0], ph[1], ph[2])
	// Output:
	// U 1.00  V 1.10  W 1.20
}

func ExampleDeltaPhases() {
	// A delta of phases 1, 2 and 3 Ω reads 0.833, 1.333 and 1.5 Ω between lines.
	ph := verify.DeltaPhases(5.0/6, 8.0/6, 1.5)
	fmt.Printf("U %.3f  V %.3f  W %.3f\n", ph[0], ph[1], ph[2])
	// Output:
	// U 1.000  V 2.000  W 3.000
}

func ExampleCheck() {
	p, err := plan.Build(job.Demo())
	if err != nil {
		fmt.Println(err)
		return
	}
	// Phase U about 8 % low, read four-wire at 24 °C.
	u, v := wire.ResistanceAt(0.92*p.PhaseResistance20C, 24), wire.ResistanceAt(p.PhaseResistance20C, 24)
	rep, err := verify.Check(p, verify.Readings{UV: u + v, VW: v + v, WU: v + u, TempC: 24, FourWire: true})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println("verdict:", rep.Verdict)
	for _, f := range rep.Findings {
		fmt.Printf("%s %s (%s)\n", f.Severity, f.Phase, f.Test)
	}
	// Output:
	// verdict: fail
	// fail U (balance)
	// pass  (resistance)
}
