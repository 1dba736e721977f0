package printout

import (
	"fmt"
	"math"
	"strconv"

	"coilwright/winding"
	"coilwright/winding/plan"
)

// Connection sheet geometry, mm.
const (
	conBoxW   = 11
	conBoxH   = 12
	conGapMin = 7.5 // the least room between two coil boxes
	conTagW   = 13
	conLine   = 19 // height of one line of coils
	// conReverseY is the baseline of "reverse" below the middle of a line of
	// coils: under the boxes' bottom edge, clear of it by 0.3 mm or more.
	conReverseY = conBoxH/2 + 0.3 + 0.75*sizeTiny*ptMM + 0.2
)

// jumperLabels are the two lines written on a jumper between coil boxes,
// from the engine's slot-to-slot values (plan.JumperStep): above the wire
// the slot it leaves and the slot it enters at the lead end, "s2→s6"; under
// it the slot pitches and the way round the lead end as the slot numbers
// go, "4 up" (counter-clockwise seen from the lead end) or "4 down" ("0"
// when it goes straight back down the same slot). The way is said by the
// numbers, not as cw/ccw, so it never reads as a coil's sense, which the
// coil boxes beside it give seen from the air gap.
func jumperLabels(j plan.JumperStep) (slots, pitches string) {
	slots = "s" + strconv.Itoa(j.LeavesSlot) + "→s" + strconv.Itoa(j.EntersSlot)
	pitches = strconv.Itoa(j.SlotPitches)
	if j.SlotPitches > 0 {
		if j.Way == plan.WayCW {
			pitches += " down"
		} else {
			pitches += " up"
		}
	}
	return slots, pitches
}

// jumpersLaid are the plan's jumpers as laid, by the tooth each leaves: the
// values on the plan's jumper steps, or, for a plan without steps, laid by
// the engine's own rule (plan.LayJumper) from the layout.
func (b *builder) jumpersLaid() map[int]plan.JumperStep {
	out := map[int]plan.JumperStep{}
	for _, st := range b.p.Steps {
		if st.Jumper != nil && st.Jumper.LeavesSlot > 0 {
			out[st.Jumper.FromTooth] = *st.Jumper
		}
	}
	l := b.p.Layout
	for _, ch := range l.Chains {
		for _, jp := range ch.Jumpers {
			if _, ok := out[jp.FromTooth]; ok {
				continue
			}
			from, _ := l.CoilOn(jp.FromTooth)
			to, _ := l.CoilOn(jp.ToTooth)
			out[jp.FromTooth] = plan.LayJumper(b.p.Rotor, jp, from.Direction, to.Direction, l.Spec.Slots, b.p.JumperRadiusMM, 0)
		}
	}
	return out
}

// conGapFor is the room between two coil boxes: enough for the widest
// jumper label of the plan, and never less than conGapMin.
func conGapFor(js map[int]plan.JumperStep) float64 {
	g := float64(conGapMin)
	for _, j := range js {
		a, c := jumperLabels(j)
		g = math.Max(g, math.Max(textWidth(Regular, sizeTiny, a), textWidth(Regular, sizeTiny, c))+2)
	}
	return g
}

// connections draws every phase and path as a chain of coils from its start
// terminal to its finish terminal, the jumpers between them, and the star
// point or delta joints: after the chains where they fit on the chains' last
// sheet, else above the chains on the first, so they never take a sheet of
// their own.
func (b *builder) connections() {
	first := len(b.pages)
	if !b.connectionSheets(false) {
		b.pages = b.pages[:first]
		b.connectionSheets(true)
	}
}

// connectionSheets lays the connection sheets out, the joints first or
// last; it reports whether the joints found room without a sheet of their
// own.
func (b *builder) connectionSheets(jointsFirst bool) bool {
	l := b.p.Layout
	title := "Connections"
	c := b.newPage(ConnectionPage, title)
	y := b.top() + 3
	y = c.para(marginMM, y, b.width(), sizeSmall, Regular, Ink,
		"Each path is one continuous wire, wound coil by coil from its start terminal to its finish terminal; "+
			"the sense in a coil box (cw, ccw) is seen from the air gap facing the tooth. "+
			"A jumper is counted slot to slot: above its wire the slot it leaves at the lead end and the slot it enters "+
			"(“s2→s6”: up out of slot 2, down into slot 6), under the wire the slot pitches it runs round the lead end and which way the slot numbers go "+
			"(“4 up”: four slot pitches up the slot numbers, counter-clockwise seen from the lead end; “down” the other way), as the checklist's jumper rows say in words. "+
			"“reverse” under a jumper marks the next coil wound the other way round.")
	y += 2
	if jointsFirst {
		b.joints(c, y)
		y += b.jointsHeight() + 4
	}
	js := b.jumpersLaid()
	gap := conGapFor(js)
	perLine := int((b.width() - 2*conTagW - 6 + gap) / (conBoxW + gap))
	perLine = max(1, perLine)
	for _, ch := range l.Chains {
		lines := (len(ch.Teeth) + perLine - 1) / perLine
		need := 7 + float64(min(lines, 2))*conLine
		if y+need > b.bottom() {
			c = b.newPage(ConnectionPage, title+" (continued)")
			y = b.top() + 3
		}
		// a chain that wraps shares its coils evenly between its lines
		per := (len(ch.Teeth) + lines - 1) / max(1, lines)
		y = b.chainRows(c, y, ch, max(1, per), title, js, gap)
		if c != nil && len(b.pages) > 0 {
			c = &canvas{page: b.pages[len(b.pages)-1]}
		}
		y += 2
	}
	if jointsFirst {
		return true
	}
	need := b.jointsHeight()
	if y+need > b.bottom() {
		return false
	}
	b.joints(c, y)
	return true
}

