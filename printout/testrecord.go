package printout

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"coilwright/winding"
	"coilwright/winding/plan"
	"coilwright/winding/verify"
)

// takenText says when and by whom a reading was taken, "" when unknown.
func takenText(r Reading) string {
	var parts []string
	if !r.Taken.IsZero() {
		parts = append(parts, "taken "+dateOf(r.Taken))
	}
	if r.By != "" {
		parts = append(parts, "by "+r.By)
	}
	return strings.Join(parts, " ")
}

// testRecord lists each test with its acceptance, its conditions, one cell
// per reading with the value the meter should show and its window, cells
// for the meter, and pass / fail; readings from the progress record fill
// their cells with the results worked out from them. Cautions first, the
// sign-off last.
func (b *builder) testRecord() {
	p := b.p
	f := b.startFlow(TestRecordPage, "Test record")
	w := b.width()
	x0 := float64(marginMM)
	b.cautionPanel(f)
	// expected values
	f.heading("Expected values")
	exp := []string{
		"phase resistance at 20 °C: " + plan.FormatValue(p.PhaseResistance20C, plan.UnitOhm),
	}
	if p.PhaseResistanceAmbient > 0 && p.AmbientC != 0 {
		exp = append(exp, "at "+plan.FormatValue(p.AmbientC, plan.UnitCelsius)+": "+plan.FormatValue(p.PhaseResistanceAmbient, plan.UnitOhm))
	}
	if ln := b.lineOhmText(); ln != "" {
		exp = append(exp, ln)
	}
	if p.EMF != nil && p.EMF.VoltsPerRPMPhase > 0 {
		exp = append(exp, "back-EMF "+plan.FormatValue(1000*p.EMF.VoltsPerRPMPhase, plan.UnitVolt)+" rms per 1000 rpm per phase")
	}
	f.y = f.c.para(x0, f.y+1, w, sizeBody, Regular, Ink, strings.Join(exp, "   ·   "))
	f.y += 1
	for i, t := range p.Tests {
		b.testBlock(f, i+1, t)
	}
	if len(p.Tests) == 0 {
		f.c.text(x0, f.y+4, sizeBody, Regular, Ink, left, "(the plan lists no tests)")
		f.y += 7
	}
	f.need(40)
	f.y += 3
	f.c.text(x0, f.y+2, sizeSmall, Regular, Ink, left, "Instruments used (make, model, serial, calibration date):")
	for i := 0; i < 2; i++ {
		f.y += 7
		f.c.line(x0, f.y+2, x0+w, f.y+2, Pen{Width: 0.2, Colour: Ink})
	}
	f.y += 6
	b.signOff(f, "Tests passed, stator accepted")
}

// lineOhmText says what the meter reads between two line terminals of the
// connected winding and why, for the plan's connection and phase count:
// "a meter across U–V reads 285.5 mΩ at 15 °C (star: two phases in
// series)". "" when the plan has no line readings.
func (b *builder) lineOhmText() string {
	for _, t := range b.p.Tests {
		if t.Name != plan.TestResistance || len(t.Readings) == 0 || t.Readings[0].Expected == nil {
			continue
		}
		r := t.Readings[0]
		how := "star: two phases in series"
		if b.p.Connection == winding.Delta {
			how = fmt.Sprintf("delta: one phase in parallel with the other %d in series", len(b.p.Layout.PhaseNames)-1)
		}
		return fmt.Sprintf("a meter across %s reads %s at %s (%s)", r.Label, plan.FormatValue(r.Expected.Value, r.Unit),
			plan.FormatValue(r.Expected.AtC, plan.UnitCelsius), how)
	}
	return ""
}

