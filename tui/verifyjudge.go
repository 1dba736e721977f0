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
	at := func(i int) float64 {
		if i < len(v) {
			return v[i]
		}
		return 0
	}
	var r verify.Readings
	want := ""
	switch t.Name {
	case plan.TestResistance, plan.TestBalance:
		r = verify.Readings{UV: at(0), VW: at(1), WU: at(2), TempC: at(3)}
		want = "resistance"
		if t.Name == plan.TestBalance {
			want = "balance"
		}
	case plan.TestInsulation:
		r = verify.Readings{TempC: at(2), Insulation: &verify.Insulation{IR1MOhm: at(0), Volts: at(1)}}
		if p != nil {
			r.TempC = at(2)
		}
		want = "insulation"
	case plan.TestHighVoltage:
		r = verify.Readings{Withstand: &verify.Withstand{Volts: at(0), Passed: at(1) >= t.Limit}}
		if p != nil {
			r.TempC = p.AmbientC
		}
		want = "withstand"
	case plan.TestBackEMF:
		r = verify.Readings{EMF: &verify.BackEMF{UV: at(0), VW: at(1), WU: at(2), RPM: at(3)}}
		if p != nil {
			r.TempC = p.AmbientC
		}
		want = "back-emf"
	default:
		return limitJudge(p, t, v)
	}
	rep, err := verify.Check(p, r)
	if err != nil {
		return Verdict{Level: "warn", Lines: []string{"the check engine cannot judge these readings: " + err.Error()}}
	}
	out := Verdict{Level: "pass"}
	for _, f := range rep.Findings {
		if f.Test != want && !(want == "resistance" && f.Test == "balance") {
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
