package progress

import (
	"math"
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
		e := journal.Event{Kind: journal.Reading, Step: tr.Step, Test: tr.Test, Readings: tr.Values,
			Verdict: string(tr.Verdict), Note: note}
		out = append(out, Stamp(p, e))
	}
	return out
}