// conditionsText writes a test's voltage and time out in full, from its
// reading schema: "570 V AC, 60 s, no breakdown", "500 V DC, read after
// 1 min". "" for a test without a test voltage.
func conditionsText(t plan.Test) string {
	if t.Voltage <= 0 {
		return ""
	}
	kind := "DC"
	var secs float64
	held := false
	for _, r := range t.Readings {
		switch r.Key {
		case plan.KeyVolts:
			if strings.Contains(r.Label, "AC") {
				kind = "AC"
			}
		case plan.KeySeconds:
			if r.Preset != nil {
				secs = *r.Preset
			}
		case plan.KeyPassed:
			held = true
		case plan.KeyIR1:
			secs = -60 // read after a minute
		}
	}
	s := plan.FormatValue(t.Voltage, plan.UnitVolt) + " " + kind
	switch {
	case secs > 0:
		s += ", " + plan.FormatValue(secs, plan.UnitSecond)
	case secs < 0:
		s += ", read after 1 min"
	}
	if held {
		s += ", no breakdown"
	}
	return s
}

// windowText is the acceptance window of one reading: "265.9 mΩ .. 305.8 mΩ",
// "up to 178.4 mΩ".
func windowText(r plan.Reading) string {
	e := r.Expected
	if e == nil || r.Unit == plan.UnitPole || e.Low == e.High {
		return ""
	}
	if e.Low <= 0 {
		return "up to " + plan.FormatValue(e.High, r.Unit)
	}
	return plan.FormatValue(e.Low, r.Unit) + " .. " + plan.FormatValue(e.High, r.Unit)
}

// expectedText is what the meter should show for one reading of test t:
// the plan's expected value, the test's limit where the reading is in the
// limit's unit, the value to set where the plan presets it.
func expectedText(t plan.Test, r plan.Reading) string {
	switch {
	case r.Expected != nil:
		return plan.FormatValue(r.Expected.Value, r.Unit)
	case r.Preset != nil && r.Key == plan.KeyTemp:
		return "about " + plan.FormatValue(*r.Preset, r.Unit)
	case r.Preset != nil:
		return "set " + plan.FormatValue(*r.Preset, r.Unit)
	case r.Unit == plan.UnitPassFail:
		return "held"
	case r.Unit == t.Unit && r.Unit != "" && t.Compare == plan.AtLeast:
		return "at least " + plan.FormatValue(t.Limit, t.Unit)
	case r.Unit == t.Unit && r.Unit != "" && t.Compare == plan.AtMost:
		return "at most " + plan.FormatValue(t.Limit, t.Unit)
	}
	return ""
}

// expectedText is expectedText with what the plan says beyond the
// reading's schema: a line voltage of the back-EMF test scales with the
// speed, so it is said per 1000 rpm (the plan's line EMF at its rated speed).
func (b *builder) expectedText(t plan.Test, r plan.Reading) string {
	if e := b.p.EMF; t.Name == plan.TestBackEMF && r.Unit == plan.UnitVolt && r.Expected == nil &&
		e != nil && e.RatedSpeedRPM > 0 && e.LineRMSAtRated > 0 {
		return plan.FormatValue(1000*e.LineRMSAtRated/e.RatedSpeedRPM, plan.UnitVolt) + " per 1000 rpm"
	}
	return expectedText(t, r)
}

// unitCell is the unit printed at the end of an empty reading cell.
func unitCell(u plan.Unit) string {
	switch u {
	case plan.UnitPassFail:
		return "held / broke down"
	case plan.UnitPole:
		return "N / S"
	}
	return string(u)
}

