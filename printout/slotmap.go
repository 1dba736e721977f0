package printout

import (
	"fmt"
	"math"

	"coilwright/winding"
	"coilwright/winding/plan"
)

// toothAngle is the page angle (degrees, counter-clockwise) of tooth k of q:
// tooth 1 at the top, numbers rising counter-clockwise as seen from the
// connection end (the conventions in package winding and the README).
func toothAngle(k, q int) float64 { return 90 + float64(k-1)*360/float64(q) }

// ringGeometry is the set of radii the slot map uses, in mm.
type ringGeometry struct {
	centre              Point
	rMax                float64 // outer limit of the drawing
	rTag                float64 // inner edge of the lead tags
	rNum, rArrow, rMark float64 // tooth number, sense arrow, phase mark
	cell                float64 // size of one label cell
	stagger             bool    // tooth numbers on two radii, odd teeth outer
	rOut, rIn           float64 // iron band
	yoke                float64 // yoke thickness
	// rot turns the whole drawing (degrees, counter-clockwise on the page):
	// a sector sheet turns its sector to the top.
	rot float64
	// first and last bound the teeth drawn, counting counter-clockwise
	// from first (last may be below first: the window wraps past tooth Q);
	// zero first draws every tooth.
	first, last int
	// sparse draws the whole ring without per-tooth marks: phase tints,
	// every step-th tooth number and the leads (the overview of a stator
	// whose labels would collide at the ring's size).
	sparse bool
	step   int
}

// angle is the page angle of tooth k of q in this drawing.
func (g ringGeometry) angle(k, q int) float64 { return toothAngle(k, q) + g.rot }

// shows reports whether tooth k is drawn.
func (g ringGeometry) shows(k, q int) bool {
	if g.first == 0 {
		return true
	}
	return (k-g.first+q)%q <= (g.last-g.first+q)%q
}

// numbered reports whether tooth k carries its number.
func (g ringGeometry) numbered(k, q int) bool {
	if !g.shows(k, q) {
		return false
	}
	return !g.sparse || k == 1 || (k%g.step == 0 && q-k >= g.step/2)
}

// maxIronDepth is the deepest the stator iron is drawn, mm.
const maxIronDepth = 40

// ringFor lays out the radii of a ring of q teeth whose drawing reaches rMax.
func ringFor(q int, centre Point, rMax float64) ringGeometry {
	g := ringGeometry{centre: centre, rMax: rMax}
	g.rTag = rMax - leadReach
	g.rNum = rMax - 19.5
	pitch := 2 * math.Pi * g.rNum / float64(q)
	g.cell = math.Max(2.6, math.Min(7.5, pitch*0.86))
	g.stagger = pitch < 6
	if g.stagger {
		// numbers alternate between two radii so three-digit numbers fit
		g.rNum -= g.cell * 0.5
	}
	g.rArrow = g.rNum - g.cell*1.05
	if g.stagger {
		g.rArrow -= g.cell * 0.5
	}
	g.rMark = g.rArrow - g.cell*1.1
	g.rOut = g.rMark - g.cell*0.5 - 0.8
	g.rIn = g.rOut * 0.56
	if g.rOut-g.rIn > maxIronDepth {
		// a large ring (the sector sheets) keeps the iron shallow: the
		// words are what it is drawn large for
		g.rIn = g.rOut - maxIronDepth
	}
	g.yoke = (g.rOut - g.rIn) * 0.26
	return g
}

