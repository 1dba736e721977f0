package plan

import (
	"time"

	"coilwright/winding"
)

// Plan is everything a person needs to wind, connect and prove one stator. It
// is plain data built by Build from a job; screens and printouts only read it.
// JSON names follow the plan --json contract written out in the README.
type Plan struct {
	Name     string    `json:"name"`
	Revision string    `json:"revision,omitempty"`
	Date     time.Time `json:"date"` // from the job; fixes printed dates

	Layout     *winding.Layout    `json:"layout"` // the layout contract object
	Connection winding.Connection `json:"connection"`
	Rotor      Rotor              `json:"rotor"` // inner or outer

	TurnsPerCoil int  `json:"turns_per_coil"`
	TurnsSolved  bool `json:"turns_solved"` // true when solved from an EMF or DC-bus target
	EMF          *EMF `json:"emf,omitempty"`

	Wire             Wire    `json:"wire"`
	MeanTurnLengthMM float64 `json:"mean_turn_length_mm"` // of one coil
	Slot             Slot    `json:"slot"`
	SlotFill         float64 `json:"slot_fill"` // copper area in a slot / usable slot area (liner removed)

	Coils []CoilPlan `json:"coils_plan"` // one per wound tooth, in winding order (phase, path, position)
	Paths []PathPlan `json:"paths"`

	PhaseResistance20C     float64 `json:"phase_resistance_20c_ohm"` // mean of the phases
	PhaseResistanceAmbient float64 `json:"phase_resistance_ambient_ohm"`
	AmbientC               float64 `json:"ambient_c"`
	RatedCurrentA          float64 `json:"rated_current_a"`
	CurrentDensityAmm2     float64 `json:"current_density_a_per_mm2"`
	CopperLossW            float64 `json:"copper_loss_w"` // all phases at rated current, at CopperLossTemperatureC
	// CopperLossTemperatureC is the working temperature of the copper loss:
	// the job's copper_temperature_c, else the IEC 60034-1 reference
	// temperature of its thermal class.
	CopperLossTemperatureC     float64 `json:"copper_loss_temperature_c"`
	CopperLossTemperatureBasis string  `json:"copper_loss_temperature_basis"` // where the temperature comes from, in words
	// ThermalClass is the insulation's thermal class of IEC 60085 (the
	// job's rating.thermal_class, job.DefaultThermalClass when not given):
	// it sets the polarization-index minimum that check applies.
	ThermalClass       int     `json:"thermal_class"`
	PhaseResistanceHot float64 `json:"phase_resistance_hot_ohm"` // at CopperLossTemperatureC
	CopperLossAmbientW float64 `json:"copper_loss_ambient_w"`    // all phases at rated current, at AmbientC

	// Added by the plan builder (the fields above are the shared contract).
	PhaseOhms           []PhaseOhm `json:"phase_ohms"`      // each phase between its terminals, from its own path lengths
	PhaseCurrentA       float64    `json:"phase_current_a"` // in one phase at rated line current
	RatedVoltageV       float64    `json:"rated_voltage_v"` // line rms, for the high-voltage test
	RatedVoltageFromEMF bool       `json:"rated_voltage_from_emf"`
	RatedPowerW         float64    `json:"rated_power_w"`
	RatedPowerEstimated bool       `json:"rated_power_estimated"`
	JumperPitchMM       float64    `json:"jumper_pitch_mm"`  // jumper length per slot pitch round the lead end
	JumperRadiusMM      float64    `json:"jumper_radius_mm"` // the radius jumpers run at round the lead end (mid slot depth)

	// Machine is what the wound machine does under load: inductance, torque
	// constant, flux densities, losses, efficiency, charging curve.
	Machine *Machine `json:"machine,omitempty"`

	CopperLengthM float64 `json:"copper_length_m"` // all coils, jumpers and leads, one strand counted per strand
	CopperMassKg  float64 `json:"copper_mass_kg"`
	BuyLengthM    float64 `json:"buy_length_m"` // with the spool margin
	BuyMassKg     float64 `json:"buy_mass_kg"`

	Materials []Material `json:"materials"`
	// Polarity is the pole every wound tooth face shows with DC into its
	// phase at X1, phase by phase in tooth order (polarity.go).
	Polarity []ToothPole `json:"polarity"`

	Steps    []Step   `json:"steps"`
	Tests    []Test   `json:"tests"`
	Warnings []string `json:"warnings"`
	Cautions []string `json:"cautions"`
}

// Rotor says where the rotor is, which decides from where the air gap is seen.
type Rotor string

const (
	InnerRotor Rotor = "inner"
	OuterRotor Rotor = "outer"
)

