package tui

import (
	"fmt"

	"coilwright/winding/plan"
	"coilwright/winding/verify"
)

// VerifyJudge judges a test step's readings with the check engine
// (winding/verify) for the tests it knows — phase resistance, balance,
// insulation resistance, high-voltage withstand, back-EMF — and by the test's
// own limit for the rest (continuity, insulation between phases).
func VerifyJudge(p *plan.Plan, t plan.Test, v []float64) Verdict {
	values := map[string]float64{}
	for i, f := range fieldsFor(p, t) {
		if i < len(v) {
			values[f.key] = v[i]
		}
	}
	r, ok := verify.ReadingsOf(p, t, values)
	if !ok {
		return limitJudge(p, t, v)
	}
	rep, err := verify.Check(p, r)
	if err != nil {
		return Verdict{Level: "warn", Lines: []string{"the check engine cannot judge these readings: " + err.Error()}}
	}
	out := Verdict{Level: "pass"}
	for _, f := range rep.Findings {
		if f.Test != t.Name && !(t.Name == plan.TestResistance && f.Test == plan.TestBalance) {
			continue
		}
		out.Level = string(verify.Worst(verify.Verdict(out.Level), f.Severity))
		msg := f.Message
		if f.Phase != "" {
			msg = "phase " + f.Phase + ": " + msg
		}
		out.Lines = append(out.Lines, fmt.Sprintf("%s: %s", f.Severity, msg))
	}
	if len(out.Lines) == 0 {
		out.Level = string(rep.Verdict)
		out.Lines = []string{"verdict of the check engine: " + string(rep.Verdict)}
	}
	return out
}
