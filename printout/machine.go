package printout

import (
	"fmt"
	"math"

	"coilwright/winding/plan"
)

// MachinePage is the sheet of what the wound machine does: inductance,
// constants, flux densities, losses and efficiency, and the charging curve
// (or the terminal voltage under load).
const MachinePage PageKind = "machine-figures"

// machine lays out the machine sheet from the plan's Machine; a plan with
// nothing estimated (no magnetic-circuit inputs and no flux source) gets no
// sheet, its notes being in the plan text.
func (b *builder) machine() {
	mc := b.p.Machine
	if mc == nil || (mc.Inductance == nil && mc.ToothFluxDensity == 0) {
		return
	}
	c := b.newPage(MachinePage, "Machine figures")
	x0, w := float64(marginMM), b.width()
	y := b.top() + 4
	c.text(x0, y, sizeHead, Bold, Ink, left, "At the rated point (analytical estimates)")
	y += lineStep(sizeHead) + 1
	keyW := 34.0
	for _, r := range machineRows(b.p) {
		c.text(x0, y, sizeBody, Bold, Ink, left, r[0])
		y = c.para(x0+keyW, y, w-keyW, sizeBody, Regular, Ink, r[1]) + 0.6
	}
	y += 3
	plotH := math.Min(95, b.bottom()-y-60)
	switch {
	case len(mc.LoadCurve) > 1 && plotH > 30:
		y = b.chargingPlot(c, x0, y, w, plotH)
	case len(mc.VoltageCurve) > 1 && plotH > 30:
		y = b.voltagePlot(c, x0, y, w, plotH)
	}
	for _, n := range mc.Notes {
		// each note says what is not estimated and what would give it
		y = c.para(x0, y, w, sizeSmall, Regular, Ink, sentence(n)) + 0.5
	}
	if len(mc.LoadCurve) > 0 && y+16 < b.bottom() {
		y += 2
		c.warningSign(x0+4.5, y+1, 4.6)
		c.para(x0+9, y+2, w-9, sizeSmall, Bold, Ink,
			"Caution: a charging generator drives current into the battery whenever the rotor turns. Fuse the battery lead close to the battery, "+
				"stop and lock the rotor before touching the leads or the bridge, and keep hands clear of the turning rim. Follow local electrical codes and licensed practice.")
	}
}

// machineRows are the figures of the sheet as label and text.
func machineRows(p *plan.Plan) [][2]string {
	mc := p.Machine
	var rows [][2]string
	add := func(k, format string, a ...any) { rows = append(rows, [2]string{k, fmt.Sprintf(format, a...)}) }
	if ind := mc.Inductance; ind != nil {
		add("Phase inductance", "%.3f mH = air gap %.3f + harmonic leakage %.3f + slot %.3f + tooth tip %.3f + end winding %.3f mH",
			mc.PhaseInductanceMH, ind.MagnetisingMH, ind.HarmonicLeakageMH, ind.SlotLeakageMH, ind.ToothTipLeakageMH, ind.EndWindingLeakageMH)
	}
	if mc.ToothFluxDensity > 0 {
		v := fmt.Sprintf("tooth %.2f T", mc.ToothFluxDensity)
		if mc.YokeFluxDensity > 0 {
			v += fmt.Sprintf(", yoke %.2f T", mc.YokeFluxDensity)
		}
		if mc.ToothFluxDensity > plan.SaturationT || mc.YokeFluxDensity > plan.SaturationT {
			v += fmt.Sprintf(": ABOVE %.1f T, the iron saturates; check the flux source", plan.SaturationT)
		}
		add("Flux density", "%s (peak)", v)
	}
	if mc.RatedSpeedRPM > 0 {
		add("Constants", "torque %.3f N·m per A rms; EMF %.1f V line rms per 1000 rpm", mc.TorqueConstant, mc.EMFConstantLine)
		if mc.ReactanceOhm > 0 {
			add(fmt.Sprintf("At %g rpm", mc.RatedSpeedRPM), "%.1f Hz; R %.3f Ω (hot), X %.3f Ω; at %.2f A the line voltage is %.2f V (open circuit %.2f V)",
				mc.ElectricalHz, mc.PhaseResistanceOhm, mc.ReactanceOhm, mc.PhaseCurrentA, mc.LineVoltageLoadV, p.EMF.LineRMSAtRated)
		}
		if ls := mc.Losses; ls != nil {
			mech := ""
			if mc.MechanicalAllowance {
				mech = " (allowance)"
			}
			if mc.Iron == nil {
				// without the iron loss the sum is a lower bound
				add("Losses", "at least %.1f W: copper %.1f at %g °C, iron not estimated, mechanical %.1f%s", ls.Total, ls.Copper, p.CopperLossTemperatureC, ls.Mechanical, mech)
			} else {
				add("Losses", "%.1f W: copper %.1f at %g °C, iron %.1f, mechanical %.1f%s", ls.Total, ls.Copper, p.CopperLossTemperatureC, ls.Iron, ls.Mechanical, mech)
			}
		}
		if mc.Efficiency > 0 {
			add("Efficiency", "%.1f %% (%s: %.0f W out of %.0f W in)", 100*mc.Efficiency, mc.Operation, mc.OutputW, mc.InputW)
		}
	}
	return rows
}

// niceStep is a round axis step (1, 2 or 5 times a power of ten) giving
// about n divisions of span.
func niceStep(span float64, n int) float64 {
	if !(span > 0) {
		return 1
	}
	raw := span / float64(n)
	mag := math.Pow(10, math.Floor(math.Log10(raw)))
	for _, k := range []float64{1, 2, 5, 10} {
		if k*mag >= raw {
			return k * mag
		}
	}
	return 10 * mag
}

