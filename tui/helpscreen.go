package tui

import (
	"strings"

	"github.com/charmbracelet/bubbles/help"
	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/viewport"
	tea "github.com/charmbracelet/bubbletea"
)

// helpModel explains the keys, the marks of the drawing and where progress
// is kept.
type helpModel struct {
	c  *shared
	h  help.Model
	vp viewport.Model
}

func newHelp(c *shared) helpModel {
	return helpModel{c: c, h: newHelpView(), vp: viewport.New(0, 0)}
}

func (m helpModel) open(w, h int) helpModel {
	m.h.Width = w
	m.vp.Width, m.vp.Height = max(0, w), max(0, h)
	m.vp.SetContent(m.content())
	return m
}

func (m helpModel) update(msg tea.KeyMsg) (helpModel, tea.Cmd) {
	k := m.c.keys.scroll
	switch {
	case key.Matches(msg, k.Up):
		m.vp.ScrollUp(1)
	case key.Matches(msg, k.Down):
		m.vp.ScrollDown(1)
	case key.Matches(msg, k.PageUp):
		m.vp.PageUp()
	case key.Matches(msg, k.PageDown):
		m.vp.PageDown()
	}
	return m, nil
}

func (m helpModel) view() string { return m.vp.View() }

// keyBlocks lays the key groups side by side as many as fit in w, then
// starts a new block below, so no group is cut off on a narrow terminal.
func (m helpModel) keyBlocks(w int) []string {
	h := m.h
	h.Width = 0 // measure without cutting
	var out []string
	var row [][]key.Binding
	flush := func() {
		if len(row) > 0 {
			out = append(out, strings.Split(h.FullHelpView(row), "\n")...)
			row = nil
		}
	}
	for _, g := range m.c.keys.fullHelp() {
		if len(row) > 0 && blockWidth(h.FullHelpView(append(row[:len(row):len(row)], g))) > w {
			flush()
			out = append(out, "")
		}
		row = append(row, g)
	}
	flush()
	return out
}

// blockWidth is the width of the widest line of s.
func blockWidth(s string) int {
	w := 0
	for _, l := range strings.Split(s, "\n") {
		w = max(w, lipglossWidth(l))
	}
	return w
}

func (m helpModel) content() string {
	c := m.c
	st := c.st
	w := max(10, m.vp.Width)
	b := &lines{st: st, w: w}
	b.raw(st.title.Render("keys"))
	b.raw(m.keyBlocks(w)...)
	b.raw("")
	b.text("Looking at another step (left/right or [ ], or enter on a line of all steps) changes nothing: the panel shows that step as it was recorded, '*' marks its tooth, and counting, enter and notes wait until esc, home or enter brings back the step in hand. Undo, or any change, ends the look.", st.dim.Render)
	b.text("While a note or a reading is typed, every key goes into the field: q, ? and o only work again after enter or esc.", st.dim.Render)
	b.raw("", st.title.Render("the drawing"))
	b.text("Each tooth shows its number and its coil: the phase letter with a sign. '+U' means a coil of phase U wound clockwise, '-U' counter-clockwise, always seen from the air gap looking at the tooth face while following the wire from its start lead. '#' marks a coil already wound, '@' the tooth of the step in hand, '*' (underlined) the tooth of a step looked at, '·' a tooth that carries no coil. The ring is seen from the lead end with tooth 1 at the top and the numbers rising counter-clockwise; on a small terminal the teeth are laid out flat in a strip.", st.value.Render)
	b.raw("", st.title.Render("progress"))
	where := c.where
	if where == "" {
		where = "(not kept: no record was given)"
	}
	b.text("Every turn counted and every step done is written to the record at once, so the guide resumes where it stopped even after a crash or a power cut: "+where, st.value.Render)
	b.text("If the disk refuses a write, the guide says so, keeps everything in memory and tries again every few seconds. If another program removes or replaces the record while the guide is open, the guide writes it again from memory and says so; whatever stood there is kept in a side file.", st.value.Render)
	for _, s := range c.said {
		b.text(s, st.notice.Render)
	}
	b.raw("", st.title.Render("safety"))
	b.text("Insulation and high-voltage tests can kill. They belong to a trained person with a suitable tester; follow local codes and licensed practice. Strong magnets pinch and a spinning rotor cuts: keep the rotor out until the winding is tested, and fingers clear.", st.caution.Render)
	return strings.Join(b.l, "\n")
}
