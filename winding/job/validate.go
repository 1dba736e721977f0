package job

import (
	"fmt"
	"math"
	"strings"
	"unicode"

	"coilwright/winding"
	"coilwright/winding/wire"
)

// Defaults filled by Normalize when a key is left out.
const (
	DefaultPhases        = 3
	DefaultLayers        = 2
	DefaultPaths         = 1
	DefaultConnection    = "star"
	DefaultStrands       = 1
	DefaultSpoolMargin   = 0.10
	DefaultPracticalFill = 0.40 // common practice: hand-wound round wire reaches 0.30–0.45
	// DefaultThermalClass is class 130 (B), the usual class of the polyester
	// film and varnish of small hand-wound machines (common practice).
	DefaultThermalClass = 130
)

// Defaults of the magnetic circuit and the iron, each a typical value named
// where it comes from.
const (
	// DefaultRecoilPermeability: sintered NdFeB 1.03–1.10, ferrite 1.05–1.2
	// (magnet makers' data sheets, from memory).
	DefaultRecoilPermeability = 1.05
	// DefaultStackingFactor: 0.5 mm laminations stack to 0.95–0.97 of the
	// stack length (EN 10106 minimum stacking factors, from memory).
	DefaultStackingFactor = 0.95
	// DefaultLaminationGrade and DefaultLaminationLoss: non-oriented
	// electrical steel M400-50A, 0.5 mm thick, guaranteed at most 4.00 W/kg
	// at 1.5 T and 50 Hz (EN 10106, from memory).
	DefaultLaminationGrade = "M400-50A"
	DefaultLaminationLoss  = 4.00
	// DefaultMechanicalPercent: bearing and windage loss of a small machine
	// taken as 1 % of its rated power (common practice).
	DefaultMechanicalPercent = 1.0
)

// ReferenceTemperatureC gives the reference temperature of IEC 60034-1
// (clause 8, the temperature to which losses are corrected) for each thermal
// class of IEC 60085: 75 °C for 105 (A), 95 °C for 130 (B), 115 °C for 155 (F),
// 135 °C for 180 (H) (from memory).
var ReferenceTemperatureC = map[int]float64{105: 75, 130: 95, 155: 115, 180: 135}

// Normalize fills the defaults of keys left out. Parse calls it; call it on a
// Job built in code before Validate.
func (j *Job) Normalize() {
	w, m := &j.Winding, &j.Machine
	orDefault(&w.Phases, DefaultPhases)
	orDefault(&w.Layers, DefaultLayers)
	orDefault(&w.Paths, DefaultPaths)
	orDefault(&w.Connection, DefaultConnection)
	orDefault(&j.Wire.StrandsInHand, DefaultStrands)
	orDefault(&j.Build.SpoolMargin, DefaultSpoolMargin)
	orDefault(&j.Build.PracticalFill, DefaultPracticalFill)
	orDefault(&m.MagnetRecoilPermeability, DefaultRecoilPermeability)
	orDefault(&m.StackingFactor, DefaultStackingFactor)
	if m.LaminationLossWPerKg == 0 {
		m.LaminationLossWPerKg = DefaultLaminationLoss
		orDefault(&m.LaminationGrade, DefaultLaminationGrade)
	}
	orDefault(&m.Operation, OperationGenerator)
}

// orDefault sets *v to d when *v is left at its zero value.
func orDefault[T comparable](v *T, d T) {
	var zero T
	if *v == zero {
		*v = d
	}
}

// Validate checks every field on its own and against its neighbours. It
// returns the first problem found as a *FieldError. It does not look for a
// balanced layout or check that the turns fit; package plan does that.
func (j *Job) Validate() error {
	for _, check := range []func() *FieldError{j.checkHeader, j.checkWinding, j.checkStator, j.checkSlot,
		j.checkWire, j.checkTurns, j.checkFlux, j.checkRating, j.checkBuild, j.checkMachine} {
		if e := check(); e != nil {
			return e
		}
	}
	return nil
}

// finite reports a usable number (not NaN or ±Inf).
func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// rangeCheck refuses v outside [lo, hi]; zero is refused too when required.
func (j *Job) rangeCheck(field string, v, lo, hi float64, unit, typical string) *FieldError {
	if !finite(v) || v < lo || v > hi {
		return j.Fail(field, num(v), fmt.Sprintf("must be between %g and %g %s", lo, hi, unit), typical)
	}
	return nil
}

