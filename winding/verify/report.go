package verify

import "coilwright/winding/plan"

// Verdict is the outcome of a check: pass, warn (look again, probably
// usable) or fail (do not put into service before the cause is found).
type Verdict string

const (
	Pass Verdict = "pass"
	Warn Verdict = "warn"
	Fail Verdict = "fail"
)

func (v Verdict) rank() int {
	switch v {
	case Fail:
		return 2
	case Warn:
		return 1
	}
	return 0
}

// Worst returns the more severe of two verdicts.
func Worst(a, b Verdict) Verdict {
	if b.rank() > a.rank() {
		return b
	}
	return a
}

// Finding is one statement of the check: what was seen, where, and what it
// likely means.
type Finding struct {
	Severity Verdict `json:"severity"`
	Phase    string  `json:"phase"` // "" when it concerns no single phase
	Test     string  `json:"test"`  // the plan's test name: plan.TestResistance, plan.TestBalance, plan.TestInsulation, plan.TestHighVoltage, plan.TestBackEMF
	Message  string  `json:"message"`
	// Tooth names the one coil (by its tooth) a finding points at; Teeth
	// lists them where it points at more than one, or at candidates.
	Tooth int   `json:"tooth,omitempty"`
	Teeth []int `json:"teeth,omitempty"`
}

// Report is the whole check, in the shape of the `check --json` contract
// (written out in the README) with extra fields.
type Report struct {
	TemperatureC float64 `json:"temperature_c"`
	Connection   string  `json:"connection"`       // of the plan: "star" or "delta"
	Method       string  `json:"method,omitempty"` // "line-to-line" or "per-phase"
	FourWire     bool    `json:"four_wire"`
	LeadOhm      float64 `json:"lead_ohm"`

	Expected ExpectedOhm `json:"expected_phase_ohm"`
	Band     Band        `json:"band"`
	// Lines are the line-to-line readings after the lead correction (empty
	// for per-phase readings).
	Lines            []Line  `json:"lines,omitempty"`
	Phases           []Phase `json:"phases"`
	ImbalancePercent float64 `json:"imbalance_percent"`
	ImbalanceLimit   float64 `json:"imbalance_limit_percent"`

	Insulation *InsulationResult `json:"insulation,omitempty"`
	Withstand  *WithstandResult  `json:"withstand,omitempty"`
	EMF        *EMFResult        `json:"back_emf,omitempty"`
	Polarity   *PolarityResult   `json:"polarity,omitempty"`

	// Resolution is the smallest turn error each judged test can see on
	// this job (plan.Plan.Resolutions).
	Resolution []plan.Resolution `json:"resolution,omitempty"`

	Verdict  Verdict   `json:"verdict"`
	Findings []Finding `json:"findings"`
	Cautions []string  `json:"cautions,omitempty"`
}

// ExpectedOhm is the plan's phase resistance at 20 °C and at the reading's
// temperature.
type ExpectedOhm struct {
	At20C  float64 `json:"at_20c"`
	AtTemp float64 `json:"at_temp"`
}

// Band is how far a correct winding may lie from the plan's value: the wire
// diameter tolerance (IEC 60317, R ∝ 1/d²) and the length estimate, combined
// worst-case.
type Band struct {
	LowPercent      float64    `json:"low_percent"`  // negative
	HighPercent     float64    `json:"high_percent"` // positive
	Low20C          float64    `json:"low_20c_ohm"`
	High20C         float64    `json:"high_20c_ohm"`
	DiameterMM      float64    `json:"diameter_mm"`
	DiameterTolMM   float64    `json:"diameter_tolerance_mm"`
	LengthPercent   float64    `json:"length_uncertainty_percent"`
	DiameterPercent [2]float64 `json:"diameter_percent"` // low, high from the tolerance alone
}

// Line is one line-to-line reading after the lead correction.
type Line struct {
	Lines string  `json:"lines"` // "UV", "VW", "WU"
	Ohm   float64 `json:"ohm"`   // 0 when open
	Open  bool    `json:"open,omitempty"`
}

// Phase is one phase's resistance, as converted and corrected.
type Phase struct {
	Phase            string  `json:"phase"`
	OhmAtTemp        float64 `json:"ohm_at_temp"`
	Ohm20C           float64 `json:"ohm_at_20c"`
	DeviationPercent float64 `json:"deviation_percent"`
	InBand           bool    `json:"in_band"`
	Open             bool    `json:"open,omitempty"` // values are then 0
}

// InsulationResult is the insulation-resistance test judged by IEEE 43-2013.
type InsulationResult struct {
	IR1MOhm     float64 `json:"ir1_mohm"`
	IR10MOhm    float64 `json:"ir10_mohm,omitempty"`
	IR1At40C    float64 `json:"ir1_at_40c_mohm"`
	MinimumMOhm float64 `json:"minimum_mohm"`
	PI          float64 `json:"polarization_index,omitempty"`
	PIMinimum   float64 `json:"polarization_index_minimum"`
	Volts       float64 `json:"test_voltage_v"`
	RatedPowerW float64 `json:"rated_power_w,omitempty"` // estimated from the plan
	BelowScope  bool    `json:"below_ieee43_scope"`      // under 750 W: limits borrowed
	Verdict     Verdict `json:"verdict"`
}

// WithstandResult is the high-voltage test judged against IEC 60034-1.
type WithstandResult struct {
	Passed      bool    `json:"passed"`
	Volts       float64 `json:"test_voltage_v"`
	Recommended float64 `json:"recommended_v,omitempty"` // IEC 60034-1 value for this machine, 0 if unknown
	Verdict     Verdict `json:"verdict"`
}

// EMFResult is the back-EMF test against the plan's prediction.
type EMFResult struct {
	RPM              float64    `json:"rpm"`
	ExpectedLineV    float64    `json:"expected_line_v"`
	Lines            [3]float64 `json:"lines_v"`           // UV, VW, WU as read
	DeviationPercent float64    `json:"deviation_percent"` // of the mean against the prediction
	ImbalancePercent float64    `json:"imbalance_percent"`
	// Reversed lists the coils (by tooth) whose reversal best fits the
	// readings, when the lines are unbalanced.
	Reversed []int   `json:"reversed_candidates,omitempty"`
	Verdict  Verdict `json:"verdict"`
}
