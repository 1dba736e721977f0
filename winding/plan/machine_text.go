package plan

import (
	"fmt"
	"strings"
	"text/tabwriter"
)

// machineText writes the section of the plan text on what the wound machine
// does: a compact table of the figures, the charging curve or the terminal
// voltage under load, and what could not be estimated.
func (p *Plan) machineText(b *strings.Builder) {
	mc := p.Machine
	if mc == nil {
		return
	}
	b.WriteString("\nMachine (analytical estimates; no saturation, magnets' losses left out)\n")
	tw := tabwriter.NewWriter(b, 0, 0, 2, ' ', 0)
	row := func(k, format string, a ...any) { fmt.Fprintf(tw, "  %s\t%s\n", k, fmt.Sprintf(format, a...)) }
	if ind := mc.Inductance; ind != nil {
		row("Inductance", "%.3f mH per phase = air gap %.3f + harmonic %.3f + slot %.3f + tooth tip %.3f + end %.3f",
			mc.PhaseInductanceMH, ind.MagnetisingMH, ind.HarmonicLeakageMH, ind.SlotLeakageMH, ind.ToothTipLeakageMH, ind.EndWindingLeakageMH)
		row("", "effective gap %.2f mm (Carter %.3f), harmonic leakage factor %.2f", ind.EffectiveAirGapMM, ind.CarterFactor, ind.HarmonicLeakageFactor)
	}
	if mc.ToothFluxDensity > 0 {
		yoke := "yoke not estimated"
		if mc.YokeFluxDensity > 0 {
			yoke = fmt.Sprintf("yoke %.2f T", mc.YokeFluxDensity)
		}
		row("Flux density", "tooth %.2f T, %s (peak; steel saturates above %.1f T)", mc.ToothFluxDensity, yoke, SaturationT)
	}
	if mc.RatedSpeedRPM > 0 {
		row("Constants", "torque %.3f N·m/A rms, EMF %.4f V·s/rad per phase, %.1f V line per 1000 rpm", mc.TorqueConstant, mc.EMFConstant, mc.EMFConstantLine)
		at := fmt.Sprintf("At %g rpm", mc.RatedSpeedRPM)
		if mc.ReactanceOhm > 0 {
			row(at, "%.1f Hz, X %.3f Ω, R %.3f Ω hot; %.2f A: phase %.2f V, line %.2f V (EMF %.2f V)",
				mc.ElectricalHz, mc.ReactanceOhm, mc.PhaseResistanceOhm, mc.PhaseCurrentA, mc.PhaseVoltageLoadV, mc.LineVoltageLoadV, mc.PhaseEMFV)
			at = ""
		}
		if ls := mc.Losses; ls != nil {
			mech := "job's figure"
			if mc.MechanicalAllowance {
				mech = "allowance"
			}
			if mc.Iron == nil {
				// Without the iron loss the sum is a lower bound.
				row(at, "losses at least %.1f W: copper %.1f, iron not estimated, mechanical %.1f (%s)",
					ls.Total, ls.Copper, ls.Mechanical, mech)
			} else {
				row(at, "losses %.1f W: copper %.1f, iron %.1f (teeth %.1f, yoke %.1f), mechanical %.1f (%s)",
					ls.Total, ls.Copper, ls.Iron, ls.IronTeeth, ls.IronYoke, ls.Mechanical, mech)
			}
		}
		if mc.Efficiency > 0 {
			row("", "efficiency %.3f = %.0f W / %.0f W (%s)", mc.Efficiency, mc.OutputW, mc.InputW, mc.Operation)
		}
		if ir := mc.Iron; ir != nil {
			grade := ir.Grade
			if grade == "" {
				grade = "the job's lamination"
			}
			row("Iron", "%s, %.2f W/kg at 1.5 T 50 Hz; teeth %.2f kg, yoke %.2f kg; build factor %.1f", grade, ir.LossWPerKg, ir.TeethKg, ir.YokeKg, ir.BuildFactor)
		}
	}
	tw.Flush()
	if len(mc.LoadCurve) > 0 {
		b.WriteString("  Charging curve (diode bridge into the bus, time-stepped with R and L)\n")
		tw = tabwriter.NewWriter(b, 0, 0, 2, ' ', tabwriter.AlignRight)
		fmt.Fprintf(tw, "\trpm\tA DC\tW\t\n")
		for k, pt := range mc.LoadCurve {
			if k%2 == 1 && pt.SpeedRPM != mc.RatedSpeedRPM && k != len(mc.LoadCurve)-1 && (p.EMF == nil || pt.SpeedRPM != p.EMF.CutInSpeedRPM) {
				continue
			}
			fmt.Fprintf(tw, "\t%.0f\t%.1f\t%.0f\t\n", pt.SpeedRPM, pt.DCCurrentA, pt.PowerW)
		}
		tw.Flush()
	}
	if len(mc.VoltageCurve) > 0 {
		fmt.Fprintf(b, "  Terminal voltage at %g rpm against load current\n", mc.RatedSpeedRPM)
		tw = tabwriter.NewWriter(b, 0, 0, 2, ' ', tabwriter.AlignRight)
		fmt.Fprintf(tw, "\tA\tphase V\tline V\t\n")
		for _, pt := range mc.VoltageCurve {
			fmt.Fprintf(tw, "\t%.2f\t%.2f\t%.2f\t\n", pt.CurrentA, pt.PhaseV, pt.LineV)
		}
		tw.Flush()
	}
	for _, n := range mc.Notes {
		fmt.Fprintf(b, "  - %s\n", n)
	}
}
