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
// where the plan does not say: "expect 278.4 mΩ (259.2 – 298.3 mΩ)".
func expectText(t plan.Test, i int) string {
	if i < 0 || i >= len(t.Readings) || t.Readings[i].Expected == nil {
		return ""
	}
	r := t.Readings[i]
	e := r.Expected
	s := "expect " + plan.FormatValue(e.Value, r.Unit)
	switch {
	case e.Low > 0 && e.High > 0:
		s += " (" + plan.FormatValue(e.Low, r.Unit) + " – " + plan.FormatValue(e.High, r.Unit) + ")"
	case e.High > 0:
		s += " (under " + plan.FormatValue(e.High, r.Unit) + ")"
	}
	return s
}

// expectLines is the expected readings of a test before its fields open:
// one line per reading the plan knows a value for.
func expectLines(t plan.Test) []string {
	var out []string
	for i, r := range t.Readings {
		if e := expectText(t, i); e != "" {
			out = append(out, r.Label+"  "+e)
		}
	}
	return out
}

// fieldLine is a reading field with what the meter should show beside it.
func (g guideModel) fieldLine(t plan.Test, i int) string {
	v := g.fields[i].View()
	e := expectText(t, i)
	if e == "" {
		return v
	}
	col := fieldWidth(g.fields[i]) + 1
	return v + strings.Repeat(" ", max(1, col-ansi.StringWidth(v))) + g.c.st.dim.Render(e)
}

// skip records an optional test as left out.
func (g guideModel) skip(s plan.Step) (guideModel, tea.Cmd) {
	g.c.record(Entry{Kind: EntryDone, Step: s.Index, Skipped: true})
	g.flash = fmt.Sprintf("step %d skipped (recorded as skipped): %s", s.Index, s.Title)
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
	t := g.c.tests[s.Test]
	v := g.c.judge(g.c.plan, t, vals)
	g.verdict, g.values, g.inErr = &v, vals, ""
	g.mode = modeVerdict
	for i := range g.fields {
		g.fields[i].Blur()
	}
	_ = cmd
	return g, nil
}

// fieldWidth is the width a reading field takes: its prompt, then room for
// the reading or its placeholder (the textinput counts the prompt in).
func fieldWidth(f textinput.Model) int {
	return ansi.StringWidth(f.Prompt) + max(14, ansi.StringWidth(f.Placeholder)+2)
}

// valueText is reading i of test t as the meter shows it, in the plan's one
// value format.
func valueText(t plan.Test, i int, v float64) string {
	if i < len(t.Readings) {
		return plan.FormatValue(v, t.Readings[i].Unit)
	}
	return fmtNum(v) + " " + string(t.Unit)
}
