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
// and a more line saying how many lines are cut. Each press of the more key
// (page 1, 2, ...) shows the next of the cut lines below the live parts, in
// the rows the useful parts took too, and after the last page the panel
// comes back as it was: every press shows something new.
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
		case pt.prio == partUseful && len(pt.lines) <= room:
			keep[i] = true
			room -= len(pt.lines)
		}
	}
	var out, live, rest []string
	for i, pt := range pp.parts {
		if keep[i] {
			out = append(out, pt.lines...)
		} else if pt.prio == partUseful {
			rest = append(rest, pt.lines...)
		}
		if pt.prio == partLive {
			live = append(live, pt.lines...)
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
	first := rest[:max(0, room)]
	cut := rest[len(first):]
	pageRoom := h - len(live) - 1
	pages := 0
	if pageRoom > 0 {
		pages = (len(cut) + pageRoom - 1) / pageRoom
	}
	if p := page % (pages + 1); p > 0 {
		a, b := (p-1)*pageRoom, min(len(cut), p*pageRoom)
		next := "m shows the next"
		if p == pages {
			next = "m goes back"
		}
		out = append(live, cut[a:b]...)
		return append(out, st.dim.Render(clip(fmt.Sprintf("-- more %d/%d: %s --", p, pages, next), pp.w)))
	}
	out = append(out, first...)
	return append(out, st.dim.Render(clip(fmt.Sprintf("-- %d more lines: m shows them --", len(cut)), pp.w)))
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
