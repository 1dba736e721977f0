package tui

import (
	"fmt"
	"strconv"
	"strings"

	"github.com/charmbracelet/lipgloss"
	"github.com/charmbracelet/x/ansi"

	"coilwright/winding/plan"
)

// labelWidth is the width of the labels in the step panel.
const labelWidth = 7

// hvCaution is shown with every high-voltage test, whatever the plan says.
const hvCaution = "CAUTION high voltage: only a trained person with a current-limited tester; " +
	"keep everyone clear of the winding and the leads; discharge the winding to the core " +
	"after the test; follow local codes and licensed practice."

// lines collects wrapped panel lines of one width.
type lines struct {
	st *styles
	w  int
	l  []string
}

// text adds s wrapped to the width, each line styled by render.
func (b *lines) text(s string, render func(...string) string) {
	if b.w <= 0 || s == "" {
		return
	}
	for _, ln := range strings.Split(ansi.Wrap(s, b.w, " -"), "\n") {
		b.l = append(b.l, render(ln))
	}
}

// kv adds a labelled value; continuation lines are indented under the value.
func (b *lines) kv(label, value string) { b.kvIn(label, value, b.st.value) }

// kvStrong is kv with the value in bold: the words that must not be missed.
func (b *lines) kvStrong(label, value string) { b.kvIn(label, value, b.st.strong) }

// kvIn adds a labelled value drawn in the given style, wrapped under itself.
func (b *lines) kvIn(label, value string, style lipgloss.Style) {
	if value == "" {
		return
	}
	vw := b.w - labelWidth
	if vw < 8 {
		b.text(label+" "+value, style.Render)
		return
	}
	pad := strings.Repeat(" ", labelWidth)
	for i, ln := range strings.Split(ansi.Wrap(value, vw, " -"), "\n") {
		lab := pad
		if i == 0 {
			lab = b.st.dim.Render(fmt.Sprintf("%-*s", labelWidth, label))
		}
		b.l = append(b.l, ansi.Truncate(lab, labelWidth, "")+style.Render(ln))
	}
}

// raw adds lines as they are, cut to the width.
func (b *lines) raw(ss ...string) {
	for _, s := range ss {
		b.l = append(b.l, ansi.Truncate(s, max(0, b.w), ""))
	}
}

// titled adds a title on the left and a note on the right of one line.
func (b *lines) titled(title, right string) {
	gap := b.w - ansi.StringWidth(title) - ansi.StringWidth(right)
	if gap < 2 {
		b.raw(b.st.coilTitle.Render(title))
		return
	}
	b.raw(b.st.coilTitle.Render(title) + strings.Repeat(" ", gap) + b.st.dim.Render(right))
}

// panel renders the current step in a box of w x h cells.
func (g guideModel) panel(w, h int) []string {
	c := g.c
	boxed := w >= 24 && h >= 5
	cw := w
	if boxed {
		cw = max(0, w-4)
	}
	inner := h
	if boxed {
		inner = max(0, h-2)
	}
	b := g.panelLines(cw, false)
	if len(b.l) > inner {
		b = g.panelLines(cw, true)
	}
	out := b.l
	if len(out) > inner {
		out = out[:inner]
	}
	if !boxed {
		return out
	}
	return strings.Split(c.st.panel.Width(max(0, w-2)).Render(strings.Join(out, "\n")), "\n")
}

// panelLines builds the panel's lines at content width cw; compact keeps the
// turn count to one line for short terminals.
func (g guideModel) panelLines(cw int, compact bool) *lines {
	c := g.c
	b := &lines{st: c.st, w: cw}
	cur := g.shown()
	s, ok := c.step(cur)
	if _, looking := g.lookedAt(); looking {
		b.text(g.lookBanner(s), c.st.banner.Render)
		b.text("esc or home: back to "+g.backTo(), c.st.banner.Render)
	}
	switch {
	case !ok:
		g.doneView(b)
	case s.Kind == plan.StepCoil && s.Coil != nil:
		g.coilView(b, s, compact)
	case isPolarity(s):
		g.polarityView(b, s)
	case s.Kind == plan.StepTest:
		g.testView(b, s)
	default:
		g.checkView(b, s)
	}
	if ok && g.mode == modeNote {
		b.raw("", g.note.View())
	} else if ok && c.prog.Steps[cur].Note != "" {
		b.kv("note", c.prog.Steps[cur].Note)
	}
	if g.mode == modeConfirmUndo {
		if last := c.prog.LastDone(); last >= 0 {
			ls, _ := c.step(last)
			b.raw("")
			b.text(fmt.Sprintf("Undo step %d (%s)? enter/y undoes it, esc keeps it.", ls.Index, ls.Title), c.st.warn.Render)
		}
	}
	return b
}

