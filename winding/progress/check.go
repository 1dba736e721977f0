package progress

import (
	"math"
	"slices"
	"sort"
	"strings"

	"coilwright/winding/journal"
	"coilwright/winding/plan"
	"coilwright/winding/verify"
)

// CheckEvents turns a check made at the command line into record events: one
// reading event per plan test it judged, on that test's step (stamped with
// the step's key), with the test's readings by name and its verdict. Readings
// that were open circuits (OL) are named in the event's note, since a record
// holds finite values only.
func CheckEvents(p *plan.Plan, r verify.Readings, rep *verify.Report) []journal.Event {
	var open []string
	for name, v := range map[string]float64{"uv": r.UV, "vw": r.VW, "wu": r.WU} {
		if math.IsInf(v, 1) {
			open = append(open, name)
		}
	}
	for i, v := range r.PerPhase {
		if math.IsInf(v, 1) && p != nil && p.Layout != nil && i < len(p.Layout.PhaseNames) {
			open = append(open, "phase "+p.Layout.PhaseNames[i])
		}
	}
	sort.Strings(open)
	note := "recorded by coilwright check"
	if len(open) > 0 {
		note += "; open (OL): " + strings.Join(open, ", ")
	}
	var out []journal.Event
	for _, tr := range verify.PerTest(p, r, rep) {
		if tr.Test == plan.TestPolarity {
			continue // the poles go on the steps of their phases, below
		}
		e := journal.Event{Kind: journal.Reading, Step: tr.Step, Test: tr.Test, Readings: tr.Values,
			Verdict: string(tr.Verdict), Note: note}
		out = append(out, Stamp(p, e))
	}
	return append(out, polarityEvents(p, r, rep)...)
}

// polarityEvents records the poles seen (check --polarity) on the plan's
// polarity test steps: each observation on the first polarity step that
// tests its phase, as +1 north and -1 south under plan.PoleKey, with the
// worst verdict of the polarity findings of those phases.
func polarityEvents(p *plan.Plan, r verify.Readings, rep *verify.Report) []journal.Event {
	if p == nil || len(r.Polarity) == 0 {
		return nil
	}
	byStep := map[int]map[string]float64{}
	phasesOf := map[int]map[string]bool{}
	var order []int
	for _, o := range r.Polarity {
		for _, st := range p.Steps {
			if st.Kind != plan.StepTest || st.Test != plan.TestPolarity || !slices.Contains(st.Phases, o.Phase) {
				continue
			}
			if byStep[st.Index] == nil {
				byStep[st.Index], phasesOf[st.Index] = map[string]float64{}, map[string]bool{}
				order = append(order, st.Index)
			}
			byStep[st.Index][plan.PoleKey(o.Tooth)] = o.Pole.Value()
			phasesOf[st.Index][o.Phase] = true
			break
		}
	}
	sort.Ints(order)
	var out []journal.Event
	for _, i := range order {
		verdict := verify.Pass
		for _, f := range rep.Findings {
			if f.Test == plan.TestPolarity && (f.Phase == "" || phasesOf[i][f.Phase]) {
				verdict = verify.Worst(verdict, f.Severity)
			}
		}
		out = append(out, Stamp(p, journal.Event{Kind: journal.Reading, Step: i, Readings: byStep[i],
			Verdict: string(verdict), Note: "poles recorded by coilwright check"}))
	}
	return out
}
