package job

import "time"

// Job is one stator to wind, as written in the job file.
type Job struct {
	Name     string    `toml:"name"`
	Revision string    `toml:"revision"`
	Date     time.Time `toml:"date"` // a TOML local date; kept at midnight UTC

	Winding Winding `toml:"winding"`
	Stator  Stator  `toml:"stator"`
	Wire    Wire    `toml:"wire"`
	Turns   Turns   `toml:"turns"`
	Flux    Flux    `toml:"flux"`
	Rating  Rating  `toml:"rating"`
	Build   Build   `toml:"build"`
	Machine Machine `toml:"machine"`

	pos  map[string]Pos // where each key was written, by dotted key
	file string         // name given to Parse, for messages
}

// Winding is the slot/pole pair and how the coils are connected.
type Winding struct {
	Slots      int    `toml:"slots"`      // Q
	Poles      int    `toml:"poles"`      // 2p
	Phases     int    `toml:"phases"`     // m, default 3
	Layers     int    `toml:"layers"`     // 2: every tooth wound, 1: alternate teeth; default 2
	Paths      int    `toml:"paths"`      // parallel paths per phase, default 1
	Connection string `toml:"connection"` // "star" or "delta", default star
}

// Rotor placements.
const (
	RotorInner = "inner"
	RotorOuter = "outer"
)

// Stator is the lamination stack and its insulation.
type Stator struct {
	Rotor string `toml:"rotor"` // "inner" or "outer"
	// DiameterMM is the air-gap diameter of the stator: the bore for an inner
	// rotor, the outer diameter over the tooth tips for an outer rotor.
	DiameterMM    float64 `toml:"diameter_mm"`
	StackLengthMM float64 `toml:"stack_length_mm"`
	ToothWidthMM  float64 `toml:"tooth_width_mm"`
	LinerMM       float64 `toml:"liner_mm"`     // slot liner thickness
	SeparatorMM   float64 `toml:"separator_mm"` // phase separator thickness
	Slot          Slot    `toml:"slot"`
}

// Slot is the slot cross-section: either its area, or a trapezoid given by its
// depth and its widths at the air-gap side (top) and at the yoke (bottom).
type Slot struct {
	AreaMM2       float64 `toml:"area_mm2"`
	DepthMM       float64 `toml:"depth_mm"`
	WidthTopMM    float64 `toml:"width_top_mm"`
	WidthBottomMM float64 `toml:"width_bottom_mm"`
	OpeningMM     float64 `toml:"opening_mm"` // between the tooth tips
}

// Parametric reports whether the slot is given by its shape rather than its area.
func (s Slot) Parametric() bool { return s.AreaMM2 == 0 }

// Wire is the conductor: a bare diameter in mm or an AWG size, and either an
// IEC 60317 enamel grade or a measured overall diameter.
type Wire struct {
	BareDiameterMM    float64 `toml:"bare_diameter_mm"`
	AWG               *int    `toml:"awg"`
	Grade             int     `toml:"grade"`
	OverallDiameterMM float64 `toml:"overall_diameter_mm"`
	StrandsInHand     int     `toml:"strands_in_hand"` // default 1
}

// Turn targets.
const (
	TargetPhaseEMF = "phase_emf" // phase EMF rms at speed_rpm
	TargetLineEMF  = "line_emf"  // line-to-line EMF rms at speed_rpm
	TargetDCBus    = "dc_bus"    // DC voltage out of a three-phase diode bridge at speed_rpm (cut-in)
)

// Turns is either the turns per coil or a target to solve them for.
type Turns struct {
	PerCoil  int     `toml:"per_coil"`
	Target   string  `toml:"target"`
	Volts    float64 `toml:"volts"`
	SpeedRPM float64 `toml:"speed_rpm"`
	// BridgeDropV is the forward drop of the two diodes conducting in a
	// bridge, added to the DC target (dc_bus only).
	BridgeDropV float64 `toml:"bridge_drop_v"`
}

// Solved reports whether the turns are to be solved from a target.
func (t Turns) Solved() bool { return t.PerCoil == 0 }

// Flux is the flux source: exactly one of flux per pole, air-gap flux density
// with magnet arc, or a test coil.
type Flux struct {
	PerPoleWb   float64   `toml:"per_pole_wb"`
	AirGapTesla float64   `toml:"air_gap_tesla"` // flat-top flux density under a magnet
	MagnetArc   float64   `toml:"magnet_arc"`    // magnet arc / pole pitch, 0..1
	TestCoil    *TestCoil `toml:"test_coil"`
}

