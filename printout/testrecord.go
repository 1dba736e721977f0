package printout

import (
	"fmt"
	"strings"
	"unicode"
	"unicode/utf8"

	"coilwright/winding/plan"
)

// readingText is how a recorded reading prints: its values by the names
// and units of the test's reading schema (plan.FormatReadings), what was
// written, and the verdict.
func readingText(r Reading, t plan.Test) string {
	var parts []string
	if len(r.Values) > 0 {
		s := plan.FormatReadings(t.Readings, r.Values)
		if len(t.Readings) == 0 && t.Unit != "" && t.Unit != plan.UnitPercent {
			s += " " + string(t.Unit) // a test without a reading schema: its values are in its unit
		}
		parts = append(parts, s)
	}
	if r.Text != "" {
		parts = append(parts, r.Text)
	}
	if r.Verdict != "" {
		parts = append(parts, r.Verdict)
	}
	return strings.Join(parts, " · ")
}

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

// testRecord lists each test with its expected value, acceptance band and a
// space for the reading (filled from the progress record where one exists),
// then the cautions and the sign-off.
func (b *builder) testRecord() {
	p := b.p
	f := b.startFlow(TestRecordPage, "Test record")
	w := b.width()
	x0 := float64(marginMM)
	b.cautionPanel(f)
	// expected values
	f.heading("Expected values")
	exp := []string{
		fmt.Sprintf("phase resistance at 20 °C: %.4g Ω", p.PhaseResistance20C),
	}
	if p.PhaseResistanceAmbient > 0 && p.AmbientC != 0 {
		exp = append(exp, fmt.Sprintf("at %.0f °C: %.4g Ω", p.AmbientC, p.PhaseResistanceAmbient))
	}
	if p.EMF != nil && p.EMF.VoltsPerRPMPhase > 0 {
		exp = append(exp, fmt.Sprintf("back-EMF %.4g V rms per 1000 rpm per phase", 1000*p.EMF.VoltsPerRPMPhase))
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

func (b *builder) testBlock(f *flow, n int, t plan.Test) {
	w := b.width()
	x0 := float64(marginMM)
	left0 := w * 0.58
	what := t.What
	if v := fmt.Sprintf("%.0f V", t.Voltage); t.Voltage > 0 && !strings.Contains(what, v) {
		what = strings.TrimSuffix(what, ".") + ". Test voltage " + v + "."
	}
	if t.Note != "" {
		// the note is a sentence of its own
		what = strings.TrimSuffix(what, ".") + ". " + sentence(t.Note)
	}
	src := "source: " + t.Source
	hText := 11 + paraHeight(left0-4, sizeSmall, Regular, what) + paraHeight(left0-4, sizeTiny, Regular, src)
	if t.Caution != "" {
		hText += paraHeight(left0-10, sizeSmall, Bold, t.Caution) + 1
	}
	rw := w - left0
	accept := wrap(clean(Bold, plan.LimitText(t)), rw-4, sizeBody+1, Bold)
	// the acceptance may take more lines; the reading part moves down
	dy := float64(max(0, len(accept)-1)) * lineStep(sizeBody+1)
	h := max(hText, 30+dy)
	if r, ok := b.o.Readings[t.Name]; ok {
		// a long reading pushes the pass / fail line down
		rh := paraHeight(rw-4, sizeBody, Mono, readingText(r, t))
		if tk := takenText(r); tk != "" {
			rh += paraHeight(rw-4, sizeSmall, Regular, tk)
		}
		h = max(h, dy+18.5+rh+6)
	}
	f.need(h + 2)
	c := f.c
	y := f.y
	c.box(x0, y, w, h, Pen{Width: 0.4, Colour: Ink}, nil)
	title := t.Title
	if title == "" {
		title = t.Name
	}
	c.text(x0+2, y+4.5, sizeBody+1, Bold, Ink, left, fmt.Sprintf("%d. %s", n, title))
	ty := c.para(x0+2, y+9, left0-4, sizeSmall, Regular, Ink, what)
	if t.Caution != "" {
		c.warningSign(x0+4.5, ty-2.4, 4.6)
		ty = c.para(x0+8, ty+0.6, left0-10, sizeSmall, Bold, Ink, t.Caution)
	}
	c.para(x0+2, ty+0.5, left0-4, sizeTiny, Regular, Colour{90, 90, 90}, src)
	// right part: acceptance and reading
	rx := x0 + left0
	c.line(rx, y, rx, y+h, thin)
	c.text(rx+2, y+4, sizeTiny, Regular, Colour{90, 90, 90}, left, "accept when")
	for i, l := range accept {
		c.text(rx+2, y+8.5+float64(i)*lineStep(sizeBody+1), sizeBody+1, Bold, Ink, left, l)
	}
	ry := y + dy // the reading part, below the acceptance
	c.line(rx, ry+11, rx+rw, ry+11, Pen{Width: 0.15, Colour: Faint})
	c.text(rx+2, ry+14, sizeTiny, Regular, Colour{90, 90, 90}, left, "reading")
	if r, ok := b.o.Readings[t.Name]; ok {
		ty := c.para(rx+2, ry+18.5, rw-4, sizeBody, Mono, Ink, readingText(r, t))
		if tk := takenText(r); tk != "" {
			c.para(rx+2, ty, rw-4, sizeSmall, Regular, Ink, tk)
		}
	} else {
		c.line(rx+2, ry+20.5, rx+rw-2, ry+20.5, Pen{Width: 0.2, Colour: Ink})
		c.text(rx+rw-2, ry+19.8, sizeSmall, Regular, Faint, right, string(t.Unit))
	}
	// pass / fail
	py := y + h - 6.5
	pass, fail := false, false
	if r, ok := b.o.Readings[t.Name]; ok {
		pass, fail = r.Verdict == "pass", r.Verdict == "fail"
	}
	c.checkbox(rx+2, py, ckBoxS)
	if pass {
		c.text(rx+2.6, py+3.6, sizeBody, Bold, Ink, left, "x")
	}
	c.text(rx+7.5, py+3.3, sizeSmall, Regular, Ink, left, "pass")
	c.checkbox(rx+20, py, ckBoxS)
	if fail {
		c.text(rx+20.6, py+3.6, sizeBody, Bold, Ink, left, "x")
	}
	c.text(rx+25.5, py+3.3, sizeSmall, Regular, Ink, left, "fail")
	c.text(rx+36, py+3.3, sizeSmall, Regular, Ink, left, "initials")
	c.line(rx+47, py+3.8, rx+rw-2, py+3.8, Pen{Width: 0.2, Colour: Ink})
	f.y += h + 2
}

// sentence starts s with a capital letter.
func sentence(s string) string {
	r, n := utf8.DecodeRuneInString(s)
	if r == utf8.RuneError {
		return s
	}
	return string(unicode.ToUpper(r)) + s[n:]
}
