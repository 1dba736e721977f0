package verify

import (
	"coilwright/winding/plan"
)

// TestReading is what one check says about one test of the plan's test plan:
// the readings that belong to it, under the names the bench guide uses for
// that test's fields, and the worst verdict of its findings. It lets a check
// made at the command line show up on the plan's own test steps (in the bench
// guide) and on the printed test record.
type TestReading struct {
	Test    string             // plan test name, e.g. plan.TestResistance
	Step    int                // index of the plan's step for that test; 0 when the plan has none
	Values  map[string]float64 // e.g. "uv", "vw", "wu", "temp"
	Verdict Verdict
}

// PerTest splits a check into one TestReading per plan test it judged, in the
// plan's test order. Open readings (+Inf) are left out of Values.
func PerTest(p *plan.Plan, r Readings, rep *Report) []TestReading {
	if p == nil || rep == nil {
		return nil
	}
	worst := map[string]Verdict{}
	for _, f := range rep.Findings {
		name := f.Test
		if v, ok := worst[name]; ok {
			worst[name] = Worst(v, f.Severity)
		} else {
			worst[name] = f.Severity
		}
	}
	// The resistance test of the plan is "every phase inside the band": a
	// phase outside it fails the test even where the report files its
	// diagnosis under balance.
	if _, ok := worst[plan.TestResistance]; ok {
		for _, ph := range rep.Phases {
			if ph.Open || !ph.InBand {
				worst[plan.TestResistance] = Fail
			}
		}
	}
	var out []TestReading
	for _, t := range p.Tests {
		v, ok := worst[t.Name]
		if !ok {
			continue
		}
		tr := TestReading{Test: t.Name, Values: ValuesOf(p, t, r), Verdict: v}
		for _, s := range p.Steps {
			if t.Name == plan.TestPolarity {
				tr.Step = polarityStepOf(p, r.Polarity)
				break
			}
			if s.Kind == plan.StepTest && s.Test == t.Name {
				tr.Step = s.Index
				break
			}
		}
		out = append(out, tr)
	}
	return out
}