// lookBanner says which step is looked at and what was recorded on it.
func (g guideModel) lookBanner(s plan.Step) string {
	p := g.c.prog.Steps
	i := s.Index - 1
	state := "to do"
	switch {
	case p[i].Done && s.Coil != nil && p[i].Turns == s.Coil.Turns:
		state = fmt.Sprintf("done, %d turns counted = plan", p[i].Turns)
	case p[i].Done && s.Coil != nil:
		state = fmt.Sprintf("done, %d turns counted, plan %d", p[i].Turns, s.Coil.Turns)
	case p[i].Done && p[i].Reading != nil:
		state = "done, " + strings.ToUpper(p[i].Reading.Verdict)
	case p[i].Done:
		state = "done"
	case s.Coil != nil && p[i].Turns > 0:
		state = fmt.Sprintf("to do, %d of %d turns counted so far", p[i].Turns, s.Coil.Turns)
	}
	return fmt.Sprintf("looking at step %d of %d (%s)", s.Index, len(g.c.steps()), state)
}

// stepOf is the "step i of n" note.
func (g guideModel) stepOf(s plan.Step) string {
	return fmt.Sprintf("step %d of %d", s.Index, len(g.c.steps()))
}

// coilView is the panel of a coil step.
func (g guideModel) coilView(b *lines, s plan.Step, compact bool) {
	c := g.c
	cs := s.Coil
	b.titled(fmt.Sprintf("coil %d of %d", cs.Order, cs.Of), g.stepOf(s))
	b.raw(fmt.Sprintf("tooth %s  phase %s  path %d, coil %d on the path",
		c.st.strong.Render(strconv.Itoa(cs.Tooth)), c.st.phaseStyle(c.phaseIndex(cs.Phase)).Render(cs.Phase), cs.Path, cs.Position))
	b.kvStrong("wind", cs.HowToWind)
	n := c.prog.Steps[s.Index-1].Turns
	if !compact {
		b.raw("")
	}
	g.counter(b, n, cs.Turns, compact, s.Index-1)
	if g.entry != "" {
		b.raw(c.st.errorBar.Render(fmt.Sprintf(" NEW COUNT %s_ ", g.entry)) + " enter sets, esc keeps " + strconv.Itoa(n))
	}
	if g.mode == modeConfirmTurns {
		b.text(fmt.Sprintf("%d turns counted, the plan says %d. y records %d; esc goes back to counting.", n, cs.Turns, n), c.st.warn.Render)
	}
	b.kv("wire", c.wireText(cs))
	b.kv("from", cs.From)
	b.kv("next", cs.To)
	if cs.DownSlot > 0 && cs.UpSlot > 0 {
		b.kv("slots", plan.SlotWords(cs.DownSlot, cs.UpSlot))
	}
	for _, r := range s.Reminders {
		b.kv("mind", r)
	}
}

// counter shows the turn count of step i in large figures with a bar
// against the plan.
func (g guideModel) counter(b *lines, n, want int, compact bool, i int) {
	st := g.c.st
	style := st.counter
	if n == want {
		style = st.counterDone
	}
	big := bigNumber(n)
	of := fmt.Sprintf("of %d turns", want)
	_, looking := g.lookedAt()
	switch {
	case looking && !g.c.prog.Steps[i].Done:
		of += "  not wound yet"
	case looking && n == want:
		of += "  wound as planned"
	case looking && n > want:
		of += fmt.Sprintf("  wound %d over", n-want)
	case looking:
		of += fmt.Sprintf("  wound %d short", want-n)
	case n == want:
		of += "  = plan, enter"
	case n > want:
		of += fmt.Sprintf("  %d over", n-want)
	default:
		of += fmt.Sprintf("  %d to go", want-n)
	}
	bigW := ansi.StringWidth(big[0])
	if !compact && bigW+2+len(of) <= b.w {
		b.raw(style.Render(big[0]), style.Render(big[1])+"  "+of, style.Render(big[2]))
	} else {
		b.raw(c0(b.st, "turns") + style.Render(strconv.Itoa(n)) + " " + of)
	}
	bw := min(40, b.w-2)
	if bw >= 10 && want > 0 && !compact {
		fill := min(bw, n*bw/want)
		b.raw("[" + strings.Repeat("#", fill) + strings.Repeat(".", bw-fill) + "]")
	}
}

