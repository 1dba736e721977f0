package verify

import (
	"math"

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
		name := planTestOf(f.Test)
		if name == "" {
			continue
		}
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
	values := func(name string) map[string]float64 {
		out := map[string]float64{}
		put := func(k string, v float64) {
			if !math.IsInf(v, 0) && !math.IsNaN(v) {
				out[k] = v
			}
		}
		switch name {
		case plan.TestResistance, plan.TestBalance:
			if len(r.PerPhase) == 3 {
				for i, n := range p.Layout.PhaseNames[:3] {
					put(lowerASCII(n), r.PerPhase[i])
				}
			} else {
				put("uv", r.UV)
				put("vw", r.VW)
				put("wu", r.WU)
			}
			put("temp", r.TempC)
		case plan.TestInsulation:
			if in := r.Insulation; in != nil {
				put("ir1", in.IR1MOhm)
				if in.IR10MOhm > 0 {
					put("ir10", in.IR10MOhm)
				}
				put("volts", in.Volts)
				put("temp", r.TempC)
			}
		case plan.TestHighVoltage:
			if w := r.Withstand; w != nil {
				put("volts", w.Volts)
			}
		case plan.TestBackEMF:
			if e := r.EMF; e != nil {
				put("uv", e.UV)
				put("vw", e.VW)
				put("wu", e.WU)
				put("rpm", e.RPM)
			}
		}
		return out
	}
	var out []TestReading
	for _, t := range p.Tests {
		v, ok := worst[t.Name]
		if !ok {
			continue
		}
		tr := TestReading{Test: t.Name, Values: values(t.Name), Verdict: v}
		for _, s := range p.Steps {
			if s.Kind == plan.StepTest && s.Test == t.Name {
				tr.Step = s.Index
				break
			}
		}
		out = append(out, tr)
	}
	return out
}

// planTestOf maps the test of a finding to the plan's test name.
func planTestOf(findingTest string) string {
	switch findingTest {
	case "resistance":
		return plan.TestResistance
	case "balance":
		return plan.TestBalance
	case "insulation":
		return plan.TestInsulation
	case "withstand":
		return plan.TestHighVoltage
	case "back-emf":
		return plan.TestBackEMF
	}
	return ""
}

func lowerASCII(s string) string {
	b := []byte(s)
	for i, c := range b {
		if c >= 'A' && c <= 'Z' {
			b[i] = c + 'a' - 'A'
		}
	}
	return string(b)
}