func (j *Job) positive(field string, v, hi float64, unit, typical string) *FieldError {
	if !finite(v) || v <= 0 || v > hi {
		if v == 0 {
			return j.Fail(field, "", "is missing (or 0)", fmt.Sprintf("give it in %s; %s", unit, typical))
		}
		return j.Fail(field, num(v), fmt.Sprintf("must be more than 0 and at most %g %s", hi, unit), typical)
	}
	return nil
}

func (j *Job) checkHeader() *FieldError {
	name := strings.TrimSpace(j.Name)
	switch {
	case name == "":
		return j.Fail("name", "", "is missing", `name the job, e.g. name = "stream turbine stator, rewind 1"`)
	case len(j.Name) > 200:
		return j.Fail("name", fmt.Sprintf("(%d characters)", len(j.Name)), "is too long", "keep it under 200 characters")
	case strings.IndexFunc(j.Name, unicode.IsControl) >= 0:
		return j.Fail("name", fmt.Sprintf("%q", j.Name), "holds control characters", "use plain text on one line")
	case len(j.Revision) > 40 || strings.IndexFunc(j.Revision, unicode.IsControl) >= 0:
		return j.Fail("revision", fmt.Sprintf("%q", j.Revision), "must be a short plain text", `e.g. revision = "B"`)
	}
	return nil
}

func (j *Job) checkWinding() *FieldError {
	w := j.Winding
	switch {
	case w.Slots <= 0 || w.Slots > winding.MaxSlots:
		return j.Fail("winding.slots", fmt.Sprint(w.Slots), fmt.Sprintf("the slot count must be 1 to %d", winding.MaxSlots), "count the teeth of the stator, e.g. 12, 24, 36")
	case w.Poles <= 0 || w.Poles%2 != 0 || w.Poles > winding.MaxPoles:
		return j.Fail("winding.poles", fmt.Sprint(w.Poles), fmt.Sprintf("the rotor pole count 2p must be an even number from 2 to %d", winding.MaxPoles), "count the magnets of the rotor, e.g. 10, 14, 28")
	case w.Phases < 3 || w.Phases%2 == 0 || w.Phases > winding.MaxPhases:
		return j.Fail("winding.phases", fmt.Sprint(w.Phases), fmt.Sprintf("must be an odd number from 3 to %d", winding.MaxPhases), "3 for a three-phase machine")
	case w.Layers != 1 && w.Layers != 2:
		return j.Fail("winding.layers", fmt.Sprint(w.Layers), "must be 1 (alternate teeth wound) or 2 (every tooth wound)", "")
	case w.Paths < 1 || w.Paths > w.Slots:
		return j.Fail("winding.paths", fmt.Sprint(w.Paths), "the number of parallel paths per phase must be at least 1 and at most the coils per phase", "1 unless the wire would be too thick")
	}
	if _, err := winding.ParseConnection(w.Connection); err != nil {
		return j.Fail("winding.connection", fmt.Sprintf("%q", w.Connection), "must be \"star\" or \"delta\"", "")
	}
	return nil
}

func (j *Job) checkStator() *FieldError {
	s := j.Stator
	if s.Rotor != RotorInner && s.Rotor != RotorOuter {
		v := ""
		if s.Rotor != "" {
			v = fmt.Sprintf("%q", s.Rotor)
		}
		return j.Fail("stator.rotor", v, `must be "inner" (rotor in the bore) or "outer" (rotor round the stator)`, "")
	}
	if e := j.positive("stator.diameter_mm", s.DiameterMM, 5000, "mm", "the air-gap diameter: the bore for an inner rotor, over the tooth tips for an outer rotor"); e != nil {
		return e
	}
	if e := j.positive("stator.stack_length_mm", s.StackLengthMM, 2000, "mm", "the axial length of the lamination stack, typically 10 to 100 mm"); e != nil {
		return e
	}
	if e := j.positive("stator.tooth_width_mm", s.ToothWidthMM, 500, "mm", "the width of one tooth body, measured across it"); e != nil {
		return e
	}
	pitch := math.Pi * s.DiameterMM / float64(j.Winding.Slots)
	if j.Winding.Slots > 0 && s.ToothWidthMM >= pitch {
		return j.Fail("stator.tooth_width_mm", num(s.ToothWidthMM),
			fmt.Sprintf("a tooth cannot be as wide as the tooth pitch at the air gap, π·%g/%d = %.2f mm", s.DiameterMM, j.Winding.Slots, pitch),
			"check the diameter and the slot count")
	}
	if e := j.rangeCheck("stator.liner_mm", s.LinerMM, 0, 2, "mm", "slot liner film or paper is typically 0.1 to 0.35 mm"); e != nil {
		return e
	}
	return j.rangeCheck("stator.separator_mm", s.SeparatorMM, 0, 2, "mm", "phase separator film is typically 0.1 to 0.3 mm")
}

