package tui

import (
	"fmt"
	"strings"
)

// A step panel is built of parts in reading order, each with a priority.
// Live parts (the count, the tooth and its sense and slots, a test's fields,
// errors and verdict, the note being typed, a question) are always shown.
// Useful parts (the wire, the progress bar, a step's instruction) are shown
// while they fit. Prose (cautions, sources, reminders, the long wording) is
// cut first: what does not fit is replaced by a "more" line, and the more key
// pages through it in the rows that are left.

// partPriority orders what a short panel keeps.
type partPriority int

const (
	partLive   partPriority = iota // never cut
	partUseful                     // cut after prose, into the more pages
	partProse                      // cut first
)

// part is a run of panel lines of one priority.
type part struct {
	prio  partPriority
	lines []string
}

// panelParts collects the parts of one panel at one content width.
type panelParts struct {
	st    *styles
	w     int
	parts []part
}

// add builds a part with a lines builder; empty parts are left out.
func (pp *panelParts) add(prio partPriority, build func(b *lines)) {
	b := &lines{st: pp.st, w: pp.w}
	build(b)
	if len(b.l) > 0 {
		pp.parts = append(pp.parts, part{prio: prio, lines: b.l})
	}
}

// count is the number of lines of the parts of priority at most p.
func (pp *panelParts) count(p partPriority) int {
	n := 0
	for _, pt := range pp.parts {
		if pt.prio <= p {
			n += len(pt.lines)
		}
	}
	return n
}

// need is the number of rows the live and useful parts take, with the more
// line when there is prose that may not fit.
func (pp *panelParts) need() int {
	n := pp.count(partUseful)
	if pp.count(partProse) > n {
		n++
	}
	return n
}

// fit lays the parts into h rows. Everything when it fits; else the live
// parts, as many useful parts as fit (in order), as much of the rest as fits
// and a more line. Once the more key is pressed (page > 0) the useful parts
// join the rest, which is shown page by page below the live parts.
func (pp *panelParts) fit(h, page int, st *styles) []string {
	if h <= 0 {
		return nil
	}
	if pp.count(partProse) <= h {
		var out []string
		for _, pt := range pp.parts {
			out = append(out, pt.lines...)
		}
		return out
	}
	room := h - 1 - pp.count(partLive) // one row for the more line
	keep := make([]bool, len(pp.parts))
	for i, pt := range pp.parts {
		switch {
		case pt.prio == partLive:
			keep[i] = true
		case pt.prio == partUseful && len(pt.lines) <= room && page == 0:
			keep[i] = true
			room -= len(pt.lines)
		}
	}
	var out, rest []string
	for i, pt := range pp.parts {
		if keep[i] {
			out = append(out, pt.lines...)
		} else if pt.prio == partUseful {
			rest = append(rest, pt.lines...)
		}
	}
	for _, pt := range pp.parts {
		if pt.prio == partProse {
			rest = append(rest, pt.lines...)
		}
	}
	if len(out) >= h {
		return out[:h] // live parts alone fill the panel (below the stated minimum)
	}
	room = h - len(out)
	if len(rest) <= room {
		return append(out, rest...)
	}
	room-- // the more line
	if room <= 0 {
		return append(out, st.dim.Render(clip(fmt.Sprintf("-- %d more lines: m shows them --", len(rest)), pp.w)))
	}
	pages := (len(rest) + room - 1) / room
	p := page
	if page > 0 {
		p = page - 1 // the useful parts went into the pages
	}
	p %= pages
	a, b := p*room, min(len(rest), (p+1)*room)
	out = append(out, rest[a:b]...)
	return append(out, st.dim.Render(clip(fmt.Sprintf("-- more: m shows the next (%d-%d of %d) --", a+1, b, len(rest)), pp.w)))
}

// morePage is the page of cut lines the panel shows: the more key counts
// pages on the step it was pressed on.
func (g guideModel) morePage() int {
	if g.moreStep != g.shown() {
		return 0
	}
	return g.morePages
}

// joinLines is strings.Join for panel lines.
func joinLines(ls []string) string { return strings.Join(ls, "\n") }