// slotMap draws the stator ring seen from the connection end with every
// tooth numbered, its coil's phase mark and winding sense, and the leads,
// then the legend and the title block. Where the labels of every tooth
// would collide on a ring that fits the sheet, the first sheet shows the
// whole ring with every few teeth numbered and the leads, and sector sheets
// follow, each a part of the ring drawn large enough for every label, the
// teeth at either end repeated from the neighbouring sector.
func (b *builder) slotMap() {
	c := b.newPage(SlotMapPage, "Slot map")
	g := b.slotRing()
	centre, rMax := g.centre, g.rMax
	note := "Seen from the connection (lead) end. Teeth numbered counter-clockwise."
	if g.sparse {
		note = fmt.Sprintf("Seen from the connection (lead) end, teeth numbered counter-clockwise: every %s here, every tooth on the sector sheets.", ordinal(g.step))
	}
	c.text(marginMM, b.top()+3, sizeSmall, Regular, Ink, left, fit(note, b.width(), sizeSmall, Regular))
	b.drawIron(c, g)
	b.drawToothLabels(c, g)
	b.drawLeads(c, g)
	b.ringCentre(c, g)

	y := centre.Y + rMax + 2
	y = b.slotMapLegend(c, y)
	if wh := b.warningsHeight(b.width()); wh > 0 {
		y = b.warningsBox(c, y+2)
	}
	b.titleBlock(c, math.Max(y+2, b.bottom()-slotMapTitleH), slotMapTitleH)
	if g.sparse {
		b.sectorSheets()
	}
}

// slotMapTitleH is the height of the slot map's title block, mm.
const slotMapTitleH = 50.0

// slotRing sizes the stator drawing to the room the legend and the title
// block leave on the slot map; when the labels of every tooth would collide
// at that size the ring is drawn sparse.
func (b *builder) slotRing() ringGeometry {
	l := b.p.Layout
	legendH := 14 + 5.0*float64((len(l.PhaseNames)+2)/3)
	avail := b.bottom() - b.top() - slotMapTitleH - legendH - 8
	if wh := b.warningsHeight(b.width()); wh > 0 {
		avail -= wh + 2
	}
	rMax := math.Min(avail, b.width()) / 2
	g := ringFor(l.Spec.Slots, Point{b.paper.W / 2, b.top() + 6 + rMax}, rMax)
	if !b.labelsFit(g) {
		g.sparse = true
		// number every step-th tooth, step a round 2, 5 or 10 times a power
		// of ten wide enough to clear the widest number
		need := (textWidth(Bold, sizeBody, fmt.Sprint(l.Spec.Slots)) + 1.5) / (2 * math.Pi * g.rNum / float64(l.Spec.Slots))
		g.step = roundStep(need)
		g.stagger = false
		// no marks on the iron: it grows out to the numbers
		g.rOut = g.rNum - 5
		g.rIn = g.rOut * 0.6
		g.yoke = (g.rOut - g.rIn) * 0.26
	}
	return g
}

// ordinal writes n as "2nd", "5th", "10th".
func ordinal(n int) string {
	switch {
	case n%100/10 == 1:
		return fmt.Sprintf("%dth", n)
	case n%10 == 1:
		return fmt.Sprintf("%dst", n)
	case n%10 == 2:
		return fmt.Sprintf("%dnd", n)
	case n%10 == 3:
		return fmt.Sprintf("%drd", n)
	}
	return fmt.Sprintf("%dth", n)
}

// roundStep is the smallest of 2, 5, 10, 20, 50... at least n.
func roundStep(n float64) int {
	for m := 1; ; m *= 10 {
		for _, k := range []int{2, 5, 10} {
			if float64(k*m) >= n {
				return k * m
			}
		}
	}
}

// labelsFit reports whether the tooth numbers, phase marks and sense
// arrows of every tooth keep clear of each other on ring g: it lays them out
// on a scratch canvas and compares each shape with those of the next two
// teeth (discs as circles, the rest by their boxes).
func (b *builder) labelsFit(g ringGeometry) bool {
	q := b.p.Layout.Spec.Slots
	g.sparse = false
	var teeth [][]Shape
	for k := 1; k <= q; k++ {
		one := g
		one.first, one.last = k, k
		scratch := &canvas{page: &Page{}}
		b.drawToothLabels(scratch, one)
		teeth = append(teeth, scratch.page.Shapes)
	}
	for k := range teeth {
		for d := 1; d <= 2 && d < q; d++ {
			for _, a := range teeth[k] {
				for _, o := range teeth[(k+d)%q] {
					if isLabel(a) && isLabel(o) && shapesMeet(a, o, 0.1) {
						return false
					}
				}
			}
		}
	}
	return true
}