// EMF reports the voltage the chosen turns give.
type EMF struct {
	FluxPerPoleWb   float64 `json:"flux_per_pole_wb"`
	RatedSpeedRPM   float64 `json:"rated_speed_rpm"`
	PhaseRMSAtRated float64 `json:"phase_rms_at_rated_v"`
	LineRMSAtRated  float64 `json:"line_rms_at_rated_v"`
	// CutInSpeedRPM is the speed at which the built winding's peak line
	// EMF reaches the DC bus plus the diode drops (DC-bus targets).
	CutInSpeedRPM    float64 `json:"cut_in_speed_rpm,omitempty"`
	LineRMSAtCutIn   float64 `json:"line_rms_at_cut_in_v,omitempty"`
	PeakLineAtCutIn  float64 `json:"peak_line_at_cut_in_v,omitempty"` // √2·V_LL = bus + diode drops
	VoltsPerRPMPhase float64 `json:"phase_rms_v_per_rpm"`             // for back-EMF checks at any speed
	Target           string  `json:"target,omitempty"`                // what the turns were solved for, in words

	TargetV        float64 `json:"target_v,omitempty"`         // the target as written
	TargetSpeedRPM float64 `json:"target_speed_rpm,omitempty"` // the speed it is to be reached at
	AtTargetV      float64 `json:"at_target_v,omitempty"`      // what the whole turns give there (DC bus: the peak line EMF net of the diode drops)
}

// Wire is the conductor as wound: one or more strands in hand.
type Wire struct {
	BareDiameterMM    float64 `json:"bare_diameter_mm"`
	OverallDiameterMM float64 `json:"overall_diameter_mm"`
	StrandsInHand     int     `json:"strands_in_hand"`
	CopperAreaMM2     float64 `json:"copper_area_mm2"` // all strands
	AWG               int     `json:"awg,omitempty"`   // when given as AWG
	Grade             int     `json:"grade,omitempty"` // IEC 60317 enamel grade 1 or 2; 0 when measured
	// DiameterTolMM is the IEC 60317 tolerance on the bare diameter (for the
	// resistance band of check).
	DiameterTolMM float64 `json:"diameter_tolerance_mm"`
}

// Slot is the slot cross-section.
type Slot struct {
	AreaMM2       float64 `json:"area_mm2"`
	UsableAreaMM2 float64 `json:"usable_area_mm2"` // liner (and separator where shared) removed
	OpeningMM     float64 `json:"opening_mm,omitempty"`
	MaxTurns      int     `json:"max_turns_at_practical_fill"`
	PracticalFill float64 `json:"practical_fill"`

	DepthMM          float64 `json:"depth_mm"`
	DepthEstimated   bool    `json:"depth_estimated,omitempty"` // area given without depth: taken as square
	MeanWidthMM      float64 `json:"mean_width_mm"`
	LinedPerimeterMM float64 `json:"lined_perimeter_mm"` // walls, bottom, tooth-tip undersides
	LinerAreaMM2     float64 `json:"liner_area_mm2"`
	SeparatorAreaMM2 float64 `json:"separator_area_mm2"` // 0 where no slot holds two phases
	CeilingFill      float64 `json:"ceiling_fill"`       // orthocyclic packing over the enamel: the most round wire can fill
	CoilBuildMM      float64 `json:"coil_build_mm"`      // thickness of one coil side across the slot
}

// PhaseOhm is the expected resistance of one phase between its terminals.
type PhaseOhm struct {
	Phase      string  `json:"phase"`
	Ohm20C     float64 `json:"ohm_20c"`
	OhmAmbient float64 `json:"ohm_ambient"`
}

// CoilPlan is one coil as it is wound.
type CoilPlan struct {
	Tooth       int               `json:"tooth"`
	Phase       string            `json:"phase"`
	Direction   winding.Direction `json:"direction"`
	Path        int               `json:"path"`
	Position    int               `json:"position"`
	Turns       int               `json:"turns"`
	WireLengthM float64           `json:"wire_length_m"` // turns x mean turn, one strand
	Order       int               `json:"order"`         // 1..M in winding order: the N of "coil N of M"
}

// PathPlan is one parallel path of a phase: one continuous wire.
type PathPlan struct {
	Phase       string  `json:"phase"`
	Path        int     `json:"path"`
	Coils       int     `json:"coils"`
	WireLengthM float64 `json:"wire_length_m"` // coils and jumpers between its terminals, one strand
	CutLengthM  float64 `json:"cut_length_m"`  // with both leads and allowances: what to cut from the spool, one strand
	// JumperLengthM is the part of WireLengthM in jumpers (with their slack).
	JumperLengthM float64 `json:"jumper_length_m"`
	// LeadEndsLengthM is WireLengthM and both leads: the wire a meter reads
	// across at the ends of the leads, one strand.
	LeadEndsLengthM float64 `json:"lead_ends_length_m"`
	Ohm20C          float64 `json:"ohm_20c"` // at the ends of its leads
}

// Material is a line of the cut list besides copper: liners, separators,
// sleeving, terminal marks.
type Material struct {
	Item     string  `json:"item"`
	Count    int     `json:"count"`
	SizeText string  `json:"size"`
	Note     string  `json:"note,omitempty"`
	LengthMM float64 `json:"length_mm,omitempty"`
}

