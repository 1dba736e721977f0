package plan

import (
	"fmt"
	"math"
	"strings"

	"coilwright/winding"
	"coilwright/winding/wire"
)

// Names of the tests in Plan.Tests; stable keys for other packages.
const (
	TestContinuity      = "continuity"
	TestPhaseInsulation = "phase_insulation"
	TestResistance      = "resistance"
	TestBalance         = "balance"
	TestInsulation      = "insulation_resistance"
	TestHighVoltage     = "hv_withstand"
	TestBackEMF         = "back_emf"
	TestPolarity        = "polarity"
)

// Test limits with their sources.
const (
	// BalanceLimitPercent: phase resistances of a random-wound winding within
	// 2 % of their mean (EASA AR100-2020; 1 % for form-wound).
	BalanceLimitPercent = 2.0
	// InsulationTestVolts: IEEE 43-2013 test voltage for windings rated below 1 kV.
	InsulationTestVolts = 500.0
	// MinInsulationMOhm: IEEE 43-2013 minimum insulation resistance after 1 min,
	// corrected to 40 °C, for random-wound windings.
	MinInsulationMOhm = 5.0
	// IEEE43MinPowerW: the scope of IEEE 43 starts at 750 W.
	IEEE43MinPowerW = 750.0
	// LengthUncertaintyPercent widens the resistance band for the estimate of
	// the mean turn and jumpers (common practice: a careful hand-wound coil
	// lands within about 5 % of its estimated length).
	LengthUncertaintyPercent = 5.0
	// BackEMFBalancePercent: the line EMFs of a sound winding with the rotor
	// fitted agree within a few per cent (common practice).
	BackEMFBalancePercent = 3.0
	// ContinuityFactor: a path reading above this multiple of its expected
	// resistance has an open or a bad joint (common practice).
	ContinuityFactor = 1.25
)

// Safety cautions shown with the tests and in the plan.
const (
	cautionHV = "Lethal voltage. Only a person trained for high-voltage testing, with a tester whose current is limited, " +
		"the area closed off and the stator on an insulating surface, should do this. Follow local electrical codes and licensed practice. " +
		"Discharge the winding to the core afterwards and keep it shorted until it is touched."
	cautionIR = "The tester puts 500 V DC on the winding: do not touch the leads or the stator while testing, " +
		"and discharge the winding to the core for at least as long as it was tested before touching it."
	cautionSpin = "Spinning rotor and strong magnets: guard the rotor, clamp the stator, keep hands, hair and loose clothing clear, " +
		"and bring the rotor onto the stator with a guide, not by hand (magnets pull hard enough to crush fingers). " +
		"A turning generator makes voltage at its leads even when nothing is connected."
)

// DiameterBand is how far the IEC 60317-0-1 tolerance δ on the bare
// diameter d moves the resistance: R ∝ 1/d², so from (d/(d+δ))² to
// (d/(d−δ))² of nominal, as factors (1, 1 when the plan has no tolerance).
func DiameterBand(w Wire) (lo, hi float64) {
	d, tol := w.BareDiameterMM, w.DiameterTolMM
	if d > 0 && tol > 0 && tol < d {
		return (d / (d + tol)) * (d / (d + tol)), (d / (d - tol)) * (d / (d - tol))
	}
	return 1, 1
}

// ResistanceBand is the band, in per cent about the plan's value, within
// which the resistance of a correct winding lies: the diameter tolerance
// (DiameterBand) times ±LengthUncertaintyPercent for the length estimate,
// multiplied in (worst case). The plan's tests and check use this one band.
func ResistanceBand(w Wire) (lowPct, highPct float64) {
	lo, hi := DiameterBand(w)
	u := LengthUncertaintyPercent / 100
	return 100 * (lo*(1-u) - 1), 100 * (hi*(1+u) - 1)
}

func round1(x float64) float64 { return math.Round(x*10) / 10 }