// circleMeetsBox reports whether circle c comes within gap of the box of s.
func circleMeetsBox(c *Arc, s Shape, gap float64) bool {
	x0, y0, x1, y1 := s.bounds()
	dx := math.Max(0, math.Max(x0-c.Centre.X, c.Centre.X-x1))
	dy := math.Max(0, math.Max(y0-c.Centre.Y, c.Centre.Y-y1))
	return math.Hypot(dx, dy) < c.Radius+gap
}

// isLabel reports whether a shape of the tooth labels is a word or a phase
// mark's disc (the sense arrows, drawn within their own tooth's pitch, are
// left out).
func isLabel(s Shape) bool {
	switch s := s.(type) {
	case *Text:
		return true
	case *Arc:
		return math.Abs(s.Sweep) >= 360
	}
	return false
}

// shapesMeet reports whether two shapes come closer than gap: two full
// circles by their centres and radii, anything else by its box.
func shapesMeet(a, o Shape, gap float64) bool {
	ca, okA := a.(*Arc)
	co, okO := o.(*Arc)
	okA = okA && math.Abs(ca.Sweep) >= 360
	okO = okO && math.Abs(co.Sweep) >= 360
	switch {
	case okA && okO:
		return math.Hypot(ca.Centre.X-co.Centre.X, ca.Centre.Y-co.Centre.Y) < ca.Radius+co.Radius+gap
	case okA:
		return circleMeetsBox(ca, o, gap)
	case okO:
		return circleMeetsBox(co, a, gap)
	}
	ax0, ay0, ax1, ay1 := a.bounds()
	bx0, by0, bx1, by1 := o.bounds()
	return ax0 < bx1+gap && bx0 < ax1+gap && ay0 < by1+gap && by0 < ay1+gap
}

// sectorSheets draws the ring in sectors large enough for every label, as
// many to a sheet as fit one above the other.
func (b *builder) sectorSheets() {
	l := b.p.Layout
	q := l.Spec.Slots
	w := b.width()
	// grow the ring until every label fits
	rMax := w / 2
	var g ringGeometry
	for i := 0; i < 40; i++ {
		g = ringFor(q, Point{}, rMax)
		if b.labelsFit(g) {
			break
		}
		rMax *= 1.12
	}
	reach := rMax + leadTagH + 2 // lead tags stand out beyond rMax
	// the widest half angle whose chord fits the sheet, less the overlap
	half := math.Asin(math.Min(1, (w/2-1)/reach)) * 180 / math.Pi
	pitch := 360 / float64(q)
	const overlap = 2 // teeth repeated from each neighbouring sector
	per := int(2*half/pitch) - 2*overlap
	per = max(1, per)
	n := (q + per - 1) / per
	per = (q + n - 1) / n // even out the sectors
	halfA := (float64(per+2*overlap) / 2) * pitch
	rLow := math.Min(g.rIn, g.rOut) - 2
	sectorH := reach - rLow*math.Cos(halfA*math.Pi/180) + 8
	room := b.bottom() - b.top() - 8
	perSheet := max(1, int(room/sectorH))
	sheets := (n + perSheet - 1) / perSheet
	var c *canvas
	y := 0.0
	for i := 0; i < n; i++ {
		if i%perSheet == 0 {
			c = b.newPage(SlotMapPage, fmt.Sprintf("Slot map, sectors (sheet %d of %d)", i/perSheet+1, sheets))
			y = b.top() + 3
			c.para(marginMM, y, w, sizeSmall, Regular, Ink,
				"Seen from the connection (lead) end, the ring in parts, each turned so its middle is at the top. "+
					"Teeth before a dash-dot cut line repeat those of the neighbouring sector.")
			y += 8
		}
		lo := i*per + 1
		hi := min(q, (i+1)*per)
		mid := (float64(lo+hi) / 2)
		sg := ringFor(q, Point{b.paper.W / 2, y + reach + 2}, rMax)
		sg.rot = -(mid - 1) * pitch
		sg.first = (lo-1-overlap+q)%q + 1
		sg.last = (hi-1+overlap)%q + 1
		if n == 1 {
			sg.first, sg.last = 0, 0
		}
		c.text(marginMM, y+3, sizeBody, Bold, Ink, left, fmt.Sprintf("Teeth %d to %d", lo, hi))
		b.drawIron(c, sg)
		b.drawToothLabels(c, sg)
		b.drawLeads(c, sg)
		b.cutLines(c, sg, lo, hi)
		y += sectorH
	}
}

