package printout

import (
	"fmt"
	"math"

	"coilwright/winding"
	"coilwright/winding/plan"
)

// Developed layout geometry, mm from the top of a row.
const (
	devRowH     = 37
	devMinPitch = 11
	devMaxPitch = 22
)

// sideIntoStack reports whether the side of a coil in the slot before its
// tooth (before true) or after it carries the path current into the stack,
// away from the connection end. Derivation (the conventions of package winding): for an
// inner rotor a person in the air gap facing the tooth, lead end up, has the
// lower tooth numbers on the right; going clockwise the wire crosses the lead
// end towards the right and so runs into the stack in the slot before the
// tooth. An outer rotor sees the stator from outside, which swaps the sides.
func sideIntoStack(d winding.Direction, r plan.Rotor, before bool) bool {
	into := before
	if r == plan.OuterRotor {
		into = !into
	}
	if d == winding.CCW {
		into = !into
	}
	return into
}

// separatorSlots lists the slots that hold sides of two phases (double
// layer only), in slot order.
func separatorSlots(l *winding.Layout) []int {
	if l.Spec.Layers != 2 {
		return nil
	}
	q := l.Spec.Slots
	var out []int
	for k := 1; k <= q; k++ {
		a, _ := l.CoilOn(k)
		b, _ := l.CoilOn(k%q + 1)
		if a.Phase != b.Phase {
			out = append(out, k)
		}
	}
	return out
}

// devRows splits q teeth into rows of at most perRow, evenly.
func devRows(q int, width float64) (rows, perRow int, pitch float64) {
	maxPer := int(width / devMinPitch)
	rows = (q + maxPer - 1) / maxPer
	perRow = (q + rows - 1) / rows
	pitch = math.Min(devMaxPitch, width/float64(perRow))
	return rows, perRow, pitch
}

// developed draws the winding unrolled: teeth left to right in rows, each
// coil round its tooth with its two sides in the neighbouring slots, the
// current sense of every side, and the slots that need a phase separator.
func (b *builder) developed() {
	l := b.p.Layout
	q := l.Spec.Slots
	title := "Developed layout"
	c := b.newPage(DevelopedPage, title)
	y := b.top() + 3
	y = c.para(marginMM, y, b.width(), sizeSmall, Regular, Ink,
		"The stator unrolled: teeth left to right in number order, slot k between tooth k and tooth k+1 (slot "+
			fmt.Sprint(q)+" between tooth "+fmt.Sprint(q)+" and tooth 1). Each coil is drawn round its tooth; its sides sit in the slots either side.")
	y += 2
	rows, perRow, pitch := devRows(q, b.width()-6)
	seps := map[int]bool{}
	for _, s := range separatorSlots(l) {
		seps[s] = true
	}
	legendH := 22.0
	for r := 0; r < rows; r++ {
		if y+devRowH > b.bottom() {
			c = b.newPage(DevelopedPage, title+" (continued)")
			y = b.top() + 3
		}
		first := r*perRow + 1
		last := min(q, first+perRow-1)
		b.devRow(c, y, first, last, pitch, seps)
		y += devRowH
	}
	if y+legendH > b.bottom() {
		c = b.newPage(DevelopedPage, title+" (continued)")
		y = b.top() + 3
	}
	b.devLegend(c, y+1, len(seps))
}

