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
// The label column is labelWidth wide, or wider for a longer label, and
// always leaves a space before the value.
func (b *lines) kvIn(label, value string, style lipgloss.Style) {
	if value == "" {
		return
	}
	lw := max(labelWidth, ansi.StringWidth(label)+1)
	vw := b.w - lw
	if vw < 8 {
		b.text(label+" "+value, style.Render)
		return
	}
	pad := strings.Repeat(" ", lw)
	for i, ln := range strings.Split(ansi.Wrap(value, vw, " -"), "\n") {
		lab := pad
		if i == 0 {
			lab = b.st.dim.Render(label + strings.Repeat(" ", lw-ansi.StringWidth(label)))
		}
		b.l = append(b.l, lab+style.Render(ln))
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

// Panel detail levels, roomiest first: the guide takes the first level whose
// live and useful parts fit the panel. The roomy levels draw the count in
// '#' figures of size maxFigure down to 1.
const (
	maxFigure    = 5
	levelNormal  = maxFigure + iota - 1 // the coil picture and the count in three-row figures
	levelCompact                        // no picture; the count in three-row figures
	levelMinimal                        // no picture; the count on one line
	levels
)

// figureSize is the size of the '#' figures at level lv, 0 for none.
func figureSize(lv int) int { return max(0, maxFigure-lv) }

// panel renders the shown step in a box of w x h cells; ok is false when
// even its live parts do not fit.
func (g guideModel) panel(w, h int) ([]string, bool) {
	c := g.c
	boxed := w >= 24 && h >= 5
	cw, inner := w, h
	if boxed {
		cw, inner = max(0, w-4), max(0, h-2)
	}
	pp, fits := g.fitLevel(cw, inner)
	out := pp.fit(inner, g.morePage(), c.st)
	if !boxed {
		return out, fits
	}
	return strings.Split(c.st.panel.Width(max(0, w-2)).Render(strings.Join(out, "\n")), "\n"), fits
}

// fitLevel builds the panel at the roomiest level that fits. Only a coil's
// panel changes with the level above levelNormal, and there only by the
// height of its figures, so the roomy levels are measured from the normal
// one instead of built one by one: the words beside the picture grow from 9
// rows to 2k+9 for figures of size k, the picture from 9 rows to 10.
func (g guideModel) fitLevel(cw, inner int) (*panelParts, bool) {
	pp := g.panelParts(cw, inner, levelNormal)
	if need := pp.need(); need <= inner {
		if s, ok := g.c.step(g.shown()); ok && s.Coil != nil && cw-toothPictureWidth-coilGap >= coilWordsMin {
			for lv := 0; lv < levelNormal; lv++ {
				k := figureSize(lv)
				if need-9+max(10, 2*k+9) <= inner {
					return g.panelParts(cw, inner, lv), true
				}
			}
		}
		return pp, true
	}
	for lv := levelNormal + 1; lv < levels; lv++ {
		pp = g.panelParts(cw, inner, lv)
		if pp.need() <= inner {
			return pp, true
		}
	}
	return pp, false
}

// panelParts builds the parts of the shown step at content width cw for a
// panel of inner rows, at detail level lv.
func (g guideModel) panelParts(cw, inner, lv int) *panelParts {
	c := g.c
	pp := &panelParts{st: c.st, w: cw}
	cur := g.shown()
	s, ok := c.step(cur)
	if _, looking := g.lookedAt(); looking {
		pp.add(partLive, func(b *lines) {
			b.text(g.lookBanner(s), c.st.banner.Render)
			b.text("esc or home: back to "+g.backTo(), c.st.banner.Render)
		})
	}
	if g.mode == modeConfirmUndo {
		// The question first: it is about another step than the panel's.
		if last := c.prog.LastDone(); last >= 0 {
			ls, _ := c.step(last)
			pp.add(partLive, func(b *lines) {
				b.text(fmt.Sprintf("Undo step %d (%s)? enter/y undoes it, esc keeps it.", ls.Index, ls.Title), c.st.warn.Render)
			})
		}
	}
	switch {
	case !ok:
		pp.add(partLive, g.doneView)
	case s.Kind == plan.StepCoil && s.Coil != nil:
		g.coilView(pp, s, inner, lv)
	case isPolarity(s):
		g.polarityView(pp, s)
	case s.Kind == plan.StepTest:
		g.testView(pp, s)
	default:
		g.checkView(pp, s)
	}
	if ok && g.mode == modeNote {
		pp.add(partLive, func(b *lines) { b.raw(g.note.View()) })
	} else if ok && c.prog.Steps[cur].Note != "" {
		pp.add(partUseful, func(b *lines) { b.kv("note", c.prog.Steps[cur].Note) })
	}
	return pp
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
	case p[i].Done && p[i].Skipped:
		state = "skipped"
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

// coilView is the panel of a coil step: at the roomier levels the coil in
// hand drawn from the air gap beside its words and the count; at the tighter
// ones the words and the count alone. The tooth, the sense in words, the
// down and up slots and the count are live at every level.
func (g guideModel) coilView(pp *panelParts, s plan.Step, inner, lv int) {
	c := g.c
	cs := s.Coil
	n := c.prog.Steps[s.Index-1].Turns
	pp.add(partLive, func(b *lines) { b.titled(fmt.Sprintf("coil %d of %d", cs.Order, cs.Of), g.stepOf(s)) })
	const gap = coilGap
	colW := pp.w - toothPictureWidth - gap
	side := lv <= levelNormal && colW >= coilWordsMin
	if side {
		k := figureSize(lv)
		pic := toothPicture(cs, k > 0)
		if digits := len(strconv.Itoa(max(n, cs.Turns))); k > 0 && digits*(2*k+3)-1 > colW {
			k = 0 // too wide: the three-row figures
		}
		words := g.coilWords(cs, colW, n, k)
		pp.add(partLive, func(b *lines) {
			for i := 0; i < max(len(pic), len(words)); i++ {
				l, r := "", ""
				if i < len(pic) {
					l = pic[i] // plain ASCII, in the terminal's own colour
				}
				if i < len(words) {
					r = words[i]
				}
				b.raw(l + strings.Repeat(" ", max(0, toothPictureWidth-ansi.StringWidth(l))+gap) + r)
			}
		})
	} else {
		pp.add(partLive, func(b *lines) {
			b.raw(fmt.Sprintf("tooth %s  phase %s  path %d, coil %d on the path",
				c.st.strong.Render(strconv.Itoa(cs.Tooth)), c.st.phaseStyle(c.phaseIndex(cs.Phase)).Render(cs.Phase), cs.Path, cs.Position))
			b.text(senseWord(cs)+" seen from the air gap", c.st.coilTitle.Render)
			b.text(plan.SlotWords(cs.DownSlot, cs.UpSlot), c.st.strong.Render)
			g.counter(b, n, cs.Turns, lv == levelMinimal, s.Index-1)
			b.kv("from", shortEnd(cs.From)+"; next "+shortEnd(cs.To))
		})
	}
	if g.entry != "" {
		pp.add(partLive, func(b *lines) {
			b.raw(c.st.errorBar.Render(fmt.Sprintf(" NEW COUNT %s_ ", g.entry)) + " enter sets, esc keeps " + strconv.Itoa(n))
		})
	}
	if g.mode == modeConfirmTurns {
		pp.add(partLive, func(b *lines) {
			b.text(fmt.Sprintf("%d turns counted, the plan says %d. y records %d; esc goes back to counting.", n, cs.Turns, n), c.st.warn.Render)
		})
	}
	pp.add(partUseful, func(b *lines) {
		if bw := min(40, b.w-2); bw >= 10 && cs.Turns > 0 && lv <= levelCompact {
			fill := min(bw, n*bw/cs.Turns)
			b.raw("[" + strings.Repeat("#", fill) + strings.Repeat(".", bw-fill) + "]")
		}
		b.kv("wire", c.wireText(cs))
	})
	pp.add(partProse, func(b *lines) {
		b.kv("from", cs.From)
		b.kv("next", cs.To)
		b.text(cs.HowToWind, c.st.value.Render)
		for _, r := range s.Reminders {
			b.kv("mind", r)
		}
	})
}

// coilGap is the gap between the coil picture and its words.
const coilGap = 3

// coilWordsMin is the narrowest column the coil's words take beside the
// picture.
const coilWordsMin = 26

// senseWord is the coil's sense in capitals, as the winder sees it from the
// air gap.
func senseWord(cs *plan.CoilStep) string {
	if cs.Direction == "ccw" {
		return "COUNTER-CLOCKWISE"
	}
	return "CLOCKWISE"
}

// coilWords is the column beside the coil picture: the tooth, the sense in
// words, the slots and the count (k > 0: figures 2k+3 rows tall).
func (g guideModel) coilWords(cs *plan.CoilStep, w, n, k int) []string {
	c := g.c
	st := c.st
	cut := func(s string) string { return ansi.Truncate(s, w, "") }
	out := []string{
		cut(fmt.Sprintf("tooth %s  phase %s  path %d",
			st.strong.Render(strconv.Itoa(cs.Tooth)), st.phaseStyle(c.phaseIndex(cs.Phase)).Render(cs.Phase), cs.Path)),
		st.coilTitle.Render(cut(senseWord(cs))),
		st.value.Render(cut("seen from the air gap")),
		st.strong.Render(cut(plan.SlotWords(cs.DownSlot, cs.UpSlot))),
		"",
	}
	style := st.counter
	if n == cs.Turns {
		style = st.counterDone
	}
	of, state := g.countWords(n, cs.Turns, g.shown())
	if k > 0 {
		// "of 18 turns, as planned: press enter" on the row under the
		// figures when it fits the column; otherwise "of 18 turns" takes
		// the blank row above them, so the words are never cut and the
		// rows stay as many as fitLevel counts.
		tail := of + ", " + state
		if ansi.StringWidth(tail) > w {
			out[len(out)-1] = cut(of)
			tail = state
		}
		for _, f := range scaledNumber(n, k) {
			out = append(out, cut(style.Render(f)))
		}
		return append(out, cut(tail))
	}
	b := bigNumber(n)
	for i, f := range b {
		line := style.Render(f)
		if i == 1 {
			line += "  " + of
		}
		out = append(out, cut(line))
	}
	return append(out, cut(state))
}

// countWords says the count against the plan: "of 18 turns" and where it
// stands ("5 to go", "= plan, press enter").
func (g guideModel) countWords(n, want, i int) (of, state string) {
	of = fmt.Sprintf("of %d turns", want)
	_, looking := g.lookedAt()
	switch {
	case looking && !g.c.prog.Steps[i].Done:
		state = "not wound yet"
	case looking && n == want:
		state = "wound as planned"
	case looking && n > want:
		state = fmt.Sprintf("wound %d over", n-want)
	case looking:
		state = fmt.Sprintf("wound %d short", want-n)
	case n == want:
		state = "as planned: press enter"
	case n > want:
		state = fmt.Sprintf("%d over", n-want)
	default:
		state = fmt.Sprintf("%d to go", want-n)
	}
	return of, state
}

// counter shows the count of step i: three-row figures, or one line when
// compact.
func (g guideModel) counter(b *lines, n, want int, compact bool, i int) {
	st := g.c.st
	style := st.counter
	if n == want {
		style = st.counterDone
	}
	of, state := g.countWords(n, want, i)
	of += "  " + state
	big := bigNumber(n)
	if !compact && ansi.StringWidth(big[0])+2+len(of) <= b.w {
		b.raw(style.Render(big[0]), style.Render(big[1])+"  "+of, style.Render(big[2]))
		return
	}
	b.raw(c0(b.st, "turns") + style.Render(strconv.Itoa(n)) + " " + of)
}

// checkView is the panel of a step that needs a confirmation.
func (g guideModel) checkView(pp *panelParts, s plan.Step) {
	c := g.c
	_, looking := g.lookedAt()
	pp.add(partLive, func(b *lines) {
		b.titled(kindWord(s.Kind), g.stepOf(s))
		b.text(s.Title, c.st.strong.Render)
	})
	switch {
	case s.Jumper != nil:
		j := s.Jumper
		pp.add(partLive, func(b *lines) {
			b.kvStrong("leaves", fmt.Sprintf("slot %d at the lead end (the up slot of tooth %d)", j.LeavesSlot, j.FromTooth))
			b.kvStrong("enters", fmt.Sprintf("slot %d (the down slot of tooth %d)", j.EntersSlot, j.ToTooth))
			b.kvStrong("way", jumperWay(*j))
			if j.LengthMM > 0 {
				b.kv("length", fmt.Sprintf("about %.0f mm with the slack", j.LengthMM))
			}
			if j.ReversesSense {
				b.kv("then", "the next coil is wound the other way round")
			} else {
				b.kv("then", "the next coil is wound the same way round")
			}
		})
	case s.Kind == plan.StepSeparator && s.Slot > 0:
		q := len(c.teeth)
		next := s.Slot%max(1, q) + 1
		pp.add(partLive, func(b *lines) {
			b.kvStrong("slot", fmt.Sprintf("%d, between tooth %d and tooth %d", s.Slot, s.Slot, next))
		})
		pp.add(partUseful, func(b *lines) { b.text(s.Detail, c.st.value.Render) })
	default:
		pp.add(partUseful, func(b *lines) { b.text(s.Detail, c.st.value.Render) })
	}
	if !looking {
		pp.add(partLive, func(b *lines) { b.text("Press enter when this is done.", c.st.statusNow.Render) })
	}
	pp.add(partProse, func(b *lines) {
		for _, r := range s.Reminders {
			b.kv("mind", r)
		}
	})
}

// jumperWay is the jumper's run in slot pitches and its way round.
func jumperWay(j plan.JumperStep) string {
	if j.SlotPitches == 0 {
		return "straight back down the same slot"
	}
	way := "counter-clockwise"
	if j.Way == plan.WayCW {
		way = "clockwise"
	}
	return fmt.Sprintf("%d slot pitch%s, %s seen from the lead end", j.SlotPitches, map[bool]string{true: "", false: "es"}[j.SlotPitches == 1], way)
}

// kindWord names a step's kind on its panel.
func kindWord(k plan.StepKind) string {
	if k == plan.StepSetup {
		return "set up"
	}
	return string(k)
}

// testView is the panel of a test step: its fields, errors and verdict are
// live; what it is, its limit, source and cautions are prose, cut first.
func (g guideModel) testView(pp *panelParts, s plan.Step) {
	c := g.c
	t, known := c.tests[s.Test]
	pp.add(partLive, func(b *lines) {
		b.titled("test", g.stepOf(s))
		b.text(s.Title, c.st.strong.Render)
	})
	if known {
		pp.add(partUseful, func(b *lines) {
			b.kv("limit", limitText(t)) // with the test voltage, where there is one
		})
	}
	switch g.mode {
	case modeReadings:
		pp.add(partLive, func(b *lines) {
			for i := range g.fields {
				b.raw(g.fieldLine(t, i, b.w)...)
			}
			if g.inErr != "" {
				b.text(g.inErr, c.st.fail.Render)
			}
		})
	case modeVerdict:
		pp.add(partLive, func(b *lines) {
			// The values in a column after the longest label, so a
			// label never runs into its value.
			lw := 0
			for _, f := range g.labels {
				lw = max(lw, ansi.StringWidth(f.label))
			}
			for i := range g.fields {
				if i < len(g.labels) && i < len(g.values) {
					b.kvIn(g.labels[i].label+strings.Repeat(" ", max(0, lw+1-ansi.StringWidth(g.labels[i].label))), g.verdictValue(t, i), c.st.strong)
				}
			}
			g.verdictView(b, g.verdict)
			yes, again := "enter/y records it and goes on", "esc types the readings again."
			if g.verdict != nil && g.verdict.Level == "fail" {
				yes = "y records it as failed"
			}
			if s.Test == plan.TestBalance {
				again = fmt.Sprintf("esc goes back (these are step %d's readings: undo it to change them).", c.resistanceStep()+1)
			}
			b.text(yes+"; "+again, c.st.statusNow.Render)
		})
	default:
		pp.add(partLive, func(b *lines) {
			if s.Test != plan.TestBalance {
				for _, e := range expectLines(t, b.w) {
					b.text(e, c.st.value.Render)
				}
			}
			st := c.prog.Steps[s.Index-1]
			if r := st.Reading; r != nil {
				b.kv("last", fmt.Sprintf("%s -> %s", c.readingText(s, r), strings.ToUpper(r.Verdict)))
			}
			if st.Done && st.Skipped {
				b.kv("last", "skipped (an optional test left out)")
			}
			if _, looking := g.lookedAt(); looking {
				return
			}
			switch {
			case s.Test == plan.TestBalance:
				b.text("Press enter to judge the balance from the resistance readings already recorded.", c.st.statusNow.Render)
			case t.Optional:
				b.text("Press enter to type the readings, or s to skip this optional test.", c.st.statusNow.Render)
			default:
				b.text("Press enter to type the readings.", c.st.statusNow.Render)
			}
		})
	}
	if known {
		// Cautions go before the prose: they are the last words cut.
		pp.add(partUseful, func(b *lines) {
			switch {
			case t.Caution != "":
				b.text("CAUTION "+t.Caution, c.st.caution.Render)
			case t.Voltage > 0:
				b.text(hvCaution, c.st.caution.Render)
			}
		})
	}
	// The step's own instruction ("zero the meter leads first") before the
	// prose.
	pp.add(partUseful, func(b *lines) { b.text(s.Detail, c.st.value.Render) })
	pp.add(partProse, func(b *lines) {
		if known {
			b.text(t.What, c.st.value.Render)
			b.kv("source", t.Source)
			b.kv("note", t.Note)
		}
		for _, r := range s.Reminders {
			if !known || r != t.Caution {
				b.kv("mind", r)
			}
		}
	})
}

// verdictView shows a verdict with its word and colour.
func (g guideModel) verdictView(b *lines, v *Verdict) {
	if v == nil {
		return
	}
	st := g.c.st
	g.verdictLines(b, v)
	if v.Level == "fail" {
		b.text("Find the fault before going on: a failed test is recorded as failed.", st.fail.Render)
	}
}

// verdictLines shows a verdict's word, in its colour, and its lines.
func (g guideModel) verdictLines(b *lines, v *Verdict) {
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
}

// limitText says a test's limit in words (plan.LimitText, the one wording).
func limitText(t plan.Test) string { return plan.LimitText(t) }

// doneView is the panel once every step is done.
func (g guideModel) doneView(b *lines) {
	c := g.c
	b.titled("all steps done", fmt.Sprintf("%d of %d", c.prog.DoneCount(), len(c.steps())))
	b.text(fmt.Sprintf("Every step of %s is recorded: %d coils wound.", c.planName(), c.prog.CoilsDone()), c.st.value.Render)
	// A failed test is not forgotten at the end: named with its step.
	var failed, skipped []string
	for i, s := range c.steps() {
		ps := c.prog.Steps[i]
		switch {
		case ps.Skipped:
			skipped = append(skipped, fmt.Sprintf("step %d", s.Index))
		case ps.Reading != nil && ps.Reading.Verdict == "fail":
			failed = append(failed, fmt.Sprintf("step %d (%s)", s.Index, strings.TrimPrefix(s.Title, "Test: ")))
		}
	}
	if len(failed) > 0 {
		b.text("FAILED: "+strings.Join(failed, ", ")+": find the fault and test again before the stator is used.", c.st.fail.Render)
	}
	if len(skipped) > 0 {
		b.text("skipped (optional): "+strings.Join(skipped, ", "), c.st.dim.Render)
	}
	b.text("o shows every step with its record; u takes back the last one; q quits.", c.st.dim.Render)
}

// c0 is a panel label.
func c0(st *styles, label string) string {
	return st.dim.Render(fmt.Sprintf("%-*s", labelWidth, label))
}