// cutLines marks where a sector ends: a dash-dot radial line in the slot
// before tooth lo and after tooth hi, the teeth beyond it being repeats.
func (b *builder) cutLines(c *canvas, g ringGeometry, lo, hi int) {
	q := b.p.Layout.Spec.Slots
	if g.first == 0 {
		return
	}
	pitch := 360 / float64(q)
	rLow := math.Min(g.rIn, g.rOut) - 1
	for _, a := range []float64{g.angle(lo, q) - pitch/2, g.angle(hi, q) + pitch/2} {
		p0, p1 := polar(g.centre, rLow, a), polar(g.centre, g.rMax-2, a)
		c.line(p0.X, p0.Y, p1.X, p1.Y, Pen{Width: 0.45, Colour: Ink, Dash: Dash{3, 1, 0, 1}, Round: true})
	}
}

// drawIron draws yoke, coils and teeth.
func (b *builder) drawIron(c *canvas, g ringGeometry) {
	l := b.p.Layout
	q := l.Spec.Slots
	o := g.centre
	iron := Colour{222, 222, 222}
	outline := Pen{Width: 0.2, Colour: Colour{90, 90, 90}}
	var yIn, yOut, tRoot, tTip float64
	if b.p.Rotor == plan.OuterRotor {
		yIn, yOut = g.rIn, g.rIn+g.yoke
		tRoot, tTip = yOut, g.rOut
	} else {
		yIn, yOut = g.rOut-g.yoke, g.rOut
		tRoot, tTip = yIn, g.rIn
	}
	pitch := 360 / float64(q)
	sector := func(r0, r1, a0, a1 float64) []Point {
		return []Point{polar(o, r0, a0), polar(o, r1, a0), polar(o, r1, a1), polar(o, r0, a1)}
	}
	a0, a1 := 0.0, 360.0 // the span drawn, page degrees
	if g.first != 0 {
		a0 = g.angle(g.first, q) - pitch/2
		a1 = a0 + float64((g.last-g.first+q)%q+1)*pitch
		var band []Point
		for k := 0; k <= 48; k++ {
			band = append(band, polar(o, yOut, a0+(a1-a0)*float64(k)/48))
		}
		for k := 48; k >= 0; k-- {
			band = append(band, polar(o, yIn, a0+(a1-a0)*float64(k)/48))
		}
		c.poly(band, true, outline, &Fill{iron})
	} else {
		c.circle(o.X, o.Y, yOut, outline, &Fill{iron})
		c.circle(o.X, o.Y, yIn, outline, &Fill{White})
	}
	// coils under the teeth, so each shows as two sides in its slots
	coilIn, coilOut := math.Min(tRoot, tTip), math.Max(tRoot, tTip)
	span := coilOut - coilIn
	coilIn += span * 0.16
	coilOut -= span * 0.05
	half := 0.45
	if l.Spec.Layers == 1 {
		half = 0.8
	}
	for _, cl := range l.Coils {
		if !g.shows(cl.Tooth, q) {
			continue
		}
		a := g.angle(cl.Tooth, q)
		st := b.phaseStyle(cl.Phase)
		pen := Pen{Width: math.Min(0.6, 0.05*g.cell+0.2), Colour: st.Colour, Dash: scaleDash(st.Dash, g.cell/6), Round: true}
		c.poly(sector(coilIn, coilOut, a-half*pitch, a+half*pitch), true, pen, &Fill{st.Tint})
	}
	// teeth with tip shoes
	for k := 1; k <= q; k++ {
		if !g.shows(k, q) {
			continue
		}
		a := g.angle(k, q)
		shoe := (tTip - tRoot) * 0.12
		body := sector(tRoot, tTip-shoe, a-0.17*pitch, a+0.17*pitch)
		tip := sector(tTip-shoe, tTip, a-0.41*pitch, a+0.41*pitch)
		pts := []Point{body[0], body[1], tip[0], tip[1], tip[2], tip[3], body[2], body[3]}
		c.poly(pts, true, outline, &Fill{iron})
	}
	// rotor outline beyond the air gap
	gap := math.Max(0.8, (g.rOut-g.rIn)*0.04)
	rotorPen := Pen{Width: 0.25, Colour: Faint, Dash: Dash{1.5, 1}}
	rr := g.rIn - gap
	if b.p.Rotor == plan.OuterRotor {
		rr = g.rOut + gap
	}
	c.add(&Arc{Centre: o, Radius: rr, Start: a0, Sweep: a1 - a0, Pen: rotorPen})
}