// resultLines are the results worked out from a recorded test by the check
// (winding/verify): phase values at 20 °C with their deviation, the
// imbalance and the verdict; nil where the check does not judge the test or
// the record has no values.
func (b *builder) resultLines(t plan.Test, values map[string]float64) []string {
	if len(values) == 0 {
		return nil
	}
	rd, ok := verify.ReadingsOf(b.p, t, values)
	if !ok {
		return nil
	}
	rep, err := verify.Check(b.p, rd)
	if err != nil || rep == nil {
		return nil
	}
	var out []string
	switch t.Name {
	case plan.TestResistance, plan.TestBalance:
		// the resistance test: each phase against the plan; the balance
		// (its imbalance in its own cell): the phases worked through the
		// formula
		var ph []string
		var ohm []float64
		open := false
		for _, x := range rep.Phases {
			if x.Open {
				ph, open = append(ph, x.Phase+" open"), true
				continue
			}
			ohm = append(ohm, x.Ohm20C)
			if t.Name == plan.TestBalance {
				ph = append(ph, x.Phase+" "+plan.FormatValue(x.Ohm20C, plan.UnitOhm))
			} else {
				ph = append(ph, fmt.Sprintf("%s %s (%s %% of the plan)", x.Phase, plan.FormatValue(x.Ohm20C, plan.UnitOhm), signedPct(x.DeviationPercent)))
			}
		}
		line := "phases at 20 °C: " + strings.Join(ph, ", ")
		if pct, mean := plan.ImbalancePercent(ohm); t.Name == plan.TestBalance && !open && mean > 0 {
			line += fmt.Sprintf("; mean %s, largest deviation %s, imbalance %s (limit %s)", plan.FormatValue(mean, plan.UnitOhm),
				plan.FormatValue(pct*mean/100, plan.UnitOhm), plan.FormatValue(rep.ImbalancePercent, plan.UnitPercent), plan.FormatValue(rep.ImbalanceLimit, plan.UnitPercent))
		}
		if len(ph) > 0 {
			out = append(out, line)
		}
	case plan.TestInsulation:
		if ins := rep.Insulation; ins != nil {
			s := "at 40 °C: " + plan.FormatValue(ins.IR1At40C, plan.UnitMegaohm)
			if ins.PI > 0 {
				s += fmt.Sprintf(", polarization index %.2f", ins.PI)
			}
			out = append(out, s)
		}
	case plan.TestBackEMF:
		if e := rep.EMF; e != nil {
			out = append(out, fmt.Sprintf("expected %s line, mean %s %%, imbalance %s",
				plan.FormatValue(e.ExpectedLineV, plan.UnitVolt), signedPct(e.DeviationPercent), plan.FormatValue(e.ImbalancePercent, plan.UnitPercent)))
		}
	}
	v := testVerdict(t, rep)
	if v != "" {
		out = append(out, "verdict: "+string(v))
	}
	return out
}

// testVerdict is the check's verdict on one test: the worst of its findings.
func testVerdict(t plan.Test, rep *verify.Report) verify.Verdict {
	var v verify.Verdict
	for _, f := range rep.Findings {
		if f.Test != t.Name {
			continue
		}
		if v == "" {
			v = f.Severity
		} else {
			v = verify.Worst(v, f.Severity)
		}
	}
	return v
}

// signedPct writes a percentage with its sign and a true minus sign.
func signedPct(v float64) string {
	s := strings.TrimPrefix(plan.FormatValue(math.Abs(v), plan.UnitPercent), "")
	s = strings.TrimSuffix(s, " %")
	if v < 0 {
		return "−" + s
	}
	return "+" + s
}

// cautionPanel prints the plan's cautions beside the warning sign.
func (b *builder) cautionPanel(f *flow) {
	cs := b.p.Cautions
	if len(cs) == 0 {
		cs = []string{"High voltage, strong magnets and rotating parts can injure. Follow local codes and licensed practice."}
	}
	w := b.width()
	tw := w - 22
	h := 8.0
	for _, s := range cs {
		h += paraHeight(tw, sizeSmall+0.5, Regular, "• "+s)
	}
	f.need(h)
	x0 := float64(marginMM)
	f.c.box(x0, f.y, w, h, Pen{Width: 0.8, Colour: Black}, &Fill{Colour{255, 248, 215}})
	f.c.warningSign(x0+10, f.y+4, 13)
	f.c.text(x0+20, f.y+5, sizeBody+0.5, Bold, Ink, left, "Caution")
	y := f.y + 9.5
	for _, s := range cs {
		y = f.c.para(x0+20, y, tw, sizeSmall+0.5, Regular, Ink, "• "+s)
	}
	f.y += h + 2
}

// Test block geometry, mm.
const (
	tbCellH    = 6.2 // one reading row
	tbPad      = 2.0
	resultsPad = 1.2 // between the last cell and the results under it
)