func (j *Job) checkSlot() *FieldError {
	sl := j.Stator.Slot
	const f = "stator.slot."
	if sl.AreaMM2 != 0 {
		if sl.WidthTopMM != 0 || sl.WidthBottomMM != 0 {
			return j.Fail(f+"area_mm2", num(sl.AreaMM2), "give either the slot area or its shape (depth and widths), not both", "remove area_mm2 or the widths")
		}
		if e := j.positive(f+"area_mm2", sl.AreaMM2, 1e5, "mm²", "the free cross-section of one slot"); e != nil {
			return e
		}
		if sl.DepthMM != 0 {
			if e := j.positive(f+"depth_mm", sl.DepthMM, 1000, "mm", "from the tooth tips to the yoke"); e != nil {
				return e
			}
		}
	} else {
		if sl.DepthMM == 0 && sl.WidthTopMM == 0 && sl.WidthBottomMM == 0 {
			return j.Fail("stator.slot", "", "the slot is missing", "give area_mm2, or depth_mm, width_top_mm and width_bottom_mm")
		}
		for _, c := range []struct {
			key  string
			v    float64
			what string
		}{{"depth_mm", sl.DepthMM, "from below the tooth tips to the yoke"},
			{"width_top_mm", sl.WidthTopMM, "the slot width on the air-gap side, just below the tooth tips"},
			{"width_bottom_mm", sl.WidthBottomMM, "the slot width at the yoke"}} {
			if e := j.positive(f+c.key, c.v, 1000, "mm", c.what); e != nil {
				return e
			}
		}
	}
	if e := j.positive(f+"opening_mm", sl.OpeningMM, 1000, "mm", "the gap between two tooth tips the wire passes through"); e != nil {
		return e
	}
	if sl.Parametric() && sl.OpeningMM > sl.WidthTopMM {
		return j.Fail(f+"opening_mm", num(sl.OpeningMM), fmt.Sprintf("the slot opening cannot be wider than the slot below it (width_top_mm = %g)", sl.WidthTopMM), "")
	}
	depth := sl.DepthMM
	if j.Stator.Rotor == RotorOuter && depth > 0 && depth >= j.Stator.DiameterMM/2 {
		return j.Fail(f+"depth_mm", num(depth), fmt.Sprintf("an outer-rotor stator of diameter %g mm cannot have slots %g mm deep (radius %g mm)", j.Stator.DiameterMM, depth, j.Stator.DiameterMM/2), "")
	}
	if 2*j.Stator.LinerMM >= math.Min(nonzero(sl.WidthBottomMM), nonzero(sl.WidthTopMM)) {
		return j.Fail("stator.liner_mm", num(j.Stator.LinerMM), "two liner thicknesses fill the slot width", "use a thinner liner")
	}
	return nil
}

func nonzero(v float64) float64 {
	if v == 0 {
		return math.Inf(1)
	}
	return v
}