// checkView is the panel of a step that needs a confirmation.
func (g guideModel) checkView(b *lines, s plan.Step) {
	c := g.c
	b.titled(string(s.Kind), g.stepOf(s))
	b.text(s.Title, c.st.strong.Render)
	b.text(s.Detail, c.st.value.Render)
	if s.Kind == plan.StepSeparator && s.Slot > 0 {
		q := len(c.teeth)
		next := s.Slot%max(1, q) + 1
		b.kv("slot", fmt.Sprintf("%d, between tooth %d and tooth %d", s.Slot, s.Slot, next))
	}
	if j := s.Jumper; j != nil && s.Detail == "" {
		t := fmt.Sprintf("from tooth %d to tooth %d: %s", j.FromTooth, j.ToTooth, j.Words())
		if j.ReversesSense {
			t += "; the next coil goes round the other way"
		}
		b.kv("wire", t)
	}
	for _, r := range s.Reminders {
		b.kv("mind", r)
	}
	if _, looking := g.lookedAt(); looking {
		return
	}
	b.raw("")
	b.text("Press enter when this is done.", c.st.statusNow.Render)
}

// testView is the panel of a test step.
func (g guideModel) testView(b *lines, s plan.Step) {
	c := g.c
	t, known := c.tests[s.Test]
	b.titled("test", g.stepOf(s))
	b.text(s.Title, c.st.strong.Render)
	if known {
		b.text(t.What, c.st.value.Render)
		b.kv("limit", limitText(t))
		b.kv("source", t.Source)
		if t.Voltage > 0 {
			b.kv("volts", fmt.Sprintf("%s V", fmtNum(t.Voltage)))
		}
		switch {
		case t.Caution != "":
			b.text("CAUTION "+t.Caution, c.st.caution.Render)
		case t.Voltage > 0:
			b.text(hvCaution, c.st.caution.Render)
		}
		b.kv("note", t.Note)
	}
	b.text(s.Detail, c.st.value.Render)
	for _, r := range s.Reminders {
		if !known || r != t.Caution {
			b.kv("mind", r)
		}
	}
	switch g.mode {
	case modeReadings:
		b.raw("")
		for _, f := range g.fields {
			b.raw(f.View())
		}
		if g.inErr != "" {
			b.text(g.inErr, c.st.fail.Render)
		}
	case modeVerdict:
		b.raw("")
		for i, f := range g.fields {
			if i < len(g.labels) {
				b.kv(g.labels[i].label, f.Value()+" "+g.labels[i].unit)
			}
		}
		g.verdictView(b, g.verdict)
		b.text("enter/y records it and goes on; esc types the readings again.", c.st.statusNow.Render)
	default:
		if r := c.prog.Steps[s.Index-1].Reading; r != nil {
			b.kv("last", fmt.Sprintf("%s -> %s", c.readingText(s, r), strings.ToUpper(r.Verdict)))
		}
		if _, looking := g.lookedAt(); looking {
			return
		}
		b.raw("")
		b.text("Press enter to type the readings.", c.st.statusNow.Render)
	}
}

// verdictView shows a verdict with its word and colour.
func (g guideModel) verdictView(b *lines, v *Verdict) {
	if v == nil {
		return
	}
	st := g.c.st
	render := st.warn.Render
	switch v.Level {
	case "pass":
		render = st.ok.Render
	case "fail":
		render = st.fail.Render
	}
	b.raw(render("verdict: " + strings.ToUpper(v.Level)))
	for _, l := range v.Lines {
		b.text(l, st.value.Render)
	}
	if v.Level == "fail" {
		b.text("Find the fault before going on: a failed test is recorded as failed.", st.fail.Render)
	}
}

// limitText says a test's limit in words (plan.LimitText, the one wording).
func limitText(t plan.Test) string { return plan.LimitText(t) }

// doneView is the panel once every step is done.
func (g guideModel) doneView(b *lines) {
	c := g.c
	b.titled("all steps done", fmt.Sprintf("%d of %d", c.prog.DoneCount(), len(c.steps())))
	b.text(fmt.Sprintf("Every step of %s is recorded: %d coils wound.", c.planName(), c.prog.CoilsDone()), c.st.value.Render)
	b.text("o shows every step with its record; u takes back the last one; q quits.", c.st.dim.Render)
}

// c0 is a panel label.
func c0(st *styles, label string) string {
	return st.dim.Render(fmt.Sprintf("%-*s", labelWidth, label))
}
