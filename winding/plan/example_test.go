package plan_test

import (
	"fmt"
	"math"

	"coilwright/winding/job"
	"coilwright/winding/plan"
)

func ExampleBuild() {
	p, err := plan.Build(job.Demo())
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%d turns per coil, fill %.2f, mean turn %.1f mm\n", p.TurnsPerCoil, p.SlotFill, p.MeanTurnLengthMM)
	fmt.Printf("phase %.1f mΩ at 20 °C, charging from %.0f rpm\n", 1000*p.PhaseResistance20C, p.EMF.CutInSpeedRPM)
	fmt.Printf("copper loss %.1f W at %g °C\n", p.CopperLossW, p.CopperLossTemperatureC)
	fmt.Println(p.Steps[4].Title)
	// Output:
	// 18 turns per coil, fill 0.38, mean turn 84.9 mm
	// phase 145.7 mΩ at 20 °C, charging from 286 rpm
	// copper loss 23.9 W at 95 °C
	// Coil 1 of 24: tooth 1, phase U, cw, 18 turns
}

func ExampleHVTestVolts() {
	fmt.Println(plan.HVTestVolts(250, 34.1), plan.HVTestVolts(3000, 400))
	// Output: 570 1800
}

func ExamplePhaseEMF() {
	// 8 coils of 18 turns in series, k_w = 0.933, 0.28 mWb per pole, 28 poles at 500 rpm.
	f := plan.ElectricalHz(28, 500)
	fmt.Printf("%.2f Hz, %.2f V rms\n", f, plan.PhaseEMF(f, 8*18, 0.933, 0.28e-3))
	// Output: 116.67 Hz, 19.50 V rms
}

func ExampleFluxFromTestCoil() {
	// 20 turns on one tooth of a 24/28 stator (pitch factor sin 105° = 0.966)
	// read 1.70 V rms with the rotor turned at 300 rpm.
	phi := plan.FluxFromTestCoil(28, 20, 300, 1.70, 0.9659258)
	// The phase of 8 such teeth wound with 18 turns each, k_w = 0.933, at 500 rpm:
	e := plan.PhaseEMF(plan.ElectricalHz(28, 500), 8*18, 0.9330127, phi)
	fmt.Printf("Φ = %.4f mWb, E = %.2f V rms\n", phi*1000, e)
	// Output: Φ = 0.2830 mWb, E = 19.70 V rms
}

func ExampleCutInLineRMS() {
	// A 26 V battery charged through two silicon diodes dropping 1.6 V
	// together: current flows once the line EMF's peak passes 27.6 V.
	v := plan.CutInLineRMS(26, 1.6)
	fmt.Printf("%.2f V rms line, %.2f V peak\n", v, v*math.Sqrt2)
	// Output: 19.52 V rms line, 27.60 V peak
}

func ExampleBridge_MeanDCCurrent() {
	// The demo machine at 500 rpm (116.7 Hz) into its 26 V battery.
	br := plan.Bridge{PhaseEMF: 19.70, Hz: 116.67, R: 0.189, L: 1.026e-3, BusV: 26, DiodesV: 1.6}
	fmt.Printf("%.0f A DC\n", br.MeanDCCurrent())
	// Output: 20 A DC
}

func ExampleCarterFactor() {
	// 19.63 mm slot pitch, 3 mm openings, 4.81 mm magnetic gap (1 mm of
	// air and 4 mm of magnet at μ_rec 1.05).
	fmt.Printf("%.4f\n", plan.CarterFactor(19.635, 3, 4.8095))
	// Output: 1.0172
}

func ExampleSpecificIronLoss() {
	// M400-50A (4.00 W/kg at 1.5 T, 50 Hz) at 1.2 T and 116.7 Hz.
	fmt.Printf("%.2f W/kg\n", plan.SpecificIronLoss(4.00, plan.HysteresisShare, 1.2, 116.67))
	// Output: 8.36 W/kg
}

func ExampleFormatReadings() {
	rs := []plan.Reading{
		{Key: "uv", Label: "U–V", Unit: plan.UnitOhm},
		{Key: "vw", Label: "V–W", Unit: plan.UnitOhm},
		{Key: "wu", Label: "W–U", Unit: plan.UnitOhm},
		{Key: plan.KeyTemp, Label: "winding temperature", Unit: plan.UnitCelsius},
	}
	fmt.Println(plan.FormatReadings(rs, map[string]float64{"uv": 0.2861, "vw": 0.2858, "wu": 0.2866, "temp": 22.5}))
	// Output:
	// U–V 286.1 mΩ, V–W 285.8 mΩ, W–U 286.6 mΩ, winding temperature 22.5 °C
}

func ExampleLimitText() {
	fmt.Println(plan.LimitText(plan.Test{Compare: plan.AtLeast, Limit: 5, Unit: plan.UnitMegaohm, Voltage: 500}))
	fmt.Println(plan.LimitText(plan.Test{Compare: plan.InBand, Limit: 7.1, Unit: plan.UnitPercent, LowPercent: -6.9, HighPercent: 7.1}))
	// Output:
	// at least 5 MΩ at 500 V
	// within −6.9 % .. +7.1 % of expected
}

func ExampleImbalancePercent() {
	// EASA AR100: the largest deviation from the mean, over the mean.
	pct, _ := plan.ImbalancePercent([]float64{0.1392, 0.1392, 0.14268})
	fmt.Printf("%.2f %%\n", pct)
	// Output:
	// 1.65 %
}

// FormatWatts writes the heat a test current makes: in mW below 1 W.
func ExampleFormatWatts() {
	fmt.Println(plan.FormatWatts(0.0512), plan.FormatWatts(2.46))
	// Output: 51 mW 2.5 W
}