// scaleDash shrinks a dash pattern for small drawings.
func scaleDash(d Dash, k float64) Dash {
	if d == nil {
		return nil
	}
	k = math.Max(0.35, math.Min(1, k))
	out := make(Dash, len(d))
	for i, v := range d {
		out[i] = v * k
	}
	return out
}

// drawToothLabels draws, for every tooth, its number and, where it is wound,
// the phase mark (letter in a tinted disc outlined in the phase pattern) and
// the winding sense arrow.
func (b *builder) drawToothLabels(c *canvas, g ringGeometry) {
	l := b.p.Layout
	q := l.Spec.Slots
	numSize := math.Max(sizeMin, math.Min(9, g.cell/ptMM*0.68))
	if g.stagger {
		numSize = math.Max(sizeMin, math.Min(9, g.cell/ptMM*0.75))
	}
	if g.sparse {
		numSize = sizeBody
	}
	for k := 1; k <= q; k++ {
		if !g.shows(k, q) {
			continue
		}
		a := g.angle(k, q)
		rn := g.rNum
		if g.stagger && k%2 == 1 {
			rn += g.cell * 0.85
		}
		if g.numbered(k, q) {
			pn := polar(g.centre, rn, a)
			c.label(pn.X, pn.Y, numSize, Bold, Ink, fmt.Sprint(k))
		}
		if g.sparse {
			continue
		}
		cl, ok := l.CoilOn(k)
		if !ok {
			pm := polar(g.centre, g.rMark, a)
			c.label(pm.X, pm.Y, numSize, Regular, Faint, "–")
			continue
		}
		b.phaseMark(c, polar(g.centre, g.rMark, a), g.cell*0.46, cl.Phase)
		pa := polar(g.centre, g.rArrow, a)
		c.senseArrow(pa.X, pa.Y, g.cell*0.3, cl.Direction == winding.CW, Ink, math.Max(0.18, g.cell*0.05))
	}
}

// phaseMark is the phase letter in a disc tinted with the phase colour and
// ringed in its pattern.
func (b *builder) phaseMark(c *canvas, p Point, r float64, phase int) {
	st := b.phaseStyle(phase)
	c.circle(p.X, p.Y, r, Pen{Width: math.Max(0.25, r*0.14), Colour: st.Colour, Dash: scaleDash(st.Dash, r/3), Round: true}, &Fill{st.Tint})
	size := math.Max(sizeMin, math.Min(11, r*1.25/ptMM))
	col := st.Colour
	if col == (Colour{128, 128, 128}) {
		col = Colour{90, 90, 90} // darker grey letter reads better on its tint
	}
	c.label(p.X, p.Y, size, Bold, col, st.Name)
}

// leadTag is one terminal lead drawn on the slot map.
type leadTag struct {
	tooth int
	mark  string
	phase int
}

// leads lists the start and finish leads of every path.
func (b *builder) leads() []leadTag {
	l := b.p.Layout
	var out []leadTag
	for _, ch := range l.Chains {
		if len(ch.Teeth) == 0 {
			continue
		}
		s, f := ch.Start, ch.Finish
		if l.Spec.Paths > 1 {
			s = fmt.Sprintf("%s (%d)", ch.Start, ch.Path)
			f = fmt.Sprintf("%s (%d)", ch.Finish, ch.Path)
		}
		out = append(out, leadTag{ch.Teeth[0], s, ch.Phase}, leadTag{ch.Teeth[len(ch.Teeth)-1], f, ch.Phase})
	}
	return out
}

