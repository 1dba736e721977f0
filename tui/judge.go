package tui

import (
	"fmt"
	"strconv"
	"strings"

	"coilwright/winding/plan"
	"coilwright/winding/progress"
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
	// optional fields may be left empty: recorded as 0, "not taken".
	optional bool
	u        plan.Unit      // the reading's unit, as the plan's schema says
	expected *plan.Expected // what the meter should show, nil where unknown
}

// fieldsFor lists the readings of a test from the plan's reading schema
// (plan.Test.Readings); a test without one asks one value.
func fieldsFor(p *plan.Plan, t plan.Test) []field {
	if len(t.Readings) == 0 {
		return []field{{key: "value", label: "reading", unit: string(t.Unit)}}
	}
	out := make([]field, len(t.Readings))
	for i, r := range t.Readings {
		f := field{key: r.Key, label: r.Label, unit: string(r.Unit), optional: r.Optional, u: r.Unit, expected: r.Expected}
		if r.Unit == plan.UnitPassFail {
			f.unit = "1 held, 0 broke down"
		}
		if r.Optional {
			f.unit += ", may be empty"
		}
		if r.Preset != nil {
			f.def = strconv.FormatFloat(*r.Preset, 'g', -1, 64)
		}
		out[i] = f
	}
	return out
}

// limitJudge compares readings with the test's limit: AtMost and AtLeast
// per value, InBand as the imbalance of the readings (plan.ImbalancePercent).
func limitJudge(_ *plan.Plan, t plan.Test, v []float64) Verdict {
	if len(v) == 0 {
		return Verdict{Level: "warn", Lines: []string{"no reading given"}}
	}
	switch t.Compare {
	case plan.AtMost, plan.AtLeast:
		var bad []string
		for i, x := range v {
			if (t.Compare == plan.AtMost && x > t.BoundOf(i)) || (t.Compare == plan.AtLeast && x < t.Limit) {
				who := ""
				if i < len(t.Readings) {
					who = t.Readings[i].Label + " " // which path or pair
				}
				bad = append(bad, who+plan.FormatValue(x, t.Unit))
			}
		}
		if len(bad) > 0 {
			return Verdict{Level: "fail", Lines: []string{fmt.Sprintf("%s outside the limit: must be %s", strings.Join(bad, ", "), plan.LimitText(t))}}
		}
		return Verdict{Level: "pass", Lines: []string{fmt.Sprintf("within the limit (%s)", plan.LimitText(t))}}
	case plan.InBand:
		spread, mean := plan.ImbalancePercent(v)
		if mean <= 0 {
			return Verdict{Level: "fail", Lines: []string{"readings must be above zero"}}
		}
		line := fmt.Sprintf("largest deviation %s of the mean %s (limit %s)", plan.FormatValue(spread, plan.UnitPercent), fmtNum(mean), plan.FormatValue(t.Limit, plan.UnitPercent))
		if spread > t.Limit {
			return Verdict{Level: "fail", Lines: []string{line}}
		}
		return Verdict{Level: "pass", Lines: []string{line}}
	}
	return Verdict{Level: "warn", Lines: []string{"no rule to judge this reading; record it and compare by hand"}}
}

// fmtNum prints a reading without needless digits.
func fmtNum(x float64) string { return fmt.Sprintf("%.4g", x) }

// readingsOf names the values typed into a test step's fields by the
// fields' keys, as the progress record keeps them.
func readingsOf(fs []field, values []float64) map[string]float64 {
	out := make(map[string]float64, len(values))
	for i, v := range values {
		name := fmt.Sprintf("value%d", i+1)
		if i < len(fs) {
			name = fs[i].key
		}
		out[name] = v
	}
	return out
}

// valuesOf lists recorded readings in the order of the fields; ok is false
// for a field with no reading.
func valuesOf(fs []field, r map[string]float64) (vals []float64, ok []bool) {
	for i, f := range fs {
		v, has := r[f.key]
		if !has {
			v, has = r[fmt.Sprintf("value%d", i+1)]
		}
		vals, ok = append(vals, v), append(ok, has)
	}
	return vals, ok
}

// allKnown reports whether every recorded key is one of the schema's.
func allKnown(rs []plan.Reading, v map[string]float64) bool {
	for k := range v {
		known := false
		for _, r := range rs {
			known = known || r.Key == k
		}
		if !known {
			return false
		}
	}
	return true
}

// readingText is a recorded reading in a line: "U–V 412 mΩ, V–W 410 mΩ ...".
func (c *shared) readingText(s plan.Step, r *progress.Reading) string {
	if t := c.tests[s.Test]; len(t.Readings) > 0 && len(r.Values) > 0 && allKnown(t.Readings, r.Values) {
		// By the plan's reading schema, each value with its unit.
		return plan.FormatReadings(t.Readings, r.Values)
	}
	fs := fieldsFor(c.plan, c.tests[s.Test])
	vals, ok := valuesOf(fs, r.Values)
	var parts []string
	for i, f := range fs {
		if ok[i] {
			parts = append(parts, f.label+" "+fmtNum(vals[i]))
		}
	}
	if len(parts) == 0 {
		return "no values"
	}
	return strings.Join(parts, ", ")
}