func (b *builder) tests() error {
	p := b.p
	names := p.Layout.PhaseNames
	pathR := 0.0
	for _, pp := range p.Paths {
		pathR = math.Max(pathR, pp.Ohm20C)
	}
	pathAmb := wire.ResistanceAt(pathR, p.AmbientC)
	tolPct := 100 * 2 * p.Wire.DiameterTolMM / p.Wire.BareDiameterMM
	lowPct, highPct := ResistanceBand(p.Wire)
	band := [2]float64{lowPct, highPct}
	hv := HVTestVolts(p.RatedPowerW, p.RatedVoltageV)
	var pathWord string
	if b.j.Winding.Paths > 1 {
		pathWord = fmt.Sprintf(" (each of the %d paths of every phase on its own, before they are joined)", b.j.Winding.Paths)
	}
	var ts []Test
	cont := b.continuityReadings(band)
	ts = append(ts, Test{Name: TestContinuity, Title: "Continuity of every path",
		What:  fmt.Sprintf("Continuity of every path from the end of its start lead to the end of its finish lead: %s%s. Each reads near its expected resistance, none open.", endsList(names), pathWord),
		Limit: round3(ContinuityFactor * pathAmb), Unit: UnitOhm, Compare: AtMost, Readings: cont,
		Source: "common practice: an open circuit or a poor joint reads well above the expected resistance",
		Note:   fmt.Sprintf("expected about %s per path at %s, leads included", FormatValue(pathAmb, UnitOhm), FormatValue(p.AmbientC, UnitCelsius))})
	beforeJoin := "star point is"
	if p.Connection.String() == "delta" {
		beforeJoin = "delta corners are"
	}
	pairs := pairReadings(names)
	ts = append(ts, Test{Name: TestPhaseInsulation, Title: "Insulation between phases",
		What:  fmt.Sprintf("Insulation between phases, before the %s made: %s, at %s DC for 1 min.", beforeJoin, ReadingLabels(pairs), FormatValue(InsulationTestVolts, UnitVolt)),
		Limit: MinInsulationMOhm, Unit: UnitMegaohm, Compare: AtLeast, Voltage: InsulationTestVolts, VoltageKind: "DC", Readings: pairs,
		Source:  "IEEE 43-2013 minimum for random-wound windings (Table 3, from memory), borrowed here for phase to phase (the standard tests winding to ground)",
		Caution: cautionIR,
		Note:    "a low reading between two phases points to a damaged separator or enamel where their coils share a slot"})
	ts = append(ts, b.polarityTest())
	lines := b.lineReadings(band)
	var expect []string
	for _, r := range lines {
		if r.Expected != nil {
			expect = append(expect, r.Label+" "+FormatValue(r.Expected.Value, r.Unit))
		}
	}
	ts = append(ts, Test{Name: TestResistance, Title: "Resistance of each phase",
		What: fmt.Sprintf("Resistance between the line leads of the connected %s winding, at the lead ends, with a four-wire (Kelvin) meter, the winding at room temperature; check refers the readings to 20 °C by the copper coefficient. Expected at %s: %s (one phase %s at 20 °C, its leads included).",
			p.Connection, FormatValue(p.AmbientC, UnitCelsius), strings.Join(expect, ", "), FormatValue(p.PhaseResistance20C, UnitOhm)),
		Limit: round1(math.Max(-lowPct, highPct)), Unit: UnitPercent, Compare: InBand, LowPercent: round1(lowPct), HighPercent: round1(highPct),
		Readings: lines,
		Source: fmt.Sprintf("IEC 60028 resistivity 1/58 Ω·mm²/m and R_T = R_20·(234.5+T)/254.5; band %s: about ±%.1f %% from the IEC 60317-0-1 diameter tolerance ±%.3f mm (R goes as 1/d²), times ±%.0f %% for the length estimate (common practice)",
			BandText(lowPct, highPct), tolPct, p.Wire.DiameterTolMM, LengthUncertaintyPercent),
		Note: lineNote(p.Connection)})
	ts = append(ts, Test{Name: TestBalance, Title: "Resistance balance",
		What:  "Balance of the phase resistances, worked out from the readings of the resistance test (not read again): the phase values from the line readings, then the largest deviation of a phase from the mean of the phases, over that mean.",
		Limit: BalanceLimitPercent, Unit: UnitPercent, Compare: AtMost, ReadingsFrom: TestResistance, Readings: []Reading{},
		Source: "EASA AR100-2020: random-wound windings within 2 % (1 % for form-wound), as the largest deviation from the average (from memory)",
		Note:   "a phase high by about one coil's share has a coil with too many turns or a poor joint; low, a coil shorted or left out"})
	irNote := "the 10-minute reading gives the polarization index (IR10/IR1), a guide to moisture and contamination"
	if p.RatedPowerW < IEEE43MinPowerW {
		irNote = fmt.Sprintf("this machine (about %.0f W) is below the scope of IEEE 43, which starts at 750 W: the limit is borrowed; ", p.RatedPowerW) + irNote
	}
	ts = append(ts, Test{Name: TestInsulation, Title: "Insulation resistance to the core",
		What:  fmt.Sprintf("Insulation resistance of the whole winding (all leads joined) to the stator core at %s DC, read after 1 min (and after 10 min for the polarization index); check corrects the reading to 40 °C.", FormatValue(InsulationTestVolts, UnitVolt)),
		Limit: MinInsulationMOhm, Unit: UnitMegaohm, Compare: AtLeast, Voltage: InsulationTestVolts, VoltageKind: "DC", Readings: insulationReadings(p),
		Source: "IEEE 43-2013: 500 V DC below 1 kV rating (Table 1); minimum 5 MΩ at 40 °C for random-wound windings (Table 3); from memory", Caution: cautionIR, Note: irNote})
	ts = append(ts, Test{Name: TestHighVoltage, Title: "High-voltage withstand",
		What: fmt.Sprintf("High-voltage withstand: %s AC 50/60 Hz for 1 min between the winding (all leads joined) and the core, after the insulation resistance has passed. No breakdown.",
			FormatValue(hv, UnitVolt)),
		Limit: 60, Unit: UnitSecond, Compare: AtLeast, Voltage: hv, VoltageKind: "AC", Readings: withstandReadings(hv),
		Source: fmt.Sprintf("IEC 60034-1 clause 9.2 (table number from memory): %s, rated %.1f V line, about %.0f W",
			hvRule(p.RatedPowerW, p.RatedVoltageV), p.RatedVoltageV, p.RatedPowerW),
		Caution: cautionHV,
		Note:    "a repeated test (after rework, or at acceptance) is at 80 % of this voltage (IEC 60034-1 clause 9.2, from memory); rewound windings: EASA AR100-2020 tables 4-4 and 4-5 (table numbers from memory); a DC test is about 1.7 × the AC value (IEC 60034-1, from memory)"})
	bt := Test{Name: TestBackEMF, Title: "Back-EMF balance (optional, rotor fitted)",
		What:  fmt.Sprintf("Optional, with the rotor fitted: spin the rotor at a steady known speed with the leads open and read the line voltages %s; they should agree.", ReadingLabels(emfReadings(names)[:len(names)])),
		Limit: BackEMFBalancePercent, Unit: UnitPercent, Compare: AtMost, Readings: emfReadings(names),
		Source:  "common practice; expected value from E = √2·π·f·N·k_w·Φ (textbook, e.g. Pyrhönen et al.)",
		Caution: cautionSpin, Optional: true}
	if p.EMF != nil {
		bt.Note = fmt.Sprintf("expected %.4f V rms line per rpm (%.4f V phase per rpm)", p.EMF.VoltsPerRPMPhase*b.lineFactor, p.EMF.VoltsPerRPMPhase)
	}
	ts = append(ts, bt)
	for _, r := range p.Resolutions() {
		for i := range ts {
			if ts[i].Name == r.Test {
				ts[i].Resolution = r.Text
			}
		}
	}
	p.Tests = ts
	return nil
}

// lineNote says how the line readings relate to the phases.
func lineNote(c winding.Connection) string {
	if c == winding.Delta {
		return "in a delta each line reading is one phase in parallel with the other two in series (2/3 of a phase for three equal phases); check converts the readings to phase values"
	}
	return "in a star each line reading is two phases in series (the star point is not brought out); check converts the readings to phase values"
}

func hvRule(powerW, voltsV float64) string {
	if powerW < 1000 && voltsV < 100 {
		return "under 1 kW and under 100 V: 500 V + 2·U_N"
	}
	return "1000 V + 2·U_N, at least 1500 V"
}

func endsList(names []string) string {
	var s []string
	for _, n := range names {
		s = append(s, n+"1–"+n+"2")
	}
	return strings.Join(s, ", ")
}

func round3(x float64) float64 {
	if x == 0 {
		return 0
	}
	mag := math.Pow(10, 3-math.Ceil(math.Log10(math.Abs(x))))
	return math.Round(x*mag) / mag
}
