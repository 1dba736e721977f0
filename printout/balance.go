package printout

import (
	"fmt"
	"math"
	"strings"

	"coilwright/winding"
	"coilwright/winding/plan"
	"coilwright/winding/verify"
)

// keyImbalance is the key of the computed cell of a test worked out from
// another's readings (the balance): the imbalance in per cent.
const keyImbalance = "imbalance"

// testNumber is the number a test carries on the record (its place in the
// plan's tests, from 1) and its title; 0 when the plan has no such test.
func (b *builder) testNumber(name string) (int, string) {
	for i, t := range b.p.Tests {
		if t.Name == name {
			title := t.Title
			if title == "" {
				title = t.Name
			}
			return i + 1, title
		}
	}
	return 0, ""
}

// computedRows are the cells of a test worked out from another test's
// readings (plan.Test.ReadingsFrom): one, the computed imbalance in per
// cent, judged against the test's limit. Nothing is read again.
func computedRows() []plan.Reading {
	return []plan.Reading{{Key: keyImbalance, Label: "imbalance, computed", Unit: plan.UnitPercent}}
}

// computedFrom says where a computed test's values come from and how they
// are worked out: the test they are read on (by number and title), the
// formula in short, and this plan's own expected phases worked through it.
func (b *builder) computedFrom(t plan.Test) (from, formula string) {
	n, title := b.testNumber(t.ReadingsFrom)
	if n == 0 {
		return "", ""
	}
	from = fmt.Sprintf("computed from the readings of test %d, %s: nothing is read again", n, title)
	names := b.p.Layout.PhaseNames
	var conv string
	switch {
	case b.p.Connection == winding.Star && len(names) == 3:
		u, v, w := names[0], names[1], names[2]
		conv = fmt.Sprintf("R_%s = (R_%s–%s + R_%s–%s − R_%s–%s) / 2 and so round the phases (star)", u, u, v, w, u, v, w)
	case b.p.Connection == winding.Star:
		conv = "each line reading being two phases in series (star)"
	default:
		conv = "each line reading being one phase in parallel with the others in series (delta)"
	}
	formula = fmt.Sprintf("Phases at 20 °C from the line readings, %s; R_mean = their mean; imbalance = largest |R_phase − R_mean| / R_mean × 100 %%, at most %s (EASA AR100)",
		conv, plan.FormatValue(t.Limit, plan.UnitPercent))
	var ph []float64
	var parts []string
	for _, x := range b.p.PhaseOhms {
		ph = append(ph, x.Ohm20C)
		parts = append(parts, x.Phase+" "+plan.FormatValue(x.Ohm20C, plan.UnitOhm))
	}
	if pct, mean := plan.ImbalancePercent(ph); mean > 0 {
		dev := pct * mean / 100
		formula += fmt.Sprintf(". This plan's phases: %s; mean %s, largest deviation %s, imbalance %s",
			strings.Join(parts, ", "), plan.FormatValue(mean, plan.UnitOhm), plan.FormatValue(dev, plan.UnitOhm), plan.FormatValue(pct, plan.UnitPercent))
	}
	return from, formula
}

// computedValues are the readings a computed test is worked out from, as
// recorded: its own step's (the bench judged them there) or, when that has
// none, the test it reads from; nil when the record has neither.
func (b *builder) computedValues(t plan.Test) map[string]float64 {
	if r, ok := b.o.Readings[t.Name]; ok && len(r.Values) > 0 && !r.Skipped {
		return r.Values
	}
	if r, ok := b.o.Readings[t.ReadingsFrom]; ok && len(r.Values) > 0 && !r.Skipped {
		return r.Values
	}
	return nil
}

// computedCells fills the computed cell from recorded readings by the
// check (winding/verify): the imbalance of the phases at 20 °C. ok is false
// when there are no readings or the check cannot judge them.
func (b *builder) computedCells(t plan.Test, values map[string]float64) (map[string]float64, bool) {
	if len(values) == 0 {
		return nil, false
	}
	rd, ok := verify.ReadingsOf(b.p, t, values)
	if !ok {
		return nil, false
	}
	rep, err := verify.Check(b.p, rd)
	if err != nil || rep == nil || math.IsNaN(rep.ImbalancePercent) || math.IsInf(rep.ImbalancePercent, 0) {
		return nil, false
	}
	for _, ph := range rep.Phases {
		if ph.Open {
			return nil, false
		}
	}
	return map[string]float64{keyImbalance: rep.ImbalancePercent}, true
}