// StepKind says what a bench step is.
type StepKind string

const (
	StepSetup     StepKind = "setup"     // choose the lead end, mark tooth 1 and the counting direction: confirm
	StepPrepare   StepKind = "prepare"   // deburr, clean, liners: confirm
	StepCoil      StepKind = "coil"      // wind one coil: count turns
	StepJumper    StepKind = "jumper"    // carry the wire to the next coil: confirm
	StepSeparator StepKind = "separator" // phase separator in a slot shared by two phases: confirm
	StepTerminal  StepKind = "terminal"  // strip, sleeve and mark a lead: confirm
	StepJoin      StepKind = "join"      // star point or delta corner, parallel-path joints: confirm
	StepTest      StepKind = "test"      // a measurement: take readings
)

// Step is one step at the bench, in the order the work is done.
type Step struct {
	Index  int      `json:"index"` // 1-based position in Steps
	Kind   StepKind `json:"kind"`
	Title  string   `json:"title"`
	Detail string   `json:"detail,omitempty"`

	// Coil steps.
	Coil *CoilStep `json:"coil,omitempty"`
	// Jumper steps: the slot it leaves, the slot it enters, its length.
	Jumper *JumperStep `json:"jumper,omitempty"`
	// Separator steps: the slot.
	Slot int `json:"slot,omitempty"`
	// Test steps: the name of the Test in Plan.Tests.
	Test string `json:"test,omitempty"`
	// Polarity test steps: the phases tested, one after another.
	Phases []string `json:"phases,omitempty"`
	// Reminders shown with the step (insulation, safety).
	Reminders []string `json:"reminders,omitempty"`
}

// CoilStep is what the bench guide shows for a coil.
type CoilStep struct {
	Order       int     `json:"order"` // N of "coil N of M"
	Of          int     `json:"of"`    // M
	Tooth       int     `json:"tooth"`
	Phase       string  `json:"phase"`
	Path        int     `json:"path"`
	Position    int     `json:"position"`
	Direction   string  `json:"direction"` // "cw" or "ccw"
	HowToWind   string  `json:"how_to_wind"`
	Turns       int     `json:"turns"`
	WireLengthM float64 `json:"wire_length_m"`
	From        string  `json:"from"` // "start lead U1 (300 mm)" or "jumper from tooth 4"
	To          string  `json:"to"`   // "jumper to tooth 7" or "finish lead U2 (300 mm)"
	SlotBefore  int     `json:"slot_before"`
	SlotAfter   int     `json:"slot_after"`
	// DownSlot and UpSlot: from the lead end the wire goes down DownSlot and
	// comes back up UpSlot (CoilSlots; SlotWords says it in words).
	DownSlot int `json:"down_slot"`
	UpSlot   int `json:"up_slot"`
}

// Test is one line of the test plan. Name is one of the Test* keys, the same
// in the plan, the check's findings, the progress record and the print.
type Test struct {
	Name    string  `json:"name"`
	Title   string  `json:"title"` // in words, for people: "Insulation between phases"
	What    string  `json:"what"`
	Limit   float64 `json:"limit"`
	Unit    Unit    `json:"unit"`
	Compare Compare `json:"compare"` // AtMost, AtLeast, or InBand (Limit is then ± percent)
	// LowPercent and HighPercent bound an InBand test exactly (Limit is the
	// larger of the two, rounded).
	LowPercent  float64 `json:"low_percent,omitempty"`
	HighPercent float64 `json:"high_percent,omitempty"`
	Voltage     float64 `json:"test_voltage_v,omitempty"`
	// VoltageKind says whether Voltage is "AC" (rms, the withstand test) or
	// "DC" (the insulation tests): a tester set to the other kind tests at
	// the wrong stress.
	VoltageKind string  `json:"test_voltage_kind,omitempty"`
	Current     float64 `json:"test_current_a,omitempty"` // DC driven through the winding (polarity test)
	HeatW       float64 `json:"heat_w,omitempty"`         // heat the test current makes in one phase
	// Readings are what the person reads for this test, in order, with the
	// value the meter should show where the plan knows it. A test judged
	// from the readings of another has none of its own (ReadingsFrom).
	Readings []Reading `json:"readings"`
	// ReadingsFrom names the test whose readings this one is worked out
	// from, "" for a test read on its own: the balance is computed from the
	// resistance test's readings, never read a second time
	// (Plan.ReadingsFor resolves it).
	ReadingsFrom string `json:"readings_from,omitempty"`
	// Resolution says the smallest turn error the test can see on this
	// job, in words; empty where it does not apply.
	Resolution string `json:"resolution,omitempty"`
	Source     string `json:"source"`
	Caution    string `json:"caution,omitempty"`
	Note       string `json:"note,omitempty"`
	// Optional tests may be left out; the guide records them as skipped.
	Optional bool `json:"optional,omitempty"`
}