func (j *Job) checkWire() *FieldError {
	w := j.Wire
	switch {
	case w.BareDiameterMM != 0 && w.AWG != nil:
		return j.Fail("wire.awg", fmt.Sprint(*w.AWG), "give either bare_diameter_mm or awg, not both", "")
	case w.BareDiameterMM == 0 && w.AWG == nil:
		return j.Fail("wire", "", "the wire size is missing", "give bare_diameter_mm (e.g. 0.8) or awg (e.g. 20)")
	case w.AWG != nil:
		if _, err := wire.AWGDiameter(*w.AWG); err != nil {
			return j.Fail("wire.awg", fmt.Sprint(*w.AWG), fmt.Sprintf("outside the ASTM B258 sizes %d (0000) to %d", wire.MinAWG, wire.MaxAWG), "winding wire is usually AWG 10 to 40")
		}
	default:
		if e := j.positive("wire.bare_diameter_mm", w.BareDiameterMM, 6, "mm", "the copper diameter without enamel, typically 0.2 to 2.0 mm"); e != nil {
			return e
		}
	}
	bare, _ := j.BareDiameter()
	switch {
	case w.Grade != 0 && w.OverallDiameterMM != 0:
		return j.Fail("wire.overall_diameter_mm", num(w.OverallDiameterMM), "give either the enamel grade or a measured overall diameter, not both", "")
	case w.Grade == 0 && w.OverallDiameterMM == 0:
		return j.Fail("wire.grade", "", "the enamel build is missing", "give grade = 1 or 2 (IEC 60317), or overall_diameter_mm as measured over the enamel")
	case w.Grade != 0:
		if w.Grade != 1 && w.Grade != 2 {
			return j.Fail("wire.grade", fmt.Sprint(w.Grade), "the IEC 60317 enamel grade must be 1 or 2", "grade 2 (thicker enamel) is usual for hand winding")
		}
		if _, err := wire.EnamelFor(bare, w.Grade); err != nil {
			return j.Fail("wire.grade", fmt.Sprint(w.Grade),
				fmt.Sprintf("the enamel table covers bare diameters %.3f to %.3f mm, and this wire is %.3f mm", wire.MinEnamelMM, wire.MaxEnamelMM, bare),
				"measure the diameter over the enamel with a micrometer and give overall_diameter_mm")
		}
	default:
		if !finite(w.OverallDiameterMM) || w.OverallDiameterMM <= bare || w.OverallDiameterMM > 1.5*bare+0.2 {
			return j.Fail("wire.overall_diameter_mm", num(w.OverallDiameterMM),
				fmt.Sprintf("must be more than the bare diameter %.3f mm and not much more (enamel adds a few per cent)", bare),
				"measure over the enamel with a micrometer")
		}
	}
	if w.StrandsInHand < 1 || w.StrandsInHand > 50 {
		return j.Fail("wire.strands_in_hand", fmt.Sprint(w.StrandsInHand), "must be 1 to 50", "1, or 2 to 4 thinner wires wound together instead of one thick one")
	}
	return nil
}

// BareDiameter returns the bare diameter in mm, from the AWG size where given.
func (j *Job) BareDiameter() (float64, error) {
	if j.Wire.AWG != nil {
		return wire.AWGDiameter(*j.Wire.AWG)
	}
	return j.Wire.BareDiameterMM, nil
}

func (j *Job) checkTurns() *FieldError {
	t := j.Turns
	const f = "turns."
	if t.PerCoil < 0 || t.PerCoil > 100000 {
		return j.Fail(f+"per_coil", fmt.Sprint(t.PerCoil), "must be a whole number of turns from 1 to 100000", "")
	}
	if t.PerCoil > 0 {
		if t.Target != "" {
			return j.Fail(f+"target", fmt.Sprintf("%q", t.Target), "give either per_coil or a target to solve for, not both", "remove one of them")
		}
		if t.Volts != 0 || t.SpeedRPM != 0 || t.BridgeDropV != 0 {
			return j.Fail(f+"volts", num(t.Volts), "volts, speed_rpm and bridge_drop_v belong to a target; per_coil is given", "remove them or remove per_coil")
		}
		return nil
	}
	switch t.Target {
	case TargetPhaseEMF, TargetLineEMF, TargetDCBus:
	case "":
		return j.Fail("turns", "", "neither the turns nor a target is given", `give per_coil, or target = "phase_emf", "line_emf" or "dc_bus" with volts and speed_rpm`)
	default:
		return j.Fail(f+"target", fmt.Sprintf("%q", t.Target), `must be "phase_emf", "line_emf" or "dc_bus"`, "")
	}
	if e := j.positive(f+"volts", t.Volts, 100000, "V", "the voltage to reach at speed_rpm"); e != nil {
		return e
	}
	if e := j.positive(f+"speed_rpm", t.SpeedRPM, 200000, "rpm", "the speed at which the target voltage is to be reached"); e != nil {
		return e
	}
	if t.Target == TargetDCBus {
		if j.Winding.Phases != 3 {
			e := j.Fail(f+"target", `"dc_bus"`, fmt.Sprintf("the DC-bus target assumes a three-phase diode bridge, and this winding has %d phases", j.Winding.Phases), `use target = "phase_emf"`)
			e.Unsupported = true
			return e
		}
		if e := j.rangeCheck(f+"bridge_drop_v", t.BridgeDropV, 0, 20, "V", "two silicon diodes drop about 1.4 to 2 V, Schottky about 0.8 to 1.2 V"); e != nil {
			return e
		}
	} else if t.BridgeDropV != 0 {
		return j.Fail(f+"bridge_drop_v", num(t.BridgeDropV), "applies only to target = \"dc_bus\"", "remove it")
	}
	if !j.Flux.Given() {
		return j.Fail("flux", "", "turns are to be solved, and no flux source is given", "give [flux] per_pole_wb, or air_gap_tesla with magnet_arc, or a [flux.test_coil] reading")
	}
	return nil
}