// Lead tag geometry, mm.
const (
	leadTagH   = 4.2 // tag height
	leadGap    = 0.8 // clearance kept between tags and leader lines
	leadReach  = 8.0 // tag ring: the inner edge of a tag lies this far inside rMax
	leadMinLen = 5.0 // shortest radial run of a leader off its tooth number
)

// tagRect is a lead tag's box on the page.
type tagRect struct{ x0, y0, x1, y1 float64 }

func (r tagRect) grow(d float64) tagRect { return tagRect{r.x0 - d, r.y0 - d, r.x1 + d, r.y1 + d} }

func (r tagRect) overlaps(o tagRect) bool {
	return r.x0 < o.x1 && o.x0 < r.x1 && r.y0 < o.y1 && o.y0 < r.y1
}

// hitsSegment reports whether the segment p-q passes through r.
func (r tagRect) hitsSegment(p, q Point) bool {
	// Liang-Barsky clipping of the segment against the box
	t0, t1 := 0.0, 1.0
	dx, dy := q.X-p.X, q.Y-p.Y
	for _, e := range [4][2]float64{{-dx, p.X - r.x0}, {dx, r.x1 - p.X}, {-dy, p.Y - r.y0}, {dy, r.y1 - p.Y}} {
		if e[0] == 0 {
			if e[1] < 0 {
				return false
			}
			continue
		}
		t := e[1] / e[0]
		if e[0] < 0 {
			t0 = math.Max(t0, t)
		} else {
			t1 = math.Min(t1, t)
		}
		if t0 > t1 {
			return false
		}
	}
	return true
}

// segmentsCross reports whether segments a-b and c-d cross.
func segmentsCross(a, b, c, d Point) bool {
	side := func(p, q, r Point) float64 { return (q.X-p.X)*(r.Y-p.Y) - (q.Y-p.Y)*(r.X-p.X) }
	return side(a, b, c)*side(a, b, d) < 0 && side(c, d, a)*side(c, d, b) < 0
}

// leadPlace is where one lead tag and its leader go.
type leadPlace struct {
	leadTag
	w          float64
	from, knee Point // leader: radial from the tooth number to the knee...
	at         Point // ...then on to the tag centre
	r          tagRect
}

// placeLeads puts each lead tag on a ring outside the tooth numbers. A
// leader runs radially out from the tooth number to a knee, then on to its
// tag; a tag that would cover another, or a leader that would cross another
// tag or leader, moves round the ring (then out a step) to the nearest clear
// place.
func (b *builder) placeLeads(g ringGeometry) []leadPlace {
	q := b.p.Layout.Spec.Slots
	size := sizeSmall + 0.5
	rFrom := g.rNum + g.cell*0.5
	if g.stagger {
		rFrom = g.rNum + g.cell*1.35
	}
	rEdge := math.Max(rFrom+leadMinLen+1.5, g.rTag)
	var out []leadPlace
	for _, ld := range b.leads() {
		if !g.shows(ld.tooth, q) {
			continue
		}
		a := g.angle(ld.tooth, q)
		w := textWidth(Bold, size, ld.mark) + 2.4
		from := polar(g.centre, rFrom, a)
		knee := polar(g.centre, rEdge-1.5, a)
		best := leadPlace{leadTag: ld, w: w, from: from, knee: knee}
		found := false
		// try the tooth's own angle first, then ever further either side,
		// on the tag ring and a step outside it
		for step := 0; step <= 240 && !found; step++ {
			for _, out2 := range []float64{0, leadTagH + 1.2} {
				d := float64((step+1)/2) * 1.5 * float64(1-2*(step%2)) // 0, +1.5, -1.5, +3, ...
				ta := a + d*180/(math.Pi*rEdge)
				dir := polar(Point{}, 1, ta)
				// centre the tag so its edge nearest the ring centre lies on the ring
				ext := math.Abs(dir.X)*w/2 + math.Abs(dir.Y)*leadTagH/2
				at := polar(g.centre, rEdge+out2+ext, ta)
				r := tagRect{at.X - w/2, at.Y - leadTagH/2, at.X + w/2, at.Y + leadTagH/2}
				if b.leadClear(out, r, from, knee, at) {
					best.at, best.r, found = at, r, true
					break
				}
				if step == 0 && out2 == 0 {
					best.at, best.r = at, r // fallback when nothing is clear
				}
			}
		}
		out = append(out, best)
	}
	return out
}

