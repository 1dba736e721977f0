package tui

import (
	"fmt"
	"strconv"
	"strings"

	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/x/ansi"

	"coilwright/winding/plan"
)

// Test steps as the meter shows them: one field per reading of the plan's
// schema, with what the meter should read beside each field; the balance
// judged from the resistance readings already typed; an optional test left
// out with the skip key and recorded as skipped.

// expectText says what the meter should show for reading i of test t, or ""
// where the plan does not say, the way the plan text says it:
// "expect 285.5 mΩ (265.9 mΩ .. 305.8 mΩ)"; short leaves the window out.
func expectText(t plan.Test, i int, short bool) string {
	if i < 0 || i >= len(t.Readings) || t.Readings[i].Expected == nil {
		return ""
	}
	r := t.Readings[i]
	e := r.Expected
	s := "expect " + plan.FormatValue(e.Value, r.Unit)
	switch {
	case short:
	case e.Low > 0 && e.High > 0:
		s += " (" + plan.FormatValue(e.Low, r.Unit) + " .. " + plan.FormatValue(e.High, r.Unit) + ")"
	case e.High > 0:
		s += " (under " + plan.FormatValue(e.High, r.Unit) + ")"
	}
	return s
}

// expectLines is the expected readings of a test before its fields open:
// one line per reading the plan knows a value for, each shortened to w.
func expectLines(t plan.Test, w int) []string {
	var out []string
	for i, r := range t.Readings {
		if e := expectText(t, i, false); e != "" {
			if len(r.Label)+2+ansi.StringWidth(e) > w {
				e = expectText(t, i, true)
			}
			out = append(out, r.Label+"  "+e)
		}
	}
	return out
}

// fieldCols are the columns of the reading fields: the labels, then the
// input boxes, lined up down the fields that have an expected value (the
// others take the width of their own label), or down every field when none
// has.
func (g guideModel) fieldCols() (labelW, inputW int) {
	labelW = 5
	anyExpected := false
	for _, f := range g.labels {
		anyExpected = anyExpected || f.expected != nil
	}
	for _, f := range g.labels {
		if f.expected != nil || !anyExpected {
			labelW = max(labelW, ansi.StringWidth(f.label))
		}
	}
	for i := range g.fields {
		inputW = max(inputW, fieldWidth(g.fields[i]))
	}
	return min(labelW, 20), inputW
}

// fieldLine is a reading field as "> U–V   [0.286     ]  expect ..." with
// what the meter should show beside it ('>' marks the field being typed),
// shortened to fit w, or with the expected value on a line of its own
// when even the short form does not fit.
func (g guideModel) fieldLine(t plan.Test, i, w int) []string {
	st := g.c.st
	lw, iw := g.fieldCols()
	mark := "  "
	if g.mode == modeReadings && i == g.focus {
		mark = "> "
	}
	label := g.labels[i].label
	in := ansi.Truncate(g.fields[i].View(), iw, "")
	in += strings.Repeat(" ", max(0, iw-ansi.StringWidth(in)))
	line := mark + st.strong.Render(label) + strings.Repeat(" ", max(1, lw+1-ansi.StringWidth(label))) + "[" + in + "]"
	lineW := 2 + max(lw+1, ansi.StringWidth(label)+1) + iw + 2
	long, short := expectText(t, i, false), expectText(t, i, true)
	switch {
	case long == "":
		return []string{line}
	case lineW+2+ansi.StringWidth(long) <= w:
		return []string{line + "  " + st.dim.Render(long)}
	case lineW+2+ansi.StringWidth(short) <= w:
		return []string{line + "  " + st.dim.Render(short)}
	}
	return []string{line, "    " + st.dim.Render(ansi.Truncate(long, max(0, w-4), ""))}
}

// verdictValue is reading i as recorded, "not taken" for an optional field
// left empty.
func (g guideModel) verdictValue(t plan.Test, i int) string {
	if i < len(g.labels) && g.labels[i].optional && i < len(g.fields) && strings.TrimSpace(g.fields[i].Value()) == "" {
		return "not taken"
	}
	return valueText(t, i, g.values[i])
}

// skip records an optional test as left out.
func (g guideModel) skip(s plan.Step) (guideModel, tea.Cmd) {
	g.c.record(Entry{Kind: EntryDone, Step: s.Index, Skipped: true})
	g.flash = fmt.Sprintf("step %d skipped: recorded as skipped", s.Index)
	return g, nil
}

// resistanceStep is the index (0-based) of the plan's resistance test, or -1.
func (c *shared) resistanceStep() int {
	for i, s := range c.steps() {
		if s.Kind == plan.StepTest && s.Test == plan.TestResistance {
			return i
		}
	}
	return -1
}

// balanceFromResistance judges the balance from the readings recorded on the
// resistance step, so they are never typed twice; it asks for them first
// when they are not recorded yet.
func (g guideModel) balanceFromResistance(s plan.Step) (guideModel, tea.Cmd) {
	ri := g.c.resistanceStep()
	var r map[string]float64
	if ri >= 0 && g.c.prog.Steps[ri].Reading != nil {
		r = g.c.prog.Steps[ri].Reading.Values
	}
	g, cmd := g.startReadings(s)
	vals, ok := valuesOf(g.labels, r)
	for i := range vals {
		if !ok[i] {
			g.mode = modeWork
			g.flash = fmt.Sprintf("the balance is judged from the resistance readings: record them on step %d first", ri+1)
			return g, nil
		}
		g.fields[i].SetValue(strconv.FormatFloat(vals[i], 'g', -1, 64))
	}
	_ = cmd
	return g.showVerdict(s, vals), nil
}

// fieldWidth is the width of a reading field's box: room for the reading
// or its placeholder, and the cursor.
func fieldWidth(f textinput.Model) int {
	return max(10, ansi.StringWidth(f.Placeholder)+1)
}

// valueText is reading i of test t as the meter shows it, in the plan's one
// value format.
func valueText(t plan.Test, i int, v float64) string {
	if i < len(t.Readings) {
		return plan.FormatValue(v, t.Readings[i].Unit)
	}
	return fmtNum(v) + " " + string(t.Unit)
}