func (j *Job) checkFlux() *FieldError {
	fl := j.Flux
	n := 0
	if fl.PerPoleWb != 0 {
		n++
	}
	if fl.AirGapTesla != 0 || fl.MagnetArc != 0 {
		n++
	}
	if fl.TestCoil != nil {
		n++
	}
	if n > 1 {
		return j.Fail("flux", "", "give one flux source, not several", "per_pole_wb, or air_gap_tesla with magnet_arc, or [flux.test_coil]")
	}
	switch {
	case fl.PerPoleWb != 0:
		return j.positive("flux.per_pole_wb", fl.PerPoleWb, 1, "Wb", "the fundamental flux of one rotor pole, typically 1e-4 to 1e-2 Wb in small machines")
	case fl.AirGapTesla != 0 || fl.MagnetArc != 0:
		if e := j.positive("flux.air_gap_tesla", fl.AirGapTesla, 2.5, "T", "flux density in the gap under a magnet: about 0.3 to 0.5 T with ferrite, 0.6 to 1.0 T with NdFeB"); e != nil {
			return e
		}
		return j.positive("flux.magnet_arc", fl.MagnetArc, 1, "of a pole pitch", "magnet width over pole pitch, typically 0.7 to 0.9")
	case fl.TestCoil != nil:
		tc := fl.TestCoil
		if tc.Turns < 1 || tc.Turns > 100000 {
			return j.Fail("flux.test_coil.turns", fmt.Sprint(tc.Turns), "must be a whole number of turns, at least 1", "10 to 30 turns of any thin wire on one tooth")
		}
		if e := j.positive("flux.test_coil.speed_rpm", tc.SpeedRPM, 200000, "rpm", "the speed the rotor was turned at while reading the voltage"); e != nil {
			return e
		}
		return j.positive("flux.test_coil.volts_rms", tc.VoltsRMS, 100000, "V", "the open-circuit rms voltage read across the test coil")
	}
	return nil
}

func (j *Job) checkRating() *FieldError {
	r := j.Rating
	if e := j.positive("rating.current_a", r.CurrentA, 10000, "A", "the rms line current at full load"); e != nil {
		return e
	}
	if e := j.rangeCheck("rating.speed_rpm", r.SpeedRPM, 0, 200000, "rpm", "the rated speed"); e != nil {
		return e
	}
	if e := j.rangeCheck("rating.voltage_v", r.VoltageV, 0, 100000, "V", "the rated line voltage rms"); e != nil {
		return e
	}
	if r.SpeedRPM == 0 && j.Flux.Given() && j.Turns.Target == TargetDCBus && r.VoltageV == 0 {
		return j.Fail("rating.speed_rpm", "", "is needed to report the voltage at rated speed", "give the rated speed, or rating.voltage_v")
	}
	if !j.Flux.Given() && r.VoltageV == 0 {
		return j.Fail("rating.voltage_v", "", "with no flux source the rated voltage cannot be computed, and the high-voltage test needs it", "give the rated line voltage rms")
	}
	if e := j.rangeCheck("rating.power_w", r.PowerW, 0, 1e8, "W", "the rated output"); e != nil {
		return e
	}
	if _, ok := ReferenceTemperatureC[r.ThermalClass]; r.ThermalClass != 0 && !ok {
		return j.Fail("rating.thermal_class", fmt.Sprint(r.ThermalClass), "must be a thermal class of IEC 60085 with a reference temperature: 105, 130, 155 or 180",
			"130 (B) is usual for small hand-wound machines; or give rating.copper_temperature_c")
	}
	if r.CopperTemperatureC != 0 {
		return j.rangeCheck("rating.copper_temperature_c", r.CopperTemperatureC, -40, 250, "°C", "the copper temperature at full load, e.g. 95 for class 130 (B)")
	}
	return nil
}

