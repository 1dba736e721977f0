package plan

import (
	"fmt"
	"math"

	"coilwright/winding/job"
	"coilwright/winding/wire"
)

// electrical works out the resistance of every path and phase, the current
// density, the copper loss, and the copper to buy.
func (b *builder) electrical() error {
	p, j := b.p, b.j
	area := p.Wire.CopperAreaMM2
	strands := float64(p.Wire.StrandsInHand)
	lead := j.Build.LeadLengthMM / 1000
	phases := len(p.Layout.PhaseNames)
	cond := make([]float64, phases) // conductance of each phase at 20 °C
	for i := range p.Paths {
		pp := &p.Paths[i]
		// A meter reads a path at the ends of its leads: each path has its
		// own start and finish lead, trimmed to length, and the star point,
		// delta corners and parallel-path joints are made at the lead ends
		// (see the join steps). So the path's resistance is ρ·(path + two
		// leads)/A, and its phase is its paths in parallel (R = ρL/A,
		// IEC 60028 resistivity).
		pp.LeadEndsLengthM = pp.WireLengthM + 2*lead
		pp.Ohm20C = wire.Resistance20(pp.LeadEndsLengthM, area)
		for k, name := range p.Layout.PhaseNames {
			if name == pp.Phase {
				cond[k] += 1 / pp.Ohm20C
			}
		}
		p.CopperLengthM += pp.LeadEndsLengthM * strands
		p.BuyLengthM += pp.CutLengthM * strands
	}
	var sum float64
	for k, name := range p.Layout.PhaseNames {
		r := 1 / cond[k]
		p.PhaseOhms = append(p.PhaseOhms, PhaseOhm{Phase: name, Ohm20C: r, OhmAmbient: wire.ResistanceAt(r, p.AmbientC)})
		sum += r
	}
	p.PhaseResistance20C = sum / float64(phases)
	p.PhaseResistanceAmbient = wire.ResistanceAt(p.PhaseResistance20C, p.AmbientC)
	p.PhaseCurrentA = b.phaseCurr
	p.CurrentDensityAmm2 = b.phaseCurr / (float64(j.Winding.Paths) * area)
	b.copperLoss()
	p.CopperMassKg = wire.MassKg(p.CopperLengthM, b.strandArea)
	p.BuyLengthM *= 1 + j.Build.SpoolMargin
	p.BuyMassKg = wire.MassKg(p.BuyLengthM, b.strandArea)
	// Current density, naturally cooled enclosed machines about 1.5–5 A/mm²,
	// fan-cooled 5–10 (Hendershot & Miller, from memory).
	switch {
	case p.CurrentDensityAmm2 > 10:
		b.warn("current: %.1f A/mm² at rated current is beyond even fan-cooled practice (5–10 A/mm²); the winding will overheat: use more copper (thicker wire, more strands or paths)", p.CurrentDensityAmm2)
	case p.CurrentDensityAmm2 > 5:
		b.warn("current: %.1f A/mm² at rated current needs forced cooling; naturally cooled machines run at about 1.5–5 A/mm²", p.CurrentDensityAmm2)
	}

	// Rated voltage and power for the high-voltage test.
	p.RatedVoltageV = j.Rating.VoltageV
	if p.RatedVoltageV == 0 && p.EMF != nil && p.EMF.LineRMSAtRated > 0 {
		p.RatedVoltageV = p.EMF.LineRMSAtRated
		p.RatedVoltageFromEMF = true
	}
	if p.RatedVoltageV == 0 {
		return j.Fail("rating.voltage_v", "", "the rated voltage is not known (no flux source with a rated speed), and the high-voltage test needs it",
			"give rating.voltage_v, or a [flux] source and rating.speed_rpm")
	}
	p.RatedPowerW = j.Rating.PowerW
	if p.RatedPowerW == 0 {
		// Apparent power of m phases: m·U_phase·I_phase.
		p.RatedPowerW = float64(phases) * p.RatedVoltageV / b.lineFactor * b.phaseCurr
		p.RatedPowerEstimated = true
	}
	return nil
}

// copperLoss gives the copper loss of all phases at rated current, m·I²·R,
// at the working temperature and at the ambient. It reads the plan's own
// phase resistance, so it follows whatever that resistance includes.
func (b *builder) copperLoss() {
	p, r := b.p, b.j.Rating
	m := float64(len(p.Layout.PhaseNames))
	p.ThermalClass = r.ThermalClass
	if p.ThermalClass == 0 {
		p.ThermalClass = job.DefaultThermalClass
	}
	switch {
	case r.CopperTemperatureC != 0:
		p.CopperLossTemperatureC = r.CopperTemperatureC
		p.CopperLossTemperatureBasis = "rating.copper_temperature_c"
	case r.ThermalClass != 0:
		p.CopperLossTemperatureC = job.ReferenceTemperatureC[r.ThermalClass]
		p.CopperLossTemperatureBasis = fmt.Sprintf("IEC 60034-1 reference temperature of thermal class %s, from memory", thermalClassName(r.ThermalClass))
	default:
		p.CopperLossTemperatureC = job.ReferenceTemperatureC[job.DefaultThermalClass]
		p.CopperLossTemperatureBasis = fmt.Sprintf("IEC 60034-1 reference temperature of thermal class %s, from memory, taken as the class is not given (rating.thermal_class)", thermalClassName(job.DefaultThermalClass))
	}
	p.PhaseResistanceHot = wire.ResistanceAt(p.PhaseResistance20C, p.CopperLossTemperatureC)
	i2 := b.phaseCurr * b.phaseCurr
	p.CopperLossW = m * i2 * p.PhaseResistanceHot
	p.CopperLossAmbientW = m * i2 * p.PhaseResistanceAmbient
}

// thermalClassName gives a class of IEC 60085 with its letter: "130 (B)".
func thermalClassName(c int) string {
	letter := map[int]string{105: "A", 130: "B", 155: "F", 180: "H"}[c]
	if letter == "" {
		return fmt.Sprint(c)
	}
	return fmt.Sprintf("%d (%s)", c, letter)
}

// HVTestVolts returns the AC withstand voltage of IEC 60034-1 clause 9.2 for a
// new winding (table number from memory): 500 V + 2·U_N for machines under
// 1 kW and under 100 V, otherwise 1000 V + 2·U_N and at least 1500 V. The
// value is rounded up to the next 10 V (common practice).
func HVTestVolts(ratedPowerW, ratedVoltageV float64) float64 {
	var v float64
	if ratedPowerW < 1000 && ratedVoltageV < 100 {
		v = 500 + 2*ratedVoltageV
	} else {
		v = math.Max(1500, 1000+2*ratedVoltageV)
	}
	return math.Ceil(v/10-1e-9) * 10
}
