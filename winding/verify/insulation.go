package verify

import (
	"fmt"

	"coilwright/winding/plan"
)

// IEEE 43-2013 values (Table 3, Table 4 and the polarization-index clause;
// from memory): the minimum insulation resistance
// after 1 minute, corrected to 40 °C, is 5 MΩ for random-wound windings and
// form-wound coils below 1 kV; the minimum polarization index is 2.0 for
// thermal class 130 (B) and above, 1.5 for class 105 (A); the PI may be
// disregarded when IR1 at 40 °C exceeds 5000 MΩ. Test voltage for windings
// rated below 1000 V: 500 V DC (Table 1).
const (
	MinIRMOhm         = 5.0
	MinPI             = 2.0
	MinPIClassA       = 1.5
	PIMeaningfulBelow = 5000.0
	IRTestVolts       = 500.0
	// IEEE43ScopeW: the standard covers machines of 750 W and above.
	IEEE43ScopeW = 750.0
)

// ratedPowerW is the plan's rated power (given in the job, or the plan's own
// estimate), so check and the test plan speak of the same machine; failing
// that, three phases at the rated phase EMF and current; 0 when the plan
// does not say.
func (c *checker) ratedPowerW() float64 {
	if c.p.RatedPowerW > 0 {
		return c.p.RatedPowerW
	}
	if c.p.EMF == nil || c.p.EMF.PhaseRMSAtRated <= 0 || c.p.RatedCurrentA <= 0 {
		return 0
	}
	return 3 * c.p.EMF.PhaseRMSAtRated * c.p.RatedCurrentA
}

// MinPIFor returns the IEEE 43-2013 minimum polarization index of an
// insulation of the thermal class (IEC 60085): 1.5 for 105 (A), 2.0 for
// 130 (B) and above, and for a class not known.
func MinPIFor(thermalClass int) float64 {
	if thermalClass == 105 {
		return MinPIClassA
	}
	return MinPI
}

// thermalClass is the plan's thermal class, 130 for a plan that does not
// say (one built before the plan carried it).
func (c *checker) thermalClass() int {
	if c.p.ThermalClass == 0 {
		return 130
	}
	return c.p.ThermalClass
}

func (c *checker) insulation() {
	in := c.r.Insulation
	t := c.r.TempC
	minPI := MinPIFor(c.p.ThermalClass)
	res := &InsulationResult{IR1MOhm: in.IR1MOhm, IR10MOhm: in.IR10MOhm, IR1At40C: IRTo40C(in.IR1MOhm, t),
		MinimumMOhm: MinIRMOhm, PIMinimum: minPI, Volts: in.Volts, RatedPowerW: c.ratedPowerW(), Verdict: Pass}
	c.rep.Insulation = res
	scope := ""
	switch {
	case res.RatedPowerW == 0:
		scope = "; IEEE 43 covers machines of 750 W and above, and this plan gives no rated power, so its limits may be borrowed"
	case res.RatedPowerW < IEEE43ScopeW:
		res.BelowScope = true
		scope = fmt.Sprintf("; this machine (about %.0f W) is below IEEE 43's 750 W scope: its limits are borrowed as a guide", res.RatedPowerW)
	}
	add := func(sev Verdict, msg string) {
		res.Verdict = Worst(res.Verdict, sev)
		c.add(Finding{Severity: sev, Test: plan.TestInsulation, Message: msg})
	}
	if res.IR1At40C < MinIRMOhm {
		add(Fail, fmt.Sprintf("insulation resistance %s at %.0f V DC after 1 min is %s at 40 °C, below the %g MΩ minimum (IEEE 43-2013): damaged enamel or liner, moisture, or a coil touching the core; dry the winding and find the fault before any high-voltage test%s",
			mohm(in.IR1MOhm), in.Volts, mohm(res.IR1At40C), MinIRMOhm, scope))
	} else {
		add(Pass, fmt.Sprintf("insulation resistance %s after 1 min is %s at 40 °C, above the %g MΩ minimum (IEEE 43-2013)%s",
			mohm(in.IR1MOhm), mohm(res.IR1At40C), MinIRMOhm, scope))
	}
	if in.IR10MOhm > 0 && in.IR1MOhm > 0 {
		res.PI = in.IR10MOhm / in.IR1MOhm
		switch {
		case res.IR1At40C > PIMeaningfulBelow:
			add(Pass, fmt.Sprintf("polarization index %.2f: with IR1 above %g MΩ at 40 °C, IEEE 43 lets the index be disregarded", res.PI, PIMeaningfulBelow))
		case res.PI < minPI && !res.BelowScope && res.RatedPowerW > 0:
			add(Fail, fmt.Sprintf("polarization index %.2f (IR10 %s / IR1 %s) is below %.1f (IEEE 43-2013, thermal class %d): moisture or contamination in the insulation; dry and clean, then test again",
				res.PI, mohm(in.IR10MOhm), mohm(in.IR1MOhm), minPI, c.thermalClass()))
		case res.PI < minPI:
			// IEEE 43-2013 notes that the polarization index may not apply
			// to small random-wound machines (from memory): their enamel
			// and varnish polarise within the first minute, so a low index
			// is a hint, not a verdict; the 1-minute IR judges.
			add(Warn, fmt.Sprintf("polarization index %.2f (IR10 %s / IR1 %s) is below the %.1f IEEE 43-2013 gives for larger machines; for a small random-wound winding below its scope the index may not apply, and the insulation resistance of %s at 40 °C judges: a falling reading can still mean moisture, so dry the winding if it has been damp",
				res.PI, mohm(in.IR10MOhm), mohm(in.IR1MOhm), minPI, mohm(res.IR1At40C)))
		default:
			add(Pass, fmt.Sprintf("polarization index %.2f, at least %.1f (IEEE 43-2013, thermal class %d)", res.PI, minPI, c.thermalClass()))
		}
	}
	switch {
	case in.Volts < 0.8*IRTestVolts:
		add(Warn, fmt.Sprintf("tested at %.0f V DC; IEEE 43 uses %.0f V DC for windings rated below 1000 V: a low test voltage can miss weak insulation", in.Volts, IRTestVolts))
	case in.Volts > 2*IRTestVolts:
		add(Warn, fmt.Sprintf("tested at %.0f V DC, above the %.0f V DC that IEEE 43 uses for windings rated below 1000 V: it stresses thin enamel needlessly", in.Volts, IRTestVolts))
	}
}

