package tui

import (
	"math"
	"strconv"
	"strings"
	"unicode/utf8"

	"coilwright/winding"
)

// The stator drawing. Each wound tooth is a token of three parts: a state
// mark ('#' wound, '@' the current step, '*' the step looked at, ' ' to do),
// the tooth number and, glued to it, the coil's signed token (e.g. "@7-U"):
// the upper-case phase letter with '+' for a coil wound clockwise and '-' for
// counter-clockwise, seen from the air gap (winding.SenseToken). An unwound
// tooth shows its number and '·'. The ring is drawn seen from the lead end,
// tooth 1 at the top, numbers rising counter-clockwise; when it does not fit,
// a developed strip shows a window of teeth round the current one.

const (
	markWound   = "#"
	markCurrent = "@"
	markViewed  = "*"
	markFrom    = "f" // the coil the wire in hand comes from
	markNext    = "n" // the coil the wire goes to next
	markTodo    = " "
	markUnwound = "·" // a middle dot: a '0' glued to the tooth number would read as a digit
)

// toothInfo is what the drawing needs of one tooth.
type toothInfo struct {
	wound bool // carries a coil
	phase int
	token string // signed phase token: "+U" clockwise, "-U" counter-clockwise
}

// teethOf lists the teeth of a layout, index 0 = tooth 1.
func teethOf(l *winding.Layout) []toothInfo {
	if l == nil {
		return nil
	}
	q := l.Spec.Slots
	out := make([]toothInfo, q)
	for t := 1; t <= q; t++ {
		c, ok := l.CoilOn(t)
		if !ok || c.Phase < 0 || c.Phase >= len(l.PhaseNames) {
			continue
		}
		out[t-1] = toothInfo{wound: true, phase: c.Phase, token: winding.SenseToken(l.PhaseNames[c.Phase], c.Direction)}
	}
	return out
}

// tokenText is the plain text of a tooth token (without the state mark).
func tokenText(t int, ti toothInfo) string {
	if !ti.wound {
		return strconv.Itoa(t) + markUnwound + " "
	}
	return strconv.Itoa(t) + ti.token
}

// ringGeometry is where each token goes in a ring that fits a box.
type ringGeometry struct {
	w, h   int   // box
	x, y   []int // left column and row of each token (index 0 = tooth 1)
	tw     int   // token width (state mark included)
	cx, cy int
	rx, ry float64
}

// innerWidth is the width free for a caption on row y inside the ring.
func (g ringGeometry) innerWidth(y int) int {
	if g.ry <= 0 {
		return 0
	}
	f := float64(y-g.cy) / g.ry
	if f <= -1 || f >= 1 {
		return 0
	}
	hw := g.rx * math.Sqrt(1-f*f)
	return max(0, int(2*(hw-float64(g.tw)/2-1)))
}

// ringKey caches ring geometry per stator and box.
type ringKey struct{ q, w, h int }

// fitRing finds the smallest ring of q teeth whose tokens do not touch, inside
// a box of w x h cells; ok is false when none fits.
func fitRing(q, w, h int) (ringGeometry, bool) {
	if q < 3 || w < 10 || h < 5 {
		return ringGeometry{}, false
	}
	tw := 1 + len(strconv.Itoa(q)) + 2
	minRx := math.Max(6, float64(q*(tw+1))/(2*math.Pi))
	for rx := minRx; ; rx += 0.5 {
		g, ok := ringAt(q, w, h, tw, rx)
		if !ok {
			return ringGeometry{}, false
		}
		if !g.overlaps() {
			// Grow with the box, up to twice the smallest ring, so the
			// drawing gets easier to read on a larger terminal.
			for next := rx + 0.5; next <= 2*minRx; next += 0.5 {
				bigger, ok := ringAt(q, w, h, tw, next)
				if !ok || bigger.overlaps() {
					break
				}
				g = bigger
			}
			return g, true
		}
	}
}

// ringAt lays out a ring of radius rx in a box of w x h, or ok false when it
// does not fit.
func ringAt(q, w, h, tw int, rx float64) (ringGeometry, bool) {
	ry := math.Max(rx*0.46, float64(q)/(2*math.Pi)*1.1)
	gw := int(math.Ceil(2*rx)) + tw + 3
	gh := int(math.Ceil(2*ry)) + 1
	if gw > w || gh > h {
		return ringGeometry{}, false
	}
	g := ringGeometry{w: gw, h: gh, tw: tw, x: make([]int, q), y: make([]int, q)}
	g.cx, g.cy, g.rx, g.ry = gw/2, gh/2, rx, ry
	for i := 0; i < q; i++ {
		th := math.Pi/2 + 2*math.Pi*float64(i)/float64(q) // counter-clockwise from the top
		g.x[i] = min(max(1, int(math.Round(float64(g.cx)+rx*math.Cos(th)))-tw/2), gw-tw-1)
		g.y[i] = min(max(0, int(math.Round(float64(g.cy)-ry*math.Sin(th)))), gh-1)
	}
	return g, true
}