// axes draws a frame with round ticks from 0 to xMax and yMax and returns
// the mapping from values to the page.
func axes(c *canvas, x, y, w, h, xMax, yMax float64, xLabel, yLabel string) (func(v float64) float64, func(v float64) float64, float64, float64) {
	xs, ys := niceStep(xMax, 6), niceStep(yMax, 5)
	xMax, yMax = math.Ceil(xMax/xs)*xs, math.Ceil(yMax/ys)*ys
	px := func(v float64) float64 { return x + v/xMax*w }
	py := func(v float64) float64 { return y + h - v/yMax*h }
	for v := 0.0; v <= yMax+ys/2; v += ys {
		c.line(x, py(v), x+w, py(v), Pen{Width: 0.15, Colour: Faint})
		c.text(x-1.2, py(v)+1, sizeMin, Regular, Ink, right, fmt.Sprintf("%g", v))
	}
	for v := 0.0; v <= xMax+xs/2; v += xs {
		c.line(px(v), y+h, px(v), y+h+1, thin)
		c.text(px(v), y+h+4, sizeMin, Regular, Ink, centre, fmt.Sprintf("%g", v))
	}
	c.line(x, y+h, x+w, y+h, thin)
	c.line(x, y, x, y+h, thin)
	c.text(x+w, y+h+8, sizeSmall, Regular, Ink, right, xLabel)
	c.text(x, y-2, sizeSmall, Regular, Ink, left, yLabel)
	return px, py, xMax, yMax
}

// chargingPlot draws the DC current into the bus against speed, the cut-in
// and the rated speed marked, and returns the y below its caption.
func (b *builder) chargingPlot(c *canvas, x, y, w, h float64) float64 {
	mc, e := b.p.Machine, b.p.EMF
	cv := mc.LoadCurve
	var speeds, amps []float64
	for _, pt := range cv {
		speeds, amps = append(speeds, pt.SpeedRPM), append(amps, pt.DCCurrentA)
	}
	px, py := curve(c, x, y, w, h, speeds, amps, "speed, rpm", "DC current into the bus, A")
	mark := func(n float64, label string, dy float64) {
		c.line(px(n), y+4, px(n), py(0), Pen{Width: 0.25, Colour: Ink, Dash: Dash{1, 0.8}})
		c.text(px(n)+1, y+4+dy, sizeMin, Bold, Ink, left, label)
	}
	if e != nil && e.CutInSpeedRPM > 0 {
		mark(e.CutInSpeedRPM, fmt.Sprintf("cut-in %.0f rpm", e.CutInSpeedRPM), 3)
	}
	if mc.RatedSpeedRPM > 0 {
		var at plan.ChargePoint
		for _, pt := range cv {
			if pt.SpeedRPM == mc.RatedSpeedRPM {
				at = pt
			}
		}
		mark(mc.RatedSpeedRPM, fmt.Sprintf("rated %g rpm: %.1f A, %.0f W", mc.RatedSpeedRPM, at.DCCurrentA, at.PowerW), 7)
	}
	bus := b.p.EMF.TargetV
	text := fmt.Sprintf("Mean DC current into a %g V bus against speed, the power into the bus being %g V times it. A diode bridge with the machine's own resistance (hot) and inductance, stepped through time: "+
		"no current until the peak line voltage reaches the bus plus the diodes (the cut-in), then limited by R and ωL with commutation overlap (Mohan, Undeland, Robbins, Power Electronics, ch. 5). "+
		"The turbine and any charge controller decide where on the curve the machine runs.", bus, bus)
	return plotCaption(c, x, y+h+2, w, "Charging curve", text)
}

// voltagePlot draws the line voltage at the rated speed against the load
// current, and returns the y below its caption.
func (b *builder) voltagePlot(c *canvas, x, y, w, h float64) float64 {
	mc := b.p.Machine
	var amps, volts []float64
	for _, pt := range mc.VoltageCurve {
		amps, volts = append(amps, pt.CurrentA), append(volts, pt.LineV)
	}
	curve(c, x, y, w, h, amps, volts, "load current, A rms", "line voltage, V rms")
	text := fmt.Sprintf("Line voltage at %g rpm against the load current, from the EMF behind the hot resistance and the synchronous reactance (%s).", mc.RatedSpeedRPM, loadForm(mc.Operation))
	return plotCaption(c, x, y+h+2, w, "Terminal voltage under load", text)
}

// curve draws, in the plot box at x, y of w by h, axes reaching the last x
// value and the largest y value (at least 1), and the points (xs[i], ys[i])
// as dots joined by a line; it returns the maps from values to the page.
func curve(c *canvas, x, y, w, h float64, xs, ys []float64, xLabel, yLabel string) (px, py func(v float64) float64) {
	var yMax float64
	for _, v := range ys {
		yMax = math.Max(yMax, v)
	}
	px, py, _, _ = axes(c, x+10, y+4, w-14, h-16, xs[len(xs)-1], math.Max(yMax, 1), xLabel, yLabel)
	pts := make([]Point, len(xs))
	for i := range xs {
		pts[i] = Point{px(xs[i]), py(ys[i])}
		c.circle(pts[i].X, pts[i].Y, 0.55, Pen{}, &Fill{Black})
	}
	c.poly(pts, false, Pen{Width: 0.45, Colour: Black}, nil)
	return px, py
}

// plotCaption sets the caption of a plot at capY and returns the y below it.
func plotCaption(c *canvas, x, capY, w float64, title, text string) float64 {
	caption(c, x, capY, w, 5, title, text)
	return capY + lineStep(sizeSmall+0.5) + paraHeight(w, sizeSmall, Regular, text) + 2
}

func loadForm(op string) string {
	if op == "motor" {
		return "current in phase with the EMF"
	}
	return "a load at unity power factor"
}