// readingCols are the columns of a test's reading cells, as fractions of
// the width: what is read, what the meter should show, its window, the
// reading.
var readingCols = [...]struct {
	head string
	w    float64
}{{"reading", 0.24}, {"meter should show", 0.2}, {"window", 0.24}, {"read", 0.32}}

// testBlock draws one test: title and acceptance, conditions, what to do,
// one cell per reading, the meter, the results of a recorded reading and
// pass / fail.
func (b *builder) testBlock(f *flow, n int, t plan.Test) {
	w := b.width()
	x0 := float64(marginMM)
	inner := w - 2*tbPad
	what := t.What
	if t.Note != "" {
		// the note is a sentence of its own
		what = strings.TrimSuffix(what, ".") + ". " + sentence(t.Note)
	}
	src := "source: " + t.Source
	title := t.Title
	if title == "" {
		title = t.Name
	}
	head := fmt.Sprintf("%d. %s", n, title)
	accept := "accept when " + plan.LimitText(t)
	cond := conditionsText(t)
	rec, recorded := b.o.Readings[t.Name]
	rows := t.Readings
	shown := rec.Values // what the read column shows, by reading key
	// a test worked out from another's readings (the balance) asks for
	// nothing to be read: it says where its values come from, how they are
	// worked out, and gives the computed cell, filled where the record has
	// the readings
	var from, formula string
	var values map[string]float64
	if t.ReadingsFrom != "" {
		from, formula = b.computedFrom(t)
		rows = computedRows()
		values = b.computedValues(t)
		shown = nil
		if cv, ok := b.computedCells(t, values); ok && !rec.Skipped {
			shown = cv
		}
	}
	if len(rows) == 0 {
		// a test without a reading schema: one cell in its unit
		rows = []plan.Reading{{Key: "", Label: "result", Unit: t.Unit}}
	}
	var results []string
	if recorded && rec.Skipped {
		s := "skipped: this optional test was left out"
		if !rec.Taken.IsZero() {
			s += ", as recorded on " + dateOf(rec.Taken)
		}
		results = []string{s}
	} else if t.ReadingsFrom != "" {
		results = b.resultLines(t, values)
	} else if recorded {
		results = b.resultLines(t, rec.Values)
		if len(t.Readings) == 0 && len(rec.Values) > 0 {
			// no schema to lay the values out by: each under its own name
			// in the test's unit
			keys := make([]string, 0, len(rec.Values))
			for k := range rec.Values {
				keys = append(keys, k)
			}
			sort.Strings(keys)
			vs := make([]string, len(keys))
			for i, k := range keys {
				vs[i] = k + " " + plan.FormatValue(rec.Values[k], t.Unit)
			}
			results = append([]string{"read: " + strings.Join(vs, ", ")}, results...)
		}
		if extra := strings.Trim(strings.Join([]string{rec.Text, takenText(rec)}, " · "), " ·"); extra != "" {
			results = append(results, extra)
		}
	}
	// heights: the head (title to source), the rows, the foot (meter,
	// results, pass / fail)
	headH := tbPad + lineStep(sizeBody+1) + 1
	headH += paraHeight(inner, sizeBody, Bold, accept)
	if cond != "" {
		headH += paraHeight(inner, sizeBody, Bold, "test: "+cond)
	}
	if from != "" {
		headH += paraHeight(inner, sizeBody, Bold, from)
	}
	headH += paraHeight(inner, sizeSmall, Regular, what) + 0.5
	if formula != "" {
		headH += paraHeight(inner, sizeSmall, Regular, formula) + 0.5
	}
	if t.Caution != "" {
		headH += paraHeight(inner-6, sizeSmall, Bold, t.Caution) + 1
	}
	headH += paraHeight(inner, sizeTiny, Regular, src) + 1
	meterH := float64(tbCellH) // the meter's row; none where nothing is read
	if t.ReadingsFrom != "" {
		meterH = 0
	}
	footH := meterH + 9
	for _, l := range results {
		footH += paraHeight(inner, sizeBody, Regular, l)
	}
	if len(results) > 0 {
		footH += resultsPad
	}
	whole := headH + tbCellH*float64(len(rows)+1) + footH
	// the whole block on one sheet where it fits on one (a block is never
	// split to leave a row or two on the next sheet); else at least the head
	// and a few rows before the sheet ends
	if whole+2 <= f.b.bottom()-f.b.top()-3 {
		f.need(whole + 2)
	} else {
		f.need(headH + tbCellH*4 + 2)
	}
	c := f.c
	y0 := f.y
	tx := x0 + tbPad
	ty := y0 + tbPad + 0.75*(sizeBody+1)*ptMM
	c.text(tx, ty, sizeBody+1, Bold, Ink, left, fit(head, inner, sizeBody+1, Bold))
	ty += lineStep(sizeBody + 1)
	ty = c.para(tx, ty+1, inner, sizeBody, Bold, Ink, accept)
	if cond != "" {
		ty = c.para(tx, ty, inner, sizeBody, Bold, Ink, "test: "+cond)
	}
	if from != "" {
		ty = c.para(tx, ty, inner, sizeBody, Bold, Ink, from)
	}
	ty = c.para(tx, ty, inner, sizeSmall, Regular, Ink, what) + 0.5
	if formula != "" {
		ty = c.para(tx, ty, inner, sizeSmall, Regular, Ink, formula) + 0.5
	}
	if t.Caution != "" {
		c.warningSign(tx+2.5, ty-2.6, 4.6)
		ty = c.para(tx+6, ty+0.6, inner-6, sizeSmall, Bold, Ink, t.Caution) + 0.4
	}
	c.para(tx, ty, inner, sizeTiny, Regular, Colour{90, 90, 90}, src)
	cy := y0 + headH
	xs := []float64{tx}
	for _, col := range readingCols {
		xs = append(xs, xs[len(xs)-1]+col.w*inner)
	}
	top := cy // top of the cells on this sheet
	// closeSheet rules the columns and boxes the part of the block on this
	// sheet, down to y
	closeSheet := func(y float64) {
		for _, x := range xs[1:4] {
			c.line(x, top, x, y, Pen{Width: 0.15, Colour: Faint})
		}
		c.box(x0, y0, w, y-y0+0.01, Pen{Width: 0.4, Colour: Ink}, nil)
	}
	columnHead := func() {
		c.box(tx, cy, inner, tbCellH, Pen{}, &Fill{Colour{215, 215, 215}})
		for i, col := range readingCols {
			c.text(xs[i]+1.2, cy+tbCellH/2+1.1, sizeTiny, Bold, Ink, left, col.head)
		}
		cy += tbCellH
	}
	columnHead()
	for i, r := range rows {
		room := f.b.bottom() - tbPad
		if i == len(rows)-1 {
			room -= footH // the last row stays with the foot
		}
		if cy+tbCellH > room && cy > top+tbCellH {
			closeSheet(cy + tbPad)
			f.newPage()
			c = f.c
			y0 = f.y
			c.text(tx, y0+tbPad+0.75*sizeBody*ptMM, sizeBody, Bold, Ink, left, fit(head+" (continued)", inner, sizeBody, Bold))
			cy = y0 + tbPad + lineStep(sizeBody) + 1
			top = cy
			columnHead()
		}
		base := cy + tbCellH/2 + 1.2
		c.text(xs[0]+1.2, base, sizeBody, Bold, Ink, left, fit(r.Label, xs[1]-xs[0]-2.4, sizeBody, Bold))
		c.text(xs[1]+1.2, base, sizeBody, Regular, Ink, left, fit(b.expectedText(t, r), xs[2]-xs[1]-2.4, sizeBody, Regular))
		c.text(xs[2]+1.2, base, sizeSmall, Regular, Ink, left, fit(windowText(r), xs[3]-xs[2]-2.4, sizeSmall, Regular))
		if v, ok := shown[r.Key]; ok && r.Key != "" && !rec.Skipped {
			c.text(xs[3]+1.2, base, sizeBody, Bold, Ink, left, plan.FormatValue(v, r.Unit))
		} else {
			c.line(xs[3]+1.2, cy+tbCellH-1.2, xs[4]-1.2, cy+tbCellH-1.2, Pen{Width: 0.2, Colour: Ink})
			c.text(xs[4]-1.2, base-0.4, sizeTiny, Regular, Colour{90, 90, 90}, right, unitCell(r.Unit))
		}
		c.line(tx, cy+tbCellH, tx+inner, cy+tbCellH, Pen{Width: 0.15, Colour: Faint})
		cy += tbCellH
	}
	if cy+footH > f.b.bottom() {
		closeSheet(cy + tbPad)
		f.newPage()
		c = f.c
		y0 = f.y
		cy = y0 + tbPad
		top = cy
	}
	// the meter used
	cells := cy
	if meterH > 0 {
		base := cy + tbCellH/2 + 1.2
		c.text(xs[0]+1.2, base, sizeSmall, Regular, Ink, left, "meter (make, model)")
		c.line(xs[1]+1.2, cy+tbCellH-1.2, xs[3]-4, cy+tbCellH-1.2, Pen{Width: 0.2, Colour: Ink})
		c.text(xs[3]+1.2, base, sizeSmall, Regular, Ink, left, "serial")
		c.line(xs[3]+10, cy+tbCellH-1.2, xs[4]-1.2, cy+tbCellH-1.2, Pen{Width: 0.2, Colour: Ink})
		cy += meterH
	}
	// results of a recorded reading, clear of the rule above them
	if len(results) > 0 {
		cy += resultsPad
	}
	for _, l := range results {
		cy = c.para(tx+1.2, cy+0.75*sizeBody*ptMM, inner-1.2, sizeBody, Regular, Ink, l) - 0.75*sizeBody*ptMM
	}
	// pass / fail, and skipped for an optional test
	py := cy + 1.6
	pass, fail, skipped := false, false, false
	if recorded {
		pass, fail, skipped = rec.Verdict == "pass" && !rec.Skipped, rec.Verdict == "fail" && !rec.Skipped, rec.Skipped
	}
	boxes := []struct {
		word string
		on   bool
	}{{"pass", pass}, {"fail", fail}}
	if t.Optional || skipped {
		boxes = append(boxes, struct {
			word string
			on   bool
		}{"skipped", skipped})
	}
	bx := tx
	for _, bo := range boxes {
		c.checkbox(bx, py, ckBoxS)
		if bo.on {
			c.tick(bx, py, ckBoxS)
		}
		c.text(bx+5.5, py+3.3, sizeSmall, Regular, Ink, left, bo.word)
		bx += 18
	}
	c.text(bx, py+3.3, sizeSmall, Regular, Ink, left, "initials")
	c.line(bx+11, py+3.8, bx+54, py+3.8, Pen{Width: 0.2, Colour: Ink})
	c.text(bx+59, py+3.3, sizeSmall, Regular, Ink, left, "date")
	c.line(bx+66, py+3.8, tx+inner, py+3.8, Pen{Width: 0.2, Colour: Ink})
	end := py + ckBoxS + 2.8
	for _, x := range xs[1:4] {
		c.line(x, top, x, min(cells, end), Pen{Width: 0.15, Colour: Faint})
	}
	c.box(x0, y0, w, end-y0, Pen{Width: 0.4, Colour: Ink}, nil)
	f.y = end + 2
}

// sentence starts s with a capital letter, unless s starts with a job-file
// key (width_top_mm), written as the job file spells it, or with a symbol
// whose case carries meaning (ω is not Ω, µ not M).
func sentence(s string) string {
	if first, _, _ := strings.Cut(s, " "); strings.Contains(first, "_") {
		return s
	}
	if s == "" || s[0] < 'a' || s[0] > 'z' {
		return s
	}
	return strings.ToUpper(s[:1]) + s[1:]
}