// overlaps reports whether two tokens on one row are closer than one space.
func (g ringGeometry) overlaps() bool {
	for i := range g.x {
		for j := i + 1; j < len(g.x); j++ {
			if g.y[i] != g.y[j] {
				continue
			}
			if g.x[i] < g.x[j]+g.tw+1 && g.x[j] < g.x[i]+g.tw+1 {
				return true
			}
		}
	}
	return false
}

// drawing is a rendered stator: lines of equal display width.
type drawing struct {
	lines []string
	width int
}

// marks says which teeth the drawing marks: those wound, the one in hand,
// the one looked at, and the coils the wire comes from and goes to next (0
// for none).
type marks struct {
	wound                       []bool
	current, viewed, from, next int
}

// isWound reports whether tooth t (1-based) is wound.
func (m marks) isWound(t int) bool { return t >= 1 && t <= len(m.wound) && m.wound[t-1] }

// stateMark is the first character of tooth t's token. The tooth looked at
// wins over the current one: it is what the panel shows.
func (m marks) stateMark(t int) string {
	switch {
	case t == m.viewed:
		return markViewed
	case t == m.current:
		return markCurrent
	case t == m.from:
		return markFrom
	case t == m.next:
		return markNext
	case m.isWound(t):
		return markWound
	}
	return markTodo
}

// styledToken renders tooth t's token padded to width tw.
func styledToken(st *styles, t int, ti toothInfo, mk marks, tw int) string {
	text := tokenText(t, ti)
	mark := mk.stateMark(t)
	pad := strings.Repeat(" ", max(0, tw-1-utf8.RuneCountInString(text)))
	switch {
	case t == mk.viewed:
		return st.viewed.Render(mark+text) + pad
	case t == mk.current:
		return st.current.Render(mark+text) + pad
	case !ti.wound:
		return st.dim.Render(mark+text) + pad
	case t == mk.from || t == mk.next:
		return st.strong.Render(mark+text) + pad
	case mk.isWound(t):
		return st.done.Render(mark+text) + pad
	}
	return mark + st.phaseStyle(ti.phase).Render(text) + pad
}

// renderRing draws the ring with a caption in the middle.
func renderRing(st *styles, g ringGeometry, teeth []toothInfo, mk marks, caption []string) drawing {
	type seg struct {
		x, y int
		w    int
		text string
	}
	rows := make([][]seg, g.h)
	for i, ti := range teeth {
		if i >= len(g.x) {
			break
		}
		rows[g.y[i]] = append(rows[g.y[i]], seg{x: g.x[i], y: g.y[i], w: g.tw, text: styledToken(st, i+1, ti, mk, g.tw)})
	}
	// Caption lines centred in the ring, all of them or, when they do not
	// all fit, those before the first blank line, or none: a caption cut in
	// the middle could say half of what the signs mean.
	place := func(caption []string) ([]seg, bool) {
		var out []seg
		top := g.cy - len(caption)/2
		for k, c := range caption {
			y := top + k
			cw := len(c)
			if cw == 0 {
				continue
			}
			if y < 1 || y >= g.h-1 || cw > g.innerWidth(y) {
				return nil, false
			}
			x := g.cx - cw/2
			for _, t := range rows[y] {
				if x < t.x+t.w+1 && t.x < x+cw+1 {
					return nil, false
				}
			}
			out = append(out, seg{x: x, y: y, w: cw, text: st.dim.Render(c)})
		}
		return out, true
	}
	segs, ok := place(caption)
	if !ok {
		for i, c := range caption {
			if c == "" {
				segs, _ = place(caption[:i])
				break
			}
		}
	}
	for _, sg := range segs {
		rows[sg.y] = append(rows[sg.y], sg)
	}
	d := drawing{width: g.w, lines: make([]string, g.h)}
	var b strings.Builder
	for y, segs := range rows {
		b.Reset()
		sortSegs(segs, func(a, c seg) bool { return a.x < c.x })
		col := 0
		for _, s := range segs {
			if s.x < col {
				continue
			}
			b.WriteString(strings.Repeat(" ", s.x-col))
			b.WriteString(s.text)
			col = s.x + s.w
		}
		b.WriteString(strings.Repeat(" ", max(0, g.w-col)))
		d.lines[y] = b.String()
	}
	return d
}