func (j *Job) checkBuild() *FieldError {
	b := j.Build
	if e := j.positive("build.lead_length_mm", b.LeadLengthMM, 10000, "mm", "the lead left beyond the stator at each terminal, typically 150 to 500 mm"); e != nil {
		return e
	}
	if e := j.rangeCheck("build.extra_per_coil_mm", b.ExtraPerCoilMM, 0, 5000, "mm", "wire lost per coil to tails and trimming, typically 20 to 50 mm"); e != nil {
		return e
	}
	if e := j.rangeCheck("build.jumper_slack_mm", b.JumperSlackMM, 0, 5000, "mm", "slack left in each jumper so it can be dressed, typically 10 to 30 mm"); e != nil {
		return e
	}
	if b.AmbientC != nil {
		if e := j.rangeCheck("build.ambient_c", *b.AmbientC, -40, 150, "°C", "the winding temperature when it is measured, e.g. 20"); e != nil {
			return e
		}
	}
	if e := j.rangeCheck("build.spool_margin", b.SpoolMargin, 0, 1, "(a fraction)", "0.1 to 0.2 adds 10 to 20 % to the wire bought"); e != nil {
		return e
	}
	return j.rangeCheck("build.practical_fill", b.PracticalFill, 0.1, 0.7, "(a fraction)", "0.30 to 0.45 for round wire wound by hand (common practice)")
}

func (j *Job) checkMachine() *FieldError {
	m := j.Machine
	const f = "machine."
	for _, c := range []struct {
		key     string
		v, hi   float64
		typical string
	}{
		{"air_gap_mm", m.AirGapMM, 50, "the mechanical gap between the tooth tips and the magnets, typically 0.5 to 2 mm"},
		{"magnet_thickness_mm", m.MagnetThicknessMM, 100, "the radial thickness of the surface magnets, typically 2 to 10 mm"},
		{"tooth_tip_height_mm", m.ToothTipHeightMM, 50, "the radial height of the tooth tips beside the slot opening, typically 0.5 to 3 mm"},
		{"yoke_thickness_mm", m.YokeThicknessMM, 1000, "the radial thickness of the stator iron behind the slots"},
		{"mechanical_loss_w", m.MechanicalLossW, 1e7, "the bearing and windage loss at rated speed"},
	} {
		if c.v != 0 {
			if e := j.positive(f+c.key, c.v, c.hi, "mm", c.typical); e != nil {
				if c.key == "mechanical_loss_w" {
					e.Reason = fmt.Sprintf("must be more than 0 and at most %g W", c.hi)
				}
				return e
			}
		}
	}
	if e := j.rangeCheck(f+"magnet_recoil_permeability", m.MagnetRecoilPermeability, 1, 2, "(relative)", "about 1.05 for NdFeB and ferrite magnets"); e != nil {
		return e
	}
	if e := j.rangeCheck(f+"stacking_factor", m.StackingFactor, 0.5, 1, "(a fraction)", "0.95 to 0.97 for 0.5 mm laminations"); e != nil {
		return e
	}
	if e := j.positive(f+"lamination_loss_w_per_kg", m.LaminationLossWPerKg, 50, "W/kg", "the specific loss at 1.5 T, 50 Hz from the steel's grade: 4.00 for M400-50A, 2.70 for M270-35A (EN 10106)"); e != nil {
		return e
	}
	if len(m.LaminationGrade) > 40 || strings.IndexFunc(m.LaminationGrade, unicode.IsControl) >= 0 {
		return j.Fail(f+"lamination_grade", fmt.Sprintf("%q", m.LaminationGrade), "must be a short plain text", `e.g. lamination_grade = "M400-50A"`)
	}
	if m.Operation != OperationGenerator && m.Operation != OperationMotor {
		return j.Fail(f+"operation", fmt.Sprintf("%q", m.Operation), `must be "generator" or "motor"`, "it decides the form of the efficiency and of the voltage under load")
	}
	return nil
}