// Given reports whether any flux source is given.
func (f Flux) Given() bool { return f.PerPoleWb > 0 || f.AirGapTesla > 0 || f.TestCoil != nil }

// TestCoil is the shop method: a few turns wound on one tooth, the rotor spun
// at a known speed, the open-circuit rms voltage read.
type TestCoil struct {
	Turns    int     `toml:"turns"`
	SpeedRPM float64 `toml:"speed_rpm"`
	VoltsRMS float64 `toml:"volts_rms"`
}

// Rating is what the machine is built for.
type Rating struct {
	CurrentA float64 `toml:"current_a"` // line current rms
	SpeedRPM float64 `toml:"speed_rpm"` // rated speed
	VoltageV float64 `toml:"voltage_v"` // rated line voltage rms; default the EMF at rated speed
	PowerW   float64 `toml:"power_w"`   // rated power; default estimated from voltage and current
	// ThermalClass is the insulation system's thermal class (IEC 60085:
	// 105, 130, 155 or 180); it sets the working temperature of the copper
	// loss. Default 130.
	ThermalClass int `toml:"thermal_class"`
	// CopperTemperatureC is the working temperature of the copper, when known
	// better than from the thermal class (a temperature-rise test).
	CopperTemperatureC float64 `toml:"copper_temperature_c"`
}

// Build holds the bench allowances and the shop conditions.
type Build struct {
	LeadLengthMM   float64  `toml:"lead_length_mm"`    // beyond the stator, per terminal
	ExtraPerCoilMM float64  `toml:"extra_per_coil_mm"` // working allowance cut per coil
	JumperSlackMM  float64  `toml:"jumper_slack_mm"`   // slack left in each jumper
	AmbientC       *float64 `toml:"ambient_c"`         // winding temperature at test; default 20
	SpoolMargin    float64  `toml:"spool_margin"`      // fraction added to the wire bought
	PracticalFill  float64  `toml:"practical_fill"`    // copper fill the hand can reach; default 0.40
}

// Ambient returns the ambient temperature, 20 °C when not given.
func (b Build) Ambient() float64 {
	if b.AmbientC == nil {
		return 20
	}
	return *b.AmbientC
}

// Operations of the machine, for the efficiency.
const (
	OperationGenerator = "generator"
	OperationMotor     = "motor"
)

// Machine holds the magnetic circuit and the iron: what the plan needs to
// estimate the inductance, the flux densities, the losses and the charging
// curve. Every length is in mm. A value left at 0 has no default unless one
// is named in Normalize; the plan then says what it could not estimate.
type Machine struct {
	AirGapMM          float64 `toml:"air_gap_mm"`          // mechanical gap between tooth tips and magnets
	MagnetThicknessMM float64 `toml:"magnet_thickness_mm"` // radial, surface magnets
	// MagnetRecoilPermeability is the relative recoil permeability of the
	// magnets; default 1.05.
	MagnetRecoilPermeability float64 `toml:"magnet_recoil_permeability"`
	ToothTipHeightMM         float64 `toml:"tooth_tip_height_mm"` // radial height of the tips over the slot opening
	YokeThicknessMM          float64 `toml:"yoke_thickness_mm"`   // radial, behind the slots
	StackingFactor           float64 `toml:"stacking_factor"`     // iron / stack length; default 0.95
	// LaminationLossWPerKg is the specific loss of the lamination at 1.5 T,
	// 50 Hz; default that of LaminationGrade M400-50A.
	LaminationLossWPerKg float64 `toml:"lamination_loss_w_per_kg"`
	LaminationGrade      string  `toml:"lamination_grade"`
	// MechanicalLossW is the bearing and windage loss at the rated speed;
	// when 0 an allowance of DefaultMechanicalPercent of the rated power.
	MechanicalLossW float64 `toml:"mechanical_loss_w"`
	Operation       string  `toml:"operation"` // "generator" (default) or "motor"
}

// Pos is a place in the job file, 1-based.
type Pos struct{ Line, Col int }

// Position returns where a dotted key ("winding.slots") was written, if it was.
func (j *Job) Position(key string) (Pos, bool) {
	p, ok := j.pos[key]
	return p, ok
}
