package verify

import (
	"fmt"
	"math"

	"coilwright/winding/plan"
)

// IEEE 43-2013 values (Table 3 and the polarization-index clause; from
// memory, cross-checked in REFERENCES.md): the minimum insulation resistance
// after 1 minute, corrected to 40 °C, is 5 MΩ for random-wound windings and
// form-wound coils below 1 kV; the minimum polarization index for class B and
// above is 2.0; the PI may be disregarded when IR1 at 40 °C exceeds 5000 MΩ.
// Test voltage for windings rated below 1000 V: 500 V DC (Table 1).
const (
	MinIRMOhm         = 5.0
	MinPI             = 2.0
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

func (c *checker) insulation() {
	in := c.r.Insulation
	t := c.r.TempC
	res := &InsulationResult{IR1MOhm: in.IR1MOhm, IR10MOhm: in.IR10MOhm, IR1At40C: IRTo40C(in.IR1MOhm, t),
		MinimumMOhm: MinIRMOhm, PIMinimum: MinPI, Volts: in.Volts, RatedPowerW: c.ratedPowerW(), Verdict: Pass}
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
		add(Fail, fmt.Sprintf("insulation resistance %s at %.0f V after 1 min is %s at 40 °C, below the %g MΩ minimum (IEEE 43-2013): damaged enamel or liner, moisture, or a coil touching the core; dry the winding and find the fault before any high-voltage test%s",
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
		case res.PI < MinPI:
			add(Fail, fmt.Sprintf("polarization index %.2f (IR10 %s / IR1 %s) is below %.1f (IEEE 43-2013): moisture or contamination in the insulation; dry and clean, then test again",
				res.PI, mohm(in.IR10MOhm), mohm(in.IR1MOhm), MinPI))
		default:
			add(Pass, fmt.Sprintf("polarization index %.2f, at least %.1f (IEEE 43-2013)", res.PI, MinPI))
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

// RecommendedWithstandV is the IEC 60034-1 (clause 9.2, table number from
// memory) test voltage of a new winding of rated line voltage un (V rms) and
// rated output powerW: below 1 kW and 100 V, 500 V + 2·U_N; otherwise
// 1000 V + 2·U_N, at least 1500 V. It returns 0 when un is not known.
func RecommendedWithstandV(un, powerW float64) float64 {
	if un <= 0 {
		return 0
	}
	if powerW < 1000 && un < 100 {
		return 500 + 2*un
	}
	return math.Max(1000+2*un, 1500)
}

func (c *checker) withstand() {
	w := c.r.Withstand
	res := &WithstandResult{Passed: w.Passed, Volts: w.Volts, Verdict: Pass}
	c.rep.Withstand = res
	if c.p.EMF != nil {
		res.Recommended = RecommendedWithstandV(c.p.EMF.LineRMSAtRated, c.ratedPowerW())
	}
	add := func(sev Verdict, msg string) {
		res.Verdict = Worst(res.Verdict, sev)
		c.add(Finding{Severity: sev, Test: plan.TestHighVoltage, Message: msg})
	}
	if !w.Passed {
		add(Fail, fmt.Sprintf("the withstand test at %.0f V failed: the insulation broke down or leaked past the trip current; find the fault (slot exits, lead end, separators) before the winding is used", w.Volts))
		return
	}
	switch r := res.Recommended; {
	case r == 0:
		add(Pass, fmt.Sprintf("withstand test passed at %.0f V (the plan gives no rated voltage to compare with IEC 60034-1)", w.Volts))
	case w.Volts < 0.8*r*0.999:
		add(Warn, fmt.Sprintf("withstand test passed at %.0f V, below 80 %% of the %.0f V that IEC 60034-1 gives for a new winding of this rating: it proves less than it should", w.Volts, r))
	case w.Volts > 1.05*r:
		add(Warn, fmt.Sprintf("withstand test passed at %.0f V, above the %.0f V that IEC 60034-1 gives: every test at full voltage ages the insulation; repeat tests at 80 %%", w.Volts, r))
	default:
		add(Pass, fmt.Sprintf("withstand test passed at %.0f V (IEC 60034-1: %.0f V for a new winding, 80 %% for a repeat test)", w.Volts, r))
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