// mohm writes an insulation resistance (plan.FormatValue).
func mohm(v float64) string { return plan.FormatValue(v, plan.UnitMegaohm) }

// WithstandRepeatFraction: a withstand test repeated on a winding that has
// passed once (after rework, or at acceptance) is made at 80 % of the full
// voltage (IEC 60034-1 clause 9.2, from memory). A test below that fraction
// of the plan's test voltage has not proven the insulation.
const WithstandRepeatFraction = 0.8

// withstandTestV is the plan's withstand test voltage: the hv_withstand
// test's own voltage, which the plan took from the rated line voltage and
// power by IEC 60034-1 clause 9.2 (plan.HVTestVolts); 0 when the plan has no
// such test and no rated voltage.
func withstandTestV(p *plan.Plan) float64 {
	for _, t := range p.Tests {
		if t.Name == plan.TestHighVoltage && t.Voltage > 0 {
			return t.Voltage
		}
	}
	if p.RatedVoltageV > 0 {
		return plan.HVTestVolts(p.RatedPowerW, p.RatedVoltageV)
	}
	return 0
}

// withstand judges a high-voltage test against the plan's test voltage (not
// the EMF): at the test voltage it proves the insulation; at 80 % to 100 %
// it is a repeat test; below 80 % it has proven nothing and does not pass;
// far above it ages the insulation for nothing.
func (c *checker) withstand() {
	w := c.r.Withstand
	res := &WithstandResult{Passed: w.Passed, Volts: w.Volts, Verdict: Pass, Recommended: withstandTestV(c.p)}
	c.rep.Withstand = res
	add := func(sev Verdict, msg string) {
		res.Verdict = Worst(res.Verdict, sev)
		c.add(Finding{Severity: sev, Test: plan.TestHighVoltage, Message: msg})
	}
	v := plan.FormatValue(w.Volts, plan.UnitVolt) + " AC"
	if !w.Passed {
		add(Fail, fmt.Sprintf("the withstand test at %s failed: the insulation broke down or leaked past the trip current; find the fault (slot exits, lead end, separators) before the winding is used", v))
		return
	}
	r := res.Recommended
	rv := plan.FormatValue(r, plan.UnitVolt) + " AC"
	rated := fmt.Sprintf("the plan's %s (IEC 60034-1 clause 9.2 for %s rated line voltage)", rv, plan.FormatValue(c.p.RatedVoltageV, plan.UnitVolt))
	switch {
	case r == 0:
		add(Warn, fmt.Sprintf("withstand test held at %s, but the plan gives no rated voltage to set the test voltage by IEC 60034-1: give rating.voltage_v in the job", v))
	case w.Volts < WithstandRepeatFraction*r*0.999:
		add(Fail, fmt.Sprintf("withstand test held at %s, only %.0f %% of %s: below the 80 %% of a repeat test it proves nothing about the insulation; test again at %s",
			v, 100*w.Volts/r, rated, rv))
	case w.Volts < r*0.999:
		add(Pass, fmt.Sprintf("withstand test held at %s, %.0f %% of %s: enough for a repeat test (80 %%), a new winding is tested at the full %s",
			v, 100*w.Volts/r, rated, rv))
	case w.Volts > 1.05*r:
		add(Warn, fmt.Sprintf("withstand test held at %s, above %s: every test at more than the full voltage ages the insulation for nothing; repeat tests at 80 %%", v, rated))
	default:
		add(Pass, fmt.Sprintf("withstand test held at %s, %s; a repeat test is at 80 %%", v, rated))
	}
}

func (c *checker) cautions() {
	if c.r.Insulation != nil || c.r.Withstand != nil {
		c.rep.Cautions = append(c.rep.Cautions,
			"Insulation and withstand testers make dangerous voltage: only trained people, the winding disconnected from everything else, everyone clear, and the winding discharged to the core after each test for at least as long as the voltage was applied. Local codes and licensed practice come first.")
	}
	if c.r.EMF != nil {
		c.rep.Cautions = append(c.rep.Cautions,
			"A spinning magnet rotor: guard it, keep fingers, tools and loose clothing clear; an unloaded generator can make dangerous voltage at speed; never short or touch the leads while it turns.")
	}
}
