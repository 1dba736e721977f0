package verify

import (
	"errors"
	"fmt"
	"math"
)

// Readings are what a person measured. Sections left empty are not judged:
// the check command asks for the resistances, a bench test step gives only the
// readings of that step.
type Readings struct {
	// Line-to-line resistances of the connected winding, ohm, as read. +Inf
	// means open (over range).
	UV, VW, WU float64
	// PerPhase holds the phases measured alone before the star point (or the
	// delta corners) are made, in phase order U, V, W. When set, UV, VW and WU
	// are not used.
	PerPhase []float64
	// TempC is the winding temperature (not the room's, if they differ).
	TempC float64
	// LeadOhm is the resistance of the meter leads shorted together,
	// subtracted from each two-wire reading. FourWire readings need none.
	LeadOhm  float64
	FourWire bool

	Insulation *Insulation // insulation resistance to core
	Withstand  *Withstand  // high-voltage (withstand) test
	EMF        *BackEMF    // back-EMF, line to line, at a measured speed

	// Polarity holds the pole seen at each tooth read with DC into its
	// phase at X1 (ValidatePolarity checks them against the plan).
	Polarity []PoleReading
}

// Insulation is an insulation-resistance test of the winding to the core.
type Insulation struct {
	IR1MOhm  float64 // after 1 minute, MΩ
	IR10MOhm float64 // after 10 minutes, MΩ; 0 when not taken
	Volts    float64 // DC test voltage
}

// Withstand is the result of a high-voltage withstand test.
type Withstand struct {
	Passed bool
	Volts  float64 // rms test voltage applied (AC), or DC as applied
}

// BackEMF is the open-circuit voltage between the lines with the rotor spun.
type BackEMF struct {
	UV, VW, WU float64 // V rms, line to line
	RPM        float64
}

// Limits on readings. Readings beyond them are refused as mistakes, not judged.
const (
	// MaxOhm: a copper winding of a hand-wound stator reads milliohm to a few
	// kilo-ohm (0.1 mm wire, 1 km: about 2.2 kΩ); above 1 MΩ it is no winding
	// but an open circuit, which is written as +Inf (OL).
	MaxOhm = 1e6
	// MinTempC, MaxTempC: the linear copper coefficient of IEC 60028 holds in
	// ordinary workshop and service temperatures; no enamelled winding is
	// measured below −60 °C or above 250 °C (common practice).
	MinTempC = -60.0
	MaxTempC = 250.0
	// AbsoluteZeroC is −273.15 °C.
	AbsoluteZeroC = -273.15
	// MaxIRMOhm: insulation testers read up to some TΩ; 10⁷ MΩ = 10 TΩ.
	MaxIRMOhm = 1e7
	// MaxTestVolts: far above any withstand or IR test of a low-voltage winding.
	MaxTestVolts = 20000.0
	// MaxRPM and MaxEMFVolts bound a back-EMF reading.
	MaxRPM      = 200000.0
	MaxEMFVolts = 20000.0
)

// ErrInput matches every *InputError with errors.Is.
var ErrInput = errors.New("verify: invalid reading")

// InputError is a reading that cannot be judged. Field is the name used by the
// check command's flags and measurement files ("uv", "temp", "ir1"...).
type InputError struct {
	Field  string
	Value  float64
	Reason string
}

func (e *InputError) Error() string {
	return fmt.Sprintf("verify: %s = %s: %s", e.Field, fmtValue(e.Value), e.Reason)
}

// Is lets errors.Is(err, ErrInput) match.
func (e *InputError) Is(target error) bool { return target == ErrInput }

func fmtValue(v float64) string {
	if math.IsInf(v, 1) {
		return "OL (open)"
	}
	return fmt.Sprintf("%g", v)
}

func bad(field string, v float64, format string, a ...any) error {
	return &InputError{Field: field, Value: v, Reason: fmt.Sprintf(format, a...)}
}

// HasResistance reports whether resistance readings were given.
func (r Readings) HasResistance() bool {
	return len(r.PerPhase) > 0 || r.UV != 0 || r.VW != 0 || r.WU != 0
}

// onlyPolarity reports whether the readings are polarity observations alone.
func (r Readings) onlyPolarity() bool {
	return len(r.Polarity) > 0 && !r.HasResistance() && r.Insulation == nil && r.Withstand == nil && r.EMF == nil
}

