package tui

import (
	"fmt"
	"strconv"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/viewport"
	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding"
	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// overviewModel lists every step with its status, then the connection order.
// One step line is highlighted (sel, 0-based); enter opens it in the guide to
// look at.
type overviewModel struct {
	c   *shared
	vp  viewport.Model
	sel int
}

func newOverview(c *shared) overviewModel {
	return overviewModel{c: c, vp: viewport.New(0, 0)}
}

// from highlights step i (0-based), clamped to the plan.
func (o overviewModel) from(i int) overviewModel {
	o.sel = min(max(0, i), max(0, len(o.c.steps())-1))
	return o
}

// open refreshes the content and scrolls to the highlighted step.
func (o overviewModel) open(w, h int) overviewModel {
	o.vp.Width, o.vp.Height = max(0, w), max(0, h)
	o.vp.SetContent(o.content())
	o.vp.SetYOffset(max(0, o.sel-h/3))
	return o
}

// move highlights the step d lines away and keeps it in sight; past the last
// step it scrolls on, so the connection order below can be read.
func (o overviewModel) move(d int) overviewModel {
	n := len(o.c.steps())
	if d > 0 && o.sel >= n-1 {
		o.vp.ScrollDown(d)
		return o
	}
	o.sel = min(max(0, o.sel+d), max(0, n-1))
	o.vp.SetContent(o.content())
	line := o.sel + 1 // the title comes first
	switch {
	case line < o.vp.YOffset:
		o.vp.SetYOffset(line)
	case line >= o.vp.YOffset+o.vp.Height:
		o.vp.SetYOffset(line - o.vp.Height + 1)
	}
	return o
}

func (o overviewModel) update(msg tea.KeyMsg) (overviewModel, tea.Cmd) {
	k := o.c.keys.scroll
	switch {
	case key.Matches(msg, k.Up):
		o = o.move(-1)
	case key.Matches(msg, k.Down):
		o = o.move(1)
	case key.Matches(msg, k.PageUp):
		o = o.move(-max(1, o.vp.Height-1))
	case key.Matches(msg, k.PageDown):
		o = o.move(max(1, o.vp.Height-1))
	}
	return o, nil
}

func (o overviewModel) view() string { return o.vp.View() }

// statusMark is the status column of the overview: [x] done, [>] now, [ ] to do.
func statusMark(done, now bool) string {
	switch {
	case done:
		return "[x]"
	case now:
		return "[>]"
	}
	return "[ ]"
}

// content is the full overview text.
func (o overviewModel) content() string {
	c := o.c
	st := c.st
	var b strings.Builder
	cur := c.prog.Current()
	steps := c.steps()
	fmt.Fprintf(&b, "%s  %d of %d steps done, %d of %d coils\n", st.title.Render("all steps"), c.prog.DoneCount(), len(steps), c.prog.CoilsDone(), c.coils)
	digits := len(strconv.Itoa(len(steps)))
	for i, s := range steps {
		done := c.prog.Steps[i].Done
		pick := "  "
		if i == o.sel {
			pick = "->"
		}
		line := fmt.Sprintf("%s%s %*d  %s", pick, statusMark(done, i == cur), digits, s.Index, stepLine(c, s, i))
		switch {
		case i == o.sel:
			line = st.picked.Render(line)
		case i == cur:
			line = st.statusNow.Render(line)
		case done:
			line = st.statusDone.Render(line)
		}
		b.WriteString(line)
		b.WriteByte('\n')
	}
	b.WriteByte('\n')
	b.WriteString(st.title.Render("connection order"))
	b.WriteByte('\n')
	for _, l := range connectionOrder(c.plan) {
		// Wrapped under itself: a path's order is never cut at the edge.
		for i, w := range wrapPlain(l, max(20, o.vp.Width-4)) {
			if i > 0 {
				b.WriteString("    ")
			}
			b.WriteString(w)
			b.WriteByte('\n')
		}
	}
	return strings.TrimRight(b.String(), "\n")
}

// stepLine is one step in a line, with what was recorded.
func stepLine(c *shared, s plan.Step, i int) string {
	var t string
	switch {
	case s.Coil != nil:
		cs := s.Coil
		// Columns line up down the list: the order and the tooth padded to
		// the widest, the coil as its signed token, its slots, its turns.
		ow, tw := len(strconv.Itoa(cs.Of)), len(strconv.Itoa(len(c.teeth)))
		slots := plan.SlotWords
		if q := len(c.teeth); 10+10+1+6+tw+1+3+1+len(slots(q, q))+2+9 > c.width {
			// A narrow terminal: the slots without the word, so the
			// turns stay on the line.
			slots = func(d, u int) string { return fmt.Sprintf("down %d, up %d", d, u) }
		}
		sw := len(slots(len(c.teeth), len(c.teeth)))
		t = fmt.Sprintf("%-10s tooth %*d %-3s %-*s  %d turns", fmt.Sprintf("coil %*d/%d", ow, cs.Order, cs.Of), tw, cs.Tooth,
			progress.Sense(cs)+cs.Phase, sw, slots(cs.DownSlot, cs.UpSlot), cs.Turns)
		if c.prog.Steps[i].Done && c.prog.Steps[i].Turns != cs.Turns {
			t += fmt.Sprintf(" (wound %d)", c.prog.Steps[i].Turns)
		} else if !c.prog.Steps[i].Done && c.prog.Steps[i].Turns > 0 {
			t += fmt.Sprintf(" (%d so far)", c.prog.Steps[i].Turns)
		}
	default:
		title := s.Title
		if k := string(s.Kind) + ": "; len(title) > len(k) && strings.EqualFold(title[:len(k)], k) {
			title = title[len(k):]
		}
		if k := string(s.Kind) + " (optional): "; len(title) > len(k) && strings.EqualFold(title[:len(k)], k) {
			title = title[len(k):]
			if !c.prog.Steps[i].Skipped { // "-> skipped" says it then
				title += " (optional)"
			}
		}
		t = fmt.Sprintf("%-10s %s", s.Kind, title)
	}
	if r := c.prog.Steps[i].Reading; r != nil {
		t += " -> " + strings.ToUpper(r.Verdict)
	}
	if c.prog.Steps[i].Skipped {
		t += " -> skipped"
	}
	if c.prog.Steps[i].Note != "" {
		t += "  note: " + c.prog.Steps[i].Note
	}
	return t
}

// connectionOrder says, path by path, the terminals and teeth in winding
// order, then the joints of the connection.
func connectionOrder(p *plan.Plan) []string {
	if p == nil || p.Layout == nil {
		return nil
	}
	l := p.Layout
	var out []string
	for _, ch := range l.Chains {
		name := "?"
		if ch.Phase >= 0 && ch.Phase < len(l.PhaseNames) {
			name = l.PhaseNames[ch.Phase]
		}
		parts := []string{ch.Start}
		for _, t := range ch.Teeth {
			// Each coil as the ring shows it: the tooth and its signed
			// token, +U clockwise seen from the air gap.
			tok := "?"
			if co, ok := l.CoilOn(t); ok && co.Phase >= 0 && co.Phase < len(l.PhaseNames) {
				tok = winding.SenseToken(l.PhaseNames[co.Phase], co.Direction)
			}
			parts = append(parts, fmt.Sprintf("%d%s", t, tok))
		}
		parts = append(parts, ch.Finish)
		out = append(out, fmt.Sprintf("phase %s path %d: %s", name, ch.Path, strings.Join(parts, " > ")))
	}
	out = append(out, "(+U wound clockwise, -U counter-clockwise, seen from the air gap)")
	for _, j := range winding.Joints(p.Connection, l.PhaseNames) {
		out = append(out, fmt.Sprintf("join %s: %s", strings.Join(j.Marks, "+"), j.What))
	}
	return out
}