// leadClear reports whether a tag at r with its leader from-knee-at keeps
// clear of the tags and leaders already placed.
func (b *builder) leadClear(placed []leadPlace, r tagRect, from, knee, at Point) bool {
	for _, p := range placed {
		if r.grow(leadGap).overlaps(p.r) {
			return false
		}
		if p.r.grow(leadGap).hitsSegment(from, knee) || p.r.grow(leadGap).hitsSegment(knee, at) {
			return false
		}
		if r.grow(leadGap).hitsSegment(p.from, p.knee) || r.grow(leadGap).hitsSegment(p.knee, p.at) {
			return false
		}
		for _, s := range [][2]Point{{p.from, p.knee}, {p.knee, p.at}} {
			if segmentsCross(from, knee, s[0], s[1]) || segmentsCross(knee, at, s[0], s[1]) {
				return false
			}
		}
	}
	return true
}

// drawLeads draws each lead as a solid leader from a dot at its tooth
// number out to a terminal tag; leaders first, so tags sit on top.
func (b *builder) drawLeads(c *canvas, g ringGeometry) {
	places := b.placeLeads(g)
	for _, p := range places {
		col := b.phaseStyle(p.phase).Colour
		if col == (Colour{128, 128, 128}) {
			col = Colour{90, 90, 90} // the grey phase a shade darker so its lead reads
		}
		pen := Pen{Width: 0.5, Colour: col, Round: true}
		c.circle(p.from.X, p.from.Y, 0.75, Pen{}, &Fill{col})
		c.poly([]Point{p.from, p.knee, p.at}, false, pen, nil)
	}
	size := sizeSmall + 0.5
	for _, p := range places {
		c.box(p.r.x0, p.r.y0, p.w, leadTagH, Pen{Width: 0.35, Colour: Ink}, &Fill{White})
		c.label(p.at.X, p.at.Y, size, Bold, Ink, p.mark)
	}
}

// ringCentre writes what the drawing shows inside the bore (or the yoke).
// pathsWords says how many paths a phase has, short enough for the ring's
// centre: "1 path", "2 paths".
func pathsWords(n int) string {
	if n <= 1 {
		return "1 path"
	}
	return fmt.Sprintf("%d paths", n)
}

func (b *builder) ringCentre(c *canvas, g ringGeometry) {
	l := b.p.Layout
	o := g.centre
	r := g.rIn * 0.8
	if b.p.Rotor == plan.OuterRotor {
		r = g.rIn * 0.85
	}
	size := math.Max(sizeMin, math.Min(sizeHead, r/6/ptMM))
	lh := size * ptMM * 1.35
	lines := []string{
		fmt.Sprintf("%d teeth, %d poles", l.Spec.Slots, l.Spec.Poles),
		fmt.Sprintf("%s rotor", rotorWord(b.p.Rotor)),
		fmt.Sprintf("%d turns per coil", b.p.TurnsPerCoil),
		fmt.Sprintf("%s, %s", b.p.Connection, pathsWords(l.Spec.Paths)),
	}
	y := o.Y - lh*float64(len(lines)-1)/2
	for i, s := range lines {
		f := Regular
		if i == 0 {
			f = Bold
		}
		c.label(o.X, y, size, f, Ink, s)
		y += lh
	}
}

func rotorWord(r plan.Rotor) string {
	if r == plan.OuterRotor {
		return "outer"
	}
	return "inner"
}

