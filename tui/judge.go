package tui

import (
	"fmt"
	"strconv"
	"strings"

	"coilwright/winding/plan"
)

// Verdict is what a test step's readings mean.
type Verdict struct {
	Level string   // "pass", "warn" or "fail"
	Lines []string // findings in words, most important first
}

// Judge gives the verdict of one test step's readings, in the order of the
// step's fields. The caller supplies one backed by the check engine; without
// one the guide only compares against the test's own limit.
type Judge func(p *plan.Plan, t plan.Test, values []float64) Verdict

// field is one reading a test step asks for.
type field struct {
	key   string // name of the value in the progress record
	label string
	unit  string
	def   string // filled in beforehand (a test voltage, the room temperature)
}

// fieldsFor lists the readings of a test. The tests of the plan builder get
// the readings the check engine judges (line resistances and temperature,
// insulation resistance and test voltage...); any other test asks one value
// per phase when it is judged as a band, else one value.
func fieldsFor(p *plan.Plan, t plan.Test) []field {
	if fs := verifyFields(p, t); fs != nil {
		return fs
	}
	if t.Compare == "band" && p != nil && p.Layout != nil && len(p.Layout.PhaseNames) > 0 {
		out := make([]field, 0, len(p.Layout.PhaseNames))
		for _, n := range p.Layout.PhaseNames {
			out = append(out, field{key: n, label: "phase " + n, unit: t.Unit})
		}
		return out
	}
	return []field{{key: "value", label: "reading", unit: t.Unit}}
}

// limitJudge compares readings with the test's limit: "max" and "min" per
// value, "band" as the spread (max - min) / mean in percent.
func limitJudge(_ *plan.Plan, t plan.Test, v []float64) Verdict {
	if len(v) == 0 {
		return Verdict{Level: "warn", Lines: []string{"no reading given"}}
	}
	switch t.Compare {
	case "max", "min":
		var bad []string
		for _, x := range v {
			if (t.Compare == "max" && x > t.Limit) || (t.Compare == "min" && x < t.Limit) {
				bad = append(bad, fmtNum(x))
			}
		}
		word := "at most"
		if t.Compare == "min" {
			word = "at least"
		}
		if len(bad) > 0 {
			return Verdict{Level: "fail", Lines: []string{fmt.Sprintf("%s %s outside the limit: must be %s %s %s", strings.Join(bad, ", "), t.Unit, word, fmtNum(t.Limit), t.Unit)}}
		}
		return Verdict{Level: "pass", Lines: []string{fmt.Sprintf("within the limit (%s %s %s)", word, fmtNum(t.Limit), t.Unit)}}
	case "band":
		lo, hi, sum := v[0], v[0], 0.0
		for _, x := range v {
			lo, hi = min(lo, x), max(hi, x)
			sum += x
		}
		mean := sum / float64(len(v))
		if mean <= 0 {
			return Verdict{Level: "fail", Lines: []string{"readings must be above zero"}}
		}
		spread := (hi - lo) / mean * 100
		line := fmt.Sprintf("spread %.2f %% of the mean %s %s (limit %s %%)", spread, fmtNum(mean), t.Unit, fmtNum(t.Limit))
		if spread > t.Limit {
			return Verdict{Level: "fail", Lines: []string{line}}
		}
		return Verdict{Level: "pass", Lines: []string{line}}
	}
	return Verdict{Level: "warn", Lines: []string{"no rule to judge this reading; record it and compare by hand"}}
}

// fmtNum prints a reading without needless digits.
func fmtNum(x float64) string { return fmt.Sprintf("%.4g", x) }

// verifyFields are the readings the check engine needs for the plan
// builder's tests, or nil for a test it does not judge step by step.
func verifyFields(p *plan.Plan, t plan.Test) []field {
	temp := ""
	if p != nil {
		temp = strconv.FormatFloat(p.AmbientC, 'g', -1, 64)
	}
	lines := []field{
		{key: "uv", label: "U-V", unit: "ohm"},
		{key: "vw", label: "V-W", unit: "ohm"},
		{key: "wu", label: "W-U", unit: "ohm"},
		{key: "temp", label: "temp", unit: "degC winding", def: temp},
	}
	switch t.Name {
	case plan.TestResistance, plan.TestBalance:
		return lines
	case plan.TestInsulation:
		return []field{
			{key: "ir1", label: "IR 1 min", unit: "Mohm"},
			{key: "volts", label: "test V", unit: "V DC", def: strconv.FormatFloat(t.Voltage, 'g', -1, 64)},
			{key: "temp", label: "temp", unit: "degC winding", def: temp},
		}
	case plan.TestHighVoltage:
		return []field{
			{key: "volts", label: "applied", unit: "V AC", def: strconv.FormatFloat(t.Voltage, 'g', -1, 64)},
			{key: "seconds", label: "held", unit: "s, no breakdown"},
		}
	case plan.TestBackEMF:
		return []field{
			{key: "uv", label: "U-V", unit: "V rms"},
			{key: "vw", label: "V-W", unit: "V rms"},
			{key: "wu", label: "W-U", unit: "V rms"},
			{key: "rpm", label: "speed", unit: "rpm"},
		}
	}
	return nil
}