// Validate refuses readings that are not numbers, negative, zero where a
// winding cannot read zero, absurd, or one of three missing.
func (r Readings) Validate() error {
	if !r.HasResistance() && r.Insulation == nil && r.Withstand == nil && r.EMF == nil && len(r.Polarity) == 0 {
		return bad("uv", 0, "no readings given; give the three line-to-line resistances (or per-phase), insulation, withstand, back-EMF or polarity readings")
	}
	if r.onlyPolarity() {
		return nil // no temperature is read for a polarity test
	}
	if err := tempOK(r.TempC); err != nil {
		return err
	}
	if r.HasResistance() {
		if err := r.validateOhm(); err != nil {
			return err
		}
	}
	if in := r.Insulation; in != nil {
		if err := in.validate(); err != nil {
			return err
		}
	}
	if w := r.Withstand; w != nil {
		if err := positive("hv-volts", w.Volts, MaxTestVolts, "the test voltage applied"); err != nil {
			return err
		}
	}
	if e := r.EMF; e != nil {
		if err := positive("rpm", e.RPM, MaxRPM, "the speed at which the back-EMF was read"); err != nil {
			return err
		}
		for _, f := range []struct {
			name string
			v    float64
		}{{"emf-uv", e.UV}, {"emf-vw", e.VW}, {"emf-wu", e.WU}} {
			if err := finite(f.name, f.v); err != nil {
				return err
			}
			if f.v < 0 || f.v > MaxEMFVolts {
				return bad(f.name, f.v, "a back-EMF reading is between 0 and %g V rms", MaxEMFVolts)
			}
		}
	}
	return nil
}

func tempOK(t float64) error {
	switch {
	case math.IsNaN(t) || math.IsInf(t, 0):
		return bad("temp", t, "not a number; give the winding temperature in °C")
	case t < AbsoluteZeroC:
		return bad("temp", t, "below absolute zero (−273.15 °C); give the winding temperature in °C")
	case t < MinTempC || t > MaxTempC:
		return bad("temp", t, "outside %g..%g °C, where the copper correction (IEC 60028) is used; is it in °F or K?", MinTempC, MaxTempC)
	}
	return nil
}

func finite(field string, v float64) error {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return bad(field, v, "not a number")
	}
	return nil
}

func positive(field string, v, limit float64, what string) error {
	if err := finite(field, v); err != nil {
		return err
	}
	if v <= 0 {
		return bad(field, v, "%s must be above zero", what)
	}
	if v > limit {
		return bad(field, v, "%s above %g is not plausible", what, limit)
	}
	return nil
}

func (r Readings) validateOhm() error {
	if err := finite("lead-ohm", r.LeadOhm); err != nil {
		return err
	}
	if r.LeadOhm < 0 || r.LeadOhm > 100 {
		return bad("lead-ohm", r.LeadOhm, "meter leads read between 0 and a few ohm; short them together and read them")
	}
	if r.FourWire && r.LeadOhm != 0 {
		return bad("lead-ohm", r.LeadOhm, "a four-wire reading needs no lead correction; give one or the other")
	}
	type reading struct {
		name string
		v    float64
	}
	var rs []reading
	if len(r.PerPhase) > 0 {
		if len(r.PerPhase) != 3 {
			return bad("per-phase", float64(len(r.PerPhase)), "give three phase resistances, U,V,W")
		}
		rs = []reading{{"per-phase U", r.PerPhase[0]}, {"per-phase V", r.PerPhase[1]}, {"per-phase W", r.PerPhase[2]}}
	} else {
		rs = []reading{{"uv", r.UV}, {"vw", r.VW}, {"wu", r.WU}}
	}
	for _, x := range rs {
		switch {
		case math.IsNaN(x.v) || math.IsInf(x.v, -1):
			return bad(x.name, x.v, "not a number; give ohm, or OL for an open circuit")
		case x.v < 0:
			return bad(x.name, x.v, "a resistance cannot be negative; check the meter's zero")
		case x.v == 0:
			return bad(x.name, x.v, "missing or zero: every one of the three readings is needed, and a winding never reads 0 Ω (use a milliohm range or four-wire)")
		case math.IsInf(x.v, 1):
			continue
		case x.v > MaxOhm:
			return bad(x.name, x.v, "above %g Ω is no copper winding; write OL for an open circuit", MaxOhm)
		case x.v <= r.LeadOhm:
			return bad("lead-ohm", r.LeadOhm, "the lead resistance is not below the reading %s = %g Ω; short the leads and read them again", x.name, x.v)
		}
	}
	return nil
}

func (in *Insulation) validate() error {
	if err := finite("ir1", in.IR1MOhm); err != nil {
		return err
	}
	if in.IR1MOhm < 0 || in.IR1MOhm > MaxIRMOhm {
		return bad("ir1", in.IR1MOhm, "insulation resistance is between 0 and %g MΩ", MaxIRMOhm)
	}
	if err := finite("ir10", in.IR10MOhm); err != nil {
		return err
	}
	if in.IR10MOhm < 0 || in.IR10MOhm > MaxIRMOhm {
		return bad("ir10", in.IR10MOhm, "insulation resistance is between 0 and %g MΩ (0: not taken)", MaxIRMOhm)
	}
	return positive("ir-volts", in.Volts, MaxTestVolts, "the insulation test voltage")
}