// pathWireM is the planned wire length of a path, 0 when the plan has none.
func (b *builder) pathWireM(phase string, path int) float64 {
	for _, pp := range b.p.Paths {
		if pp.Phase == phase && pp.Path == path {
			return pp.WireLengthM
		}
	}
	return 0
}

// chainRows draws one chain, starting new pages as needed, and returns the
// y below it (on the last page it used).
func (b *builder) chainRows(c *canvas, y float64, ch winding.Chain, perLine int, title string, js map[int]plan.JumperStep, conGap float64) float64 {
	l := b.p.Layout
	st := b.phaseStyle(ch.Phase)
	name := l.PhaseName(ch.Phase)
	head := fmt.Sprintf("Phase %s, path %d of %d: %d coils, %s to %s", name, ch.Path, l.Spec.Paths, len(ch.Teeth), ch.Start, ch.Finish)
	if m := b.pathWireM(name, ch.Path); m > 0 {
		head += fmt.Sprintf(", %.2f m of wire between the terminals", m)
	}
	b.phaseMark(c, Point{marginMM + 2.2, y + 1.6}, 2.2, ch.Phase)
	c.text(marginMM+6, y+2.8, sizeBody, Bold, Ink, left, head)
	y += 6
	pen := Pen{Width: 0.55, Colour: st.Colour, Dash: st.Dash, Round: true}
	wirePen := Pen{Width: 0.45, Colour: st.Colour, Dash: st.Dash, Round: true}
	x0 := float64(marginMM)
	for i := 0; i < len(ch.Teeth); i += perLine {
		if y+conLine > b.bottom() {
			c = b.newPage(ConnectionPage, title+" (continued)")
			y = b.top() + 3
		}
		mid := y + conBoxH/2 + 1
		x := x0
		if i == 0 {
			b.terminalTag(c, x, mid, conTagW-3, ch.Start)
		} else {
			c.text(x+conTagW-3.5, mid-0.6, sizeTiny, Regular, Faint, right, "from")
			c.text(x+conTagW-3.5, mid+2.2, sizeTiny, Regular, Faint, right, "above")
		}
		x += conTagW
		end := min(len(ch.Teeth), i+perLine)
		c.line(x-3, mid, x, mid, wirePen)
		if i > 0 {
			c.line(x0+conTagW-3.5, mid, x, mid, wirePen)
		}
		for k := i; k < end; k++ {
			tooth := ch.Teeth[k]
			cl, _ := l.CoilOn(tooth)
			c.box(x, mid-conBoxH/2, conBoxW, conBoxH, pen, &Fill{st.Tint})
			c.label(x+conBoxW/2, mid-3, sizeBody, Bold, Ink, fmt.Sprintf("T%d", tooth))
			// sense arrow and its word centred as a group, a clear gap
			// between the arrow head and the word
			word := cl.Direction.String()
			gw := 2*1.5 + 1.6 + textWidth(Regular, sizeTiny, word)
			ax := x + (conBoxW-gw)/2 + 1.5
			c.senseArrow(ax, mid+2.5, 1.5, cl.Direction == winding.CW, Ink, 0.3)
			c.text(ax+1.5+1.6, mid+3.6, sizeTiny, Regular, Ink, left, word)
			x += conBoxW
			if k < len(ch.Jumpers) && (k+1 < end || end < len(ch.Teeth)) {
				j := ch.Jumpers[k]
				c.line(x, mid, x+conGap, mid, wirePen)
				slots, pitches := jumperLabels(js[j.FromTooth])
				c.text(x+conGap/2, mid-0.9, sizeTiny, Regular, Ink, centre, slots)
				c.text(x+conGap/2, mid+0.9+0.75*sizeTiny*ptMM, sizeTiny, Regular, Ink, centre, pitches)
				if j.ReversesSense {
					// under the boxes' bottom edge, where the word is wider
					// than the gap
					c.text(x+conGap/2, mid+conReverseY, sizeTiny, Bold, Ink, centre, "reverse")
				}
				x += conGap
			}
		}
		if end == len(ch.Teeth) {
			c.line(x, mid, x+3, mid, wirePen)
			b.terminalTag(c, x+3, mid, conTagW-3, ch.Finish)
		} else {
			c.line(x, mid, x+3.5, mid, wirePen)
			c.arrowHead(Point{x + 3.5, mid + 3.2}, -90, 2, st.Colour)
			c.line(x+3.5, mid, x+3.5, mid+1.5, wirePen)
		}
		y += conLine
	}
	return y
}