// sortSegs is an insertion sort: rows hold a handful of segments.
func sortSegs[T any](xs []T, less func(a, b T) bool) {
	for i := 1; i < len(xs); i++ {
		for j := i; j > 0 && less(xs[j], xs[j-1]); j-- {
			xs[j], xs[j-1] = xs[j-1], xs[j]
		}
	}
}

// stripLabels are the row names of the developed strip.
var stripLabels = [3]string{"tooth ", "coil  ", "done  "}

// renderStrip draws a developed strip of the teeth round the current one (or
// round the tooth looked at, when there is one) in width w: tooth numbers,
// signed coil tokens and state marks in columns.
func renderStrip(st *styles, teeth []toothInfo, mk marks, w int) drawing {
	current, viewed := mk.current, mk.viewed
	q := len(teeth)
	if q == 0 {
		return drawing{}
	}
	cw := max(len(strconv.Itoa(q)), 2) + 1
	lw := len(stripLabels[0])
	n := min(q, max(1, (w-lw)/cw))
	first, centre := 0, current
	if viewed >= 1 {
		centre = viewed
	}
	if centre >= 1 {
		first = centre - 1 - n/2
	}
	first = min(max(0, first), q-n)
	var rows [3]strings.Builder
	for r := range rows {
		rows[r].WriteString(st.dim.Render(stripLabels[r]))
	}
	for i := first; i < first+n; i++ {
		ti := teeth[i]
		isCur := i+1 == current
		isViewed := i+1 == viewed
		isWound := mk.isWound(i + 1)
		cells := [3]string{strconv.Itoa(i + 1), markUnwound, " "}
		if ti.wound {
			cells[1] = ti.token
			cells[2] = "."
		}
		if m := mk.stateMark(i + 1); m != markTodo {
			cells[2] = m
		}
		for r, c := range cells {
			cell := strings.Repeat(" ", max(0, cw-utf8.RuneCountInString(c))) + c
			switch {
			case isViewed:
				rows[r].WriteString(st.viewed.Render(cell))
			case isCur:
				rows[r].WriteString(st.current.Render(cell))
			case i+1 == mk.from || i+1 == mk.next:
				rows[r].WriteString(st.strong.Render(cell))
			case r == 1 && ti.wound && !isWound:
				rows[r].WriteString(st.phaseStyle(ti.phase).Render(cell))
			case isWound || !ti.wound:
				rows[r].WriteString(st.dim.Render(cell))
			default:
				rows[r].WriteString(cell)
			}
		}
	}
	width := lw + n*cw
	d := drawing{width: width}
	for r := range rows {
		d.lines = append(d.lines, rows[r].String())
	}
	if n < q {
		d.lines = append(d.lines, st.dim.Render(stripCaption(first+1, first+n, q, w)))
	}
	return d
}

// stripCaption says which teeth the strip shows.
func stripCaption(a, b, q, w int) string {
	s := "teeth " + strconv.Itoa(a) + "-" + strconv.Itoa(b) + " of " + strconv.Itoa(q) + ", laid out flat"
	if len(s) > w {
		s = "teeth " + strconv.Itoa(a) + "-" + strconv.Itoa(b) + " of " + strconv.Itoa(q)
	}
	if len(s) > w {
		return ""
	}
	return s
}

// legend explains the marks in as few lines of width w as it takes (two at
// most, three beside a narrow ring), the words for the signs shortened
// first; while a step other than the current one is looked at it names the
// '*' mark too. The sense of the
// signs is never shown without its view: "seen from the air gap", or
// "(from air gap)" when short; nil when not even that fits.
func legend(w int, looking bool) []string {
	marks := []string{"# wound", "@ now"}
	if looking {
		marks = append(marks, "* looking")
	}
	marks = append(marks, "f from", "n next")
	senses := []string{
		"+U clockwise  -U counter-clockwise, seen from the air gap",
		"+U cw  -U ccw, seen from the air gap",
		"+U cw -U ccw (from air gap)",
	}
	for _, lines := range []int{1, 2, 3} {
		for _, sense := range senses {
			if out := packLegend(append(append([]string{}, marks...), sense), w); out != nil && len(out) <= lines {
				return out
			}
		}
	}
	return nil
}

// packLegend lays legend items two spaces apart into lines of width w,
// never splitting an item; nil when an item is wider than w.
func packLegend(items []string, w int) []string {
	var out []string
	line := ""
	for _, it := range items {
		switch {
		case len(it) > w:
			return nil
		case line == "":
			line = it
		case len(line)+2+len(it) <= w:
			line += "  " + it
		default:
			out = append(out, line)
			line = it
		}
	}
	return append(out, line)
}
