package tui

import (
	"strconv"
	"strings"

	"coilwright/winding/plan"
)

// The coil in hand, drawn as the winder sees it: facing the tooth from the
// air gap with the lead end up, the slot on each side labelled with its
// number and whether the wire goes down or comes up it, and the sense drawn
// round the tooth in that view: '>' along the lead end, 'v' down one side,
// '<' along the far end and '^' up the other for a clockwise coil, the
// mirror for a counter-clockwise one. These marks are arrows, and they are
// only ever drawn in this view, under the words that name it. Above the two
// sides stand where the wire comes from (over the down slot) and where it
// goes next (over the up slot: "to tooth 7").

// toothPictureWidth is the width of the picture in cells.
const toothPictureWidth = 28

// coilSides says which slot is on the winder's left and right and which way
// the wire runs in each: for a clockwise coil the down slot is on the right.
func coilSides(cs *plan.CoilStep) (left, right int, downOnRight bool) {
	if cs.Direction == "ccw" {
		return cs.DownSlot, cs.UpSlot, false
	}
	return cs.UpSlot, cs.DownSlot, true
}

// shortEnd is "lead U1" or "tooth 7" from a CoilStep's From or To text.
func shortEnd(s string) string {
	for _, p := range []string{"jumper from ", "jumper to "} {
		if strings.HasPrefix(s, p) {
			return strings.TrimPrefix(s, p)
		}
	}
	for _, p := range []string{"start lead ", "finish lead "} {
		if strings.HasPrefix(s, p) {
			s = "lead " + strings.TrimPrefix(s, p)
			break
		}
	}
	if i := strings.Index(s, " ("); i > 0 {
		s = s[:i]
	}
	return s
}

// toothPicture draws the coil of cs in plain ASCII, toothPictureWidth wide;
// tall adds a row to each side. The first line names where the wire comes
// from and goes next, the last the view.
func toothPicture(cs *plan.CoilStep, tall bool) []string {
	left, right, downRight := coilSides(cs)
	top, bottom, lside, rside := ">", "<", "^", "v"
	lword, rword := "UP", "DOWN"
	if !downRight {
		top, bottom, lside, rside = "<", ">", "v", "^"
		lword, rword = "DOWN", "UP"
	}
	// "to", not "next": the words stand over the slot the wire leaves by,
	// which is not the side the next tooth lies on.
	from, next := "from "+shortEnd(cs.From), "to "+shortEnd(cs.To)
	lends, rends := next, from
	if !downRight {
		lends, rends = from, next
	}
	pad := func(l, r string) string {
		gap := toothPictureWidth - len(l) - len(r)
		if gap < 1 {
			return clip(l+" "+r, toothPictureWidth)
		}
		return l + strings.Repeat(" ", gap) + r
	}
	centre := func(s string) string {
		lp := max(0, (toothPictureWidth-len(s))/2)
		return strings.Repeat(" ", lp) + s + strings.Repeat(" ", max(0, toothPictureWidth-lp-len(s)))
	}
	num := strconv.Itoa(cs.Tooth)
	box := 11 // "+---------+"
	mid := func(s string) string {
		in := box - 2
		lp := (in - len(s)) / 2
		return "|" + strings.Repeat(" ", max(0, lp)) + s + strings.Repeat(" ", max(0, in-lp-len(s))) + "|"
	}
	// Columns: side mark at 3, box from 8, side mark at 24.
	row := func(l, centre, r string) string {
		s := "   " + l + "    " + centre
		s += strings.Repeat(" ", max(0, 24-len(s))) + r
		return s + strings.Repeat(" ", max(0, toothPictureWidth-len(s)))
	}
	run := "   " + lside + " " + strings.Repeat(top, 18) + " " + rside
	back := "   " + lside + " " + strings.Repeat(bottom, 18) + " " + rside
	run += strings.Repeat(" ", toothPictureWidth-len(run))
	back += strings.Repeat(" ", toothPictureWidth-len(back))
	out := []string{
		pad(lends, rends),
		pad(lword+" slot "+strconv.Itoa(left), rword+" slot "+strconv.Itoa(right)),
		run,
		row(lside, "+---------+", rside),
		row(lside, mid("tooth"), rside),
		row(lside, mid(num), rside),
	}
	if tall {
		out = append(out, row(lside, mid(""), rside))
	}
	out = append(out,
		row(lside, "+---------+", rside),
		back,
		centre("air-gap view, lead end up"),
	)
	return out
}

// clip cuts a plain string to w cells.
func clip(s string, w int) string {
	if len(s) <= w {
		return s
	}
	return s[:max(0, w)]
}