func (b *builder) devRow(c *canvas, y0 float64, first, last int, pitch float64, seps map[int]bool) {
	l := b.p.Layout
	q := l.Spec.Slots
	x0 := float64(marginMM)
	tw := pitch * 0.42
	sw := pitch - tw
	sideW := sw * 0.44
	if l.Spec.Layers == 1 {
		sideW = sw * 0.88
	}
	iron := Colour{222, 222, 222}
	outline := Pen{Width: 0.2, Colour: Colour{90, 90, 90}}
	n := last - first + 1
	xc := func(k int) float64 { return x0 + (float64(k-first)+0.5)*pitch }
	// yoke strip
	c.box(x0, y0+27, float64(n)*pitch, 3, outline, &Fill{iron})
	markR := math.Min(2.6, pitch*0.21)
	numSize := math.Min(sizeBody, pitch*0.3/ptMM)
	for k := first; k <= last; k++ {
		x := xc(k)
		c.label(x, y0+2.5, numSize, Bold, Ink, fmt.Sprint(k))
		cl, ok := l.CoilOn(k)
		if !ok {
			continue
		}
		st := b.phaseStyle(cl.Phase)
		hw := tw/2 + sideW
		c.box(x-hw, y0+11.5, 2*hw, 15, Pen{Width: 0.55, Colour: st.Colour, Dash: st.Dash, Round: true}, &Fill{st.Tint})
		b.phaseMark(c, Point{x, y0 + 7.5}, markR, cl.Phase)
	}
	// teeth over the coils
	for k := first; k <= last; k++ {
		x := xc(k)
		c.box(x-tw/2, y0+12.5, tw, 14.5, outline, &Fill{iron})
		if cl, ok := l.CoilOn(k); ok {
			c.senseArrow(x, y0+16.5, math.Min(1.7, tw*0.3), cl.Direction == winding.CW, Ink, 0.3)
			mr := math.Min(1.3, sideW*0.38)
			c.conductorMark(x-tw/2-sideW/2, y0+22, mr, !sideIntoStack(cl.Direction, b.p.Rotor, true), Ink)
			c.conductorMark(x+tw/2+sideW/2, y0+22, mr, !sideIntoStack(cl.Direction, b.p.Rotor, false), Ink)
		}
	}
	// slots: numbers under the yoke, separators marked
	slotSize := math.Min(sizeSmall, pitch*0.26/ptMM)
	for k := first; k <= last; k++ {
		x := xc(k) + pitch/2
		if k == last && last != q && x > x0+float64(n)*pitch-0.1 {
			x = x0 + float64(n)*pitch - pitch*0.25
		}
		label := fmt.Sprintf("s%d", k)
		if seps[k] {
			c.line(x, y0+10.5, x, y0+28, Pen{Width: 0.7, Colour: Black})
			w := textWidth(Bold, slotSize, label) + 1.2
			c.box(x-w/2, y0+31, w, 3.6, Pen{}, &Fill{Black})
			c.label(x, y0+32.8, slotSize, Bold, White, label)
		} else {
			c.label(x, y0+32.8, slotSize, Regular, Ink, label)
		}
	}
	if last < q {
		c.text(x0+float64(n)*pitch, y0+20, sizeTiny, Regular, Faint, left, "→")
	}
}

func (b *builder) devLegend(c *canvas, y float64, nsep int) {
	x0 := float64(marginMM)
	w := b.width()
	c.box(x0, y, w, 21, Pen{Width: 0.25, Colour: Faint}, &Fill{Panel})
	c.text(x0+2, y+4, sizeSmall, Bold, Ink, left, "Legend")
	c.conductorMark(x0+4, y+8, 1.3, false, Ink)
	c.conductorMark(x0+8, y+8, 1.3, true, Ink)
	c.text(x0+11, y+9, sizeSmall, Regular, Ink, left, "coil side seen from the connection end, current from the start terminal: cross = into the stack, dot = out towards the leads")
	c.senseArrow(x0+4, y+12.6, 1.3, true, Ink, 0.3)
	c.senseArrow(x0+8, y+12.6, 1.3, false, Ink, 0.3)
	c.text(x0+11, y+13.6, sizeSmall, Regular, Ink, left, "winding sense on the tooth, seen from the air gap facing the tooth (as on the slot map)")
	c.line(x0+6, y+15.8, x0+6, y+19.6, Pen{Width: 0.7, Colour: Black})
	c.box(x0+2.4, y+16.4, 7, 3.3, Pen{}, &Fill{Black})
	c.label(x0+5.9, y+18, sizeTiny, Bold, White, "s4")
	what := fmt.Sprintf("slot shared by two phases: fit a phase separator between the two coil sides (%d slots)", nsep)
	if b.p.Layout.Spec.Layers == 1 {
		what = "single layer: one coil side per slot, no phase separators"
	}
	c.text(x0+11, y+18.8, sizeSmall, Regular, Ink, left, what)
}