// slotMapLegend explains the marks and returns the y below it.
func (b *builder) slotMapLegend(c *canvas, y float64) float64 {
	l := b.p.Layout
	x0 := float64(marginMM)
	w := b.width()
	h := 12 + 5.0*float64((len(l.PhaseNames)+2)/3)
	c.box(x0, y, w, h, Pen{Width: 0.25, Colour: Faint}, &Fill{Panel})
	c.text(x0+2, y+4, sizeSmall, Bold, Ink, left, "Legend")
	colW := (w - 4) / 3
	for i := range l.PhaseNames {
		st := b.phaseStyle(i)
		cx := x0 + 2 + float64(i%3)*colW
		cy := y + 8 + float64(i/3)*5
		c.line(cx, cy, cx+10, cy, Pen{Width: 0.7, Colour: st.Colour, Dash: st.Dash, Round: true})
		b.phaseMark(c, Point{cx + 14, cy}, 2, i)
		c.text(cx+17.5, cy+1, sizeSmall, Regular, Ink, left, fmt.Sprintf("phase %s: %s, %s line", st.Name, colourName(i), st.Pattern))
	}
	ly := y + 8 + 5*float64((len(l.PhaseNames)+2)/3)
	c.senseArrow(x0+4, ly-0.6, 1.5, true, Ink, 0.3)
	c.senseArrow(x0+9, ly-0.6, 1.5, false, Ink, 0.3)
	c.text(x0+13, ly+0.5, sizeSmall, Regular, Ink, left,
		"clockwise / counter-clockwise: the way round the tooth, seen from the air gap facing the tooth, going from the start terminal")
	return y + h
}

// titleBlock draws the drawing's title block at y with height h.
func (b *builder) titleBlock(c *canvas, y, h float64) {
	l := b.p.Layout
	x0 := float64(marginMM)
	w := b.width()
	heavy := Pen{Width: 0.5, Colour: Ink}
	c.box(x0, y, w, h, heavy, nil)
	rev := b.p.Revision
	if rev == "" {
		rev = "-"
	}
	type cell struct {
		caption, value string
		span           int
	}
	wf := fmt.Sprintf("%.3f", l.WindingFactor)
	rows := [][]cell{
		{{"job", b.jobName(), 4}, {"revision", rev, 1}, {"date", b.dateText(), 1}},
		{{"slots / poles (Q / 2p)", fmt.Sprintf("%d / %d", l.Spec.Slots, l.Spec.Poles), 1}, {"layers", fmt.Sprintf("%d (%s)", l.Spec.Layers, layerText(l.Spec.Layers)), 2}, {"parallel paths", fmt.Sprint(l.Spec.Paths), 1}, {"connection", b.p.Connection.String(), 1}, {"winding factor", wf, 1}},
		{{"turns per coil", fmt.Sprint(b.p.TurnsPerCoil), 1}, {"wire", b.wireText(), 2}, {"coils", fmt.Sprint(len(l.Coils)), 1}, {"rotor", rotorWord(b.p.Rotor), 1}, {"phases", fmt.Sprint(l.Spec.Phases), 1}},
		{{"drawn by", "", 2}, {"checked by", "", 2}, {"signature", "", 2}},
	}
	rh := h / float64(len(rows))
	unit := w / 6
	for i, row := range rows {
		ry := y + float64(i)*rh
		if i > 0 {
			c.line(x0, ry, x0+w, ry, thin)
		}
		cx := x0
		for j, cl := range row {
			cw := unit * float64(cl.span)
			if j > 0 {
				c.line(cx, ry, cx, ry+rh, thin)
			}
			c.text(cx+1.5, ry+3, sizeTiny, Regular, Colour{90, 90, 90}, left, cl.caption)
			size := sizeBody + 1
			f := Regular
			if i == 0 && j == 0 {
				size, f = sizeHead+1.5, Bold
			}
			c.text(cx+1.5, ry+rh-2.2, size, f, Ink, left, fit(cl.value, cw-3, size, f))
			cx += cw
		}
	}
}