// terminalTag draws a terminal mark in a heavy box, its left edge at x.
func (b *builder) terminalTag(c *canvas, x, mid, w float64, mark string) {
	c.box(x, mid-3, w, 6, Pen{Width: 0.5, Colour: Ink}, &Fill{White})
	c.label(x+w/2, mid, sizeBody+0.5, Bold, Ink, mark)
}

func (b *builder) jointsHeight() float64 { return 58 }

// joints draws the star point or the delta corners (winding.Joints) and the
// joining of parallel paths.
func (b *builder) joints(c *canvas, y float64) {
	l := b.p.Layout
	x0 := float64(marginMM)
	w := b.width()
	js := winding.Joints(b.p.Connection, l.PhaseNames)
	h := b.jointsHeight()
	c.box(x0, y, w, h, Pen{Width: 0.25, Colour: Faint}, &Fill{Panel})
	title := "Star point"
	if b.p.Connection == winding.Delta {
		title = "Delta joints"
	}
	c.text(x0+2, y+5, sizeHead, Bold, Ink, left, title)
	// drawing on the left
	cx, cy := x0+36, y+h/2+4
	m := len(l.PhaseNames)
	if b.p.Connection == winding.Star {
		o := Point{cx, cy}
		// each finish mark beside its own line near the star point, turned
		// towards the next line by enough to keep its word box clear of
		// both lines (3.8 mm off its own at the label's radius), as large as
		// the terminal tags
		lift := math.Min(30, 0.42*360/float64(m))
		rl := math.Max(6.2, 3.8/math.Sin(lift*math.Pi/180))
		for i, n := range l.PhaseNames {
			a := 90 + float64(i)*360/float64(m)
			st := b.phaseStyle(i)
			pen := Pen{Width: 0.6, Colour: st.Colour, Dash: st.Dash, Round: true}
			p0, p1 := polar(o, 12, a), polar(o, 20, a)
			c.line(cx, cy, p0.X, p0.Y, pen)
			// the phase winding as a narrow box between its finish and start
			d0, d1 := polar(p0, 1.6, a+90), polar(p0, 1.6, a-90)
			e0, e1 := polar(p1, 1.6, a+90), polar(p1, 1.6, a-90)
			c.poly([]Point{d0, e0, e1, d1}, true, pen, &Fill{st.Tint})
			t := polar(o, 26.5, a)
			c.line(p1.X, p1.Y, t.X, t.Y, pen)
			b.terminalTag(c, t.X-5, t.Y, 10, n+"1")
			lb := polar(o, rl, a-lift)
			c.label(lb.X, lb.Y, sizeBody+0.5, Bold, Ink, n+"2")
		}
		c.circle(cx, cy, 1.6, Pen{}, &Fill{Black})
	} else {
		pts := make([]Point, m)
		for i := range pts {
			pts[i] = polar(Point{cx, cy}, 15, 90+float64(i)*360/float64(m))
		}
		for i := range l.PhaseNames {
			st := b.phaseStyle(i)
			a, z := pts[i], pts[(i+1)%m]
			c.line(a.X, a.Y, z.X, z.Y, Pen{Width: 0.6, Colour: st.Colour, Dash: st.Dash, Round: true})
			mp := Point{(a.X + z.X) / 2, (a.Y + z.Y) / 2}
			b.phaseMark(c, mp, 2, i)
		}
		for i, j := range js {
			// joint i joins the finish of phase i and the start of phase i+1: corner i+1
			p := pts[(i+1)%m]
			c.circle(p.X, p.Y, 1.4, Pen{}, &Fill{Black})
			q := polar(Point{cx, cy}, 21, 90+float64((i+1)%m)*360/float64(m))
			c.label(q.X, q.Y, sizeSmall, Bold, Ink, fmt.Sprintf("%s+%s", j.Marks[0], j.Marks[1]))
		}
	}
	// words on the right
	tx := x0 + 72
	ty := y + 12
	for _, j := range js {
		ty = c.para(tx, ty, w-74, sizeBody, Regular, Ink, "• "+j.What)
	}
	if l.Spec.Paths > 1 {
		ty += 1
		ty = c.para(tx, ty, w-74, sizeBody, Regular, Ink, fmt.Sprintf(
			"• parallel paths: each phase has %d paths; join the starts of all its paths at its terminal 1 and all the finishes at its terminal 2 before making the joints above.", l.Spec.Paths))
	}
	ty += 1
	c.para(tx, ty, w-74, sizeBody, Regular, Ink, "• sleeve every joint, mark every lead with its terminal mark (IEC 60034-8) and check continuity of each phase before the joints are closed.")
}
