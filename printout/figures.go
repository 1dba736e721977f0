package printout

import (
	"fmt"
	"math"
	"math/cmplx"
	"sort"
	"strings"

	"coilwright/winding"
	"coilwright/winding/plan"
	"coilwright/winding/verify"
)

// figures draws the design figures on one sheet, each with its caption:
// the star of slots, the harmonic spectrum of the MMF, a slot cross-section
// to scale and the lead-end view with every jumper.
func (b *builder) figures() {
	c := b.newPage(FiguresPage, "Design figures")
	w := b.width()
	x0 := float64(marginMM)
	top := b.top() + 3
	half := (w - 6) / 2
	rowH := (b.bottom() - top - 4) / 2
	b.starOfSlots(c, Point{x0 + half/2, top + 4 + (rowH-26)/2}, math.Min(half, rowH-26)/2-16, x0, top+rowH-20, half)
	b.spectrum(c, x0+half+6, top+4, half, rowH-28)
	b.slotSection(c, x0, top+rowH+4, half, rowH-26)
	b.leadEndView(c, Point{x0 + half + 6 + half/2, top + rowH + 4 + (rowH-26)/2}, math.Min(half, rowH-26)/2-10, x0+half+6, top+2*rowH-23, half)
}

// caption writes "Figure n. title: text" under a figure at y, wrapped to w.
func caption(c *canvas, x, y, w float64, n int, title, text string) {
	head := fmt.Sprintf("Figure %d. %s.", n, title)
	c.text(x, y, sizeSmall+0.5, Bold, Ink, left, head)
	c.para(x, y+lineStep(sizeSmall+0.5), w, sizeSmall, Regular, Ink, text)
}

// coilPhasor is the page angle (degrees) of the EMF phasor of the coil on
// a tooth, as the check models it (verify.CoilPhasor), drawn with 0° at the
// top of the star.
func coilPhasor(cl winding.Coil, q, p int) float64 {
	return 90 + cmplx.Phase(verify.CoilPhasor(cl.Tooth, q, p, cl.Direction))*180/math.Pi
}

// starOfSlots draws the coil phasors numbered by tooth, the phase bands
// and each phase's sum, with its caption below at x, capY.
func (b *builder) starOfSlots(c *canvas, o Point, r float64, x, capY, capW float64) {
	l := b.p.Layout
	q, p, m := l.Spec.Slots, l.Spec.PolePairs(), len(l.PhaseNames)
	// phase sums
	sums := make([]Point, m)
	for _, cl := range l.Coils {
		a := coilPhasor(cl, q, p) * math.Pi / 180
		sums[cl.Phase].X += math.Cos(a)
		sums[cl.Phase].Y += math.Sin(a)
	}
	// phase bands: ±90/m about each phase's sum and its reverse
	band := 180 / float64(m)
	for i, s := range sums {
		st := b.phaseStyle(i)
		a := math.Atan2(s.Y, s.X) * 180 / math.Pi
		for _, centre := range []float64{a, a + 180} {
			pts := []Point{o}
			for k := 0; k <= 12; k++ {
				pts = append(pts, polar(o, r, centre-band/2+band*float64(k)/12))
			}
			fill := st.Tint
			if centre != a {
				fill = Colour{250, 250, 250}
			}
			c.poly(pts, true, Pen{Width: 0.15, Colour: Faint}, &Fill{fill})
		}
	}
	c.circle(o.X, o.Y, r, Pen{Width: 0.2, Colour: Faint}, nil)
	// the coil phasors, grouped where they coincide
	type group struct {
		a     float64
		phase int
		teeth []string
	}
	var groups []*group
	for _, cl := range l.Coils {
		a := math.Round(coilPhasor(cl, q, p)*1000) / 1000
		var g *group
		for _, x := range groups {
			if math.Abs(math.Mod(x.a-a+720, 360)) < 1e-6 {
				g = x
			}
		}
		if g == nil {
			g = &group{a: a, phase: cl.Phase}
			groups = append(groups, g)
		}
		g.teeth = append(g.teeth, fmt.Sprint(cl.Tooth))
	}
	sort.Slice(groups, func(i, j int) bool { return groups[i].a < groups[j].a })
	var placed []tagRect
	for _, g := range groups {
		st := b.phaseStyle(g.phase)
		tip := polar(o, r*0.86, g.a)
		c.line(o.X, o.Y, tip.X, tip.Y, Pen{Width: 0.35, Colour: st.Colour})
		c.arrowHead(tip, g.a, 1.6, st.Colour)
		lbl := strings.Join(g.teeth, ",")
		if len(g.teeth) > 4 {
			lbl = g.teeth[0] + "…" + g.teeth[len(g.teeth)-1]
		}
		// the label beyond the tip, a step further out where it would
		// cover another; left out where neither place is clear
		tw := textWidth(Regular, sizeMin, lbl)
		hh := sizeMin * ptMM
		for _, rr := range []float64{r + 2.5, r + 6, r + 9.5, r + 13} {
			lp := polar(o, rr, g.a)
			// push the label out so its near edge, not its centre, sits at rr
			lp.X += math.Cos(g.a*math.Pi/180) * tw / 2
			box := tagRect{lp.X - tw/2, lp.Y - hh/2, lp.X + tw/2, lp.Y + hh/2}
			if box.x0 < marginMM || box.x1 > b.paper.W-marginMM {
				continue
			}
			free := true
			for _, u := range placed {
				if u.grow(0.4).overlaps(box) {
					free = false
				}
			}
			if free {
				c.label(lp.X, lp.Y, sizeMin, Regular, Ink, lbl)
				placed = append(placed, box)
				break
			}
		}
	}
	// the phase sums, scaled to the circle, drawn heavy with their letter
	most := 0.0
	for _, s := range sums {
		most = math.Max(most, math.Hypot(s.X, s.Y))
	}
	for i, s := range sums {
		if most == 0 {
			break
		}
		st := b.phaseStyle(i)
		a := math.Atan2(s.Y, s.X) * 180 / math.Pi
		tip := polar(o, r*0.55*math.Hypot(s.X, s.Y)/most, a)
		c.line(o.X, o.Y, tip.X, tip.Y, Pen{Width: 1.1, Colour: st.Colour, Dash: st.Dash, Round: true})
		c.arrowHead(tip, a, 2.6, st.Colour)
		b.phaseMark(c, polar(o, r*0.55+4, a), 2.2, i)
	}
	caption(c, x, capY, capW, 1, "Star of slots",
		fmt.Sprintf("the EMF phasor of every coil at the working order p = %d, numbered by tooth (a counter-clockwise coil turned half round), the phasor of tooth 1 at the top; "+
			"tinted wedges are the phase bands, the heavy arrows each phase's sum. The sums lie %s electrical apart.",
			p, degrees(360/float64(m))))
}

// degrees writes an angle in degrees with the degree sign.
func degrees(a float64) string { return strings.TrimSuffix(fmt.Sprintf("%.1f", a), ".0") + "°" }

// spectrum draws the MMF winding factor of every spatial order as bars, the
// working order marked and the sub-harmonics (orders below it) shaded.
func (b *builder) spectrum(c *canvas, x, y, w, h float64) {
	l := b.p.Layout
	p := l.Spec.PolePairs()
	n := min(len(l.Harmonics), max(3*p, 2*l.Spec.Slots/max(1, l.Periodicity)*l.Periodicity/2+p))
	n = min(n, 120)
	if n == 0 {
		return
	}
	px, pw := x+9, w-11
	ph := h - 12
	bw := pw / float64(n)
	base := y + ph
	// sub-harmonics shaded
	if p > 1 {
		c.box(px, y, bw*float64(p-1), ph, Pen{}, &Fill{Colour{226, 226, 226}})
		c.text(px+1, y+3, sizeMin, Regular, Ink, left, "sub-harmonics")
	}
	// axes and grid
	for _, v := range []float64{0, 0.5, 1} {
		gy := base - v*ph*0.92
		c.line(px, gy, px+pw, gy, Pen{Width: 0.15, Colour: Faint})
		c.text(px-1, gy+1, sizeMin, Regular, Ink, right, fmt.Sprintf("%.1f", v))
	}
	for i := 0; i < n; i++ {
		hm := l.Harmonics[i]
		k := hm.MMFWindingFactor
		if k < 0.002 {
			continue
		}
		col := Colour{110, 110, 110}
		if hm.Order == p {
			col = Black
		}
		bx := px + float64(i)*bw
		c.box(bx+bw*0.15, base-k*ph*0.92, bw*0.7, k*ph*0.92, Pen{}, &Fill{col})
	}
	// order ticks: a round step that keeps the numbers apart
	step := roundStep((textWidth(Regular, sizeMin, fmt.Sprint(n)) + 1.5) / bw)
	if bw >= textWidth(Regular, sizeMin, fmt.Sprint(n))+1.5 {
		step = 1
	}
	for o := step; o <= n; o += step {
		c.text(px+(float64(o)-0.5)*bw, base+3.2, sizeMin, Regular, Ink, centre, fmt.Sprint(o))
	}
	wx := px + (float64(p)-0.5)*bw
	c.line(wx, y-1, wx, base, Pen{Width: 0.3, Colour: Black, Dash: Dash{1, 0.8}})
	c.text(wx+1, y+6.5, sizeMin, Bold, Ink, left, fmt.Sprintf("working order p = %d", p))
	c.text(px+pw, base+7, sizeMin, Regular, Ink, right, "spatial order (pole pairs of the wave)")
	caption(c, x, y+h-1, w, 2, "Harmonic spectrum",
		fmt.Sprintf("MMF winding factor of the %s-phase current by spatial order; the working order %d in black (k_w = %.3f), orders below it shaded. "+
			"A tall bar beside the working one is a field the rotor does not follow: eddy currents in magnets and back iron.",
			phaseCountWord(len(l.PhaseNames)), p, l.WindingFactor))
}

// phaseCountWord is the phase count in words for a sentence.
func phaseCountWord(m int) string {
	words := []string{"", "one", "two", "three", "four", "five", "six", "seven", "eight", "nine"}
	if m >= 0 && m < len(words) {
		return words[m]
	}
	return fmt.Sprint(m)
}

// slotSection draws one slot to scale: liner, the two coil sides (one in a
// single-layer winding) with their turns as circles, the separator between
// them, with its caption under it.
func (b *builder) slotSection(c *canvas, x, y, w, h float64) {
	p := b.p
	s := p.Slot
	depth, width := s.DepthMM, s.MeanWidthMM
	od := p.Wire.OverallDiameterMM
	if depth <= 0 || width <= 0 || od <= 0 {
		c.para(x, y+4, w, sizeSmall, Regular, Ink, "The plan gives no slot dimensions: no cross-section.")
		caption(c, x, y+h-1, w, 3, "Slot cross-section", "not drawn")
		return
	}
	liner := 0.0
	if s.LinedPerimeterMM > 0 {
		liner = s.LinerAreaMM2 / s.LinedPerimeterMM
	}
	sep := 0.0
	if s.SeparatorAreaMM2 > 0 {
		sep = s.SeparatorAreaMM2 / depth
	}
	scale := math.Min((w-30)/width, (h-22)/depth)
	sx := x + (w-width*scale)/2
	sy := y + 6
	// iron round the slot
	c.box(sx-8, sy-2, width*scale+16, depth*scale+6, Pen{}, &Fill{Colour{222, 222, 222}})
	c.box(sx, sy-2, width*scale, depth*scale+2, Pen{Width: 0.3, Colour: Ink}, &Fill{White})
	gapWord, yokeWord := "air gap side", "yoke side"
	c.text(sx+width*scale/2, sy-3.2, sizeMin, Regular, Ink, centre, gapWord)
	c.text(sx+width*scale/2, sy+depth*scale+7.5, sizeMin, Regular, Ink, centre, yokeWord)
	// liner
	if liner > 0 {
		t := math.Max(0.3, liner*scale)
		pen := Pen{Width: t, Colour: Colour{200, 160, 40}}
		c.poly([]Point{{sx + t/2, sy}, {sx + t/2, sy + depth*scale - t/2}, {sx + width*scale - t/2, sy + depth*scale - t/2}, {sx + width*scale - t/2, sy}}, false, pen, nil)
	}
	sides := 2
	if p.Layout.Spec.Layers == 1 {
		sides = 1
	}
	innerW := width - 2*liner
	sideW := (innerW - sep) / float64(sides)
	turns := p.TurnsPerCoil * max(1, p.Wire.StrandsInHand)
	// as many columns as the turns need from the slot bottom up, each side
	// against its wall
	rows := max(1, int((depth-liner)/od))
	cols := min(max(1, int(sideW/od)), (turns+rows-1)/rows)
	build := float64(cols) * od
	drawn := 0
	for k := 0; k < sides; k++ {
		left0 := liner + float64(k)*(innerW-build)
		if sides == 1 {
			left0 = liner + (innerW-build)/2
		}
		drawn = b.coilSide(c, sx+left0*scale, sy+(depth-liner)*scale, build*scale, (depth-liner)*scale, od*scale, turns, k)
	}
	if sides == 2 && sep > 0 {
		mx := sx + width*scale/2
		c.line(mx, sy+1, mx, sy+(depth-liner)*scale, Pen{Width: math.Max(0.3, sep*scale), Colour: Colour{60, 110, 190}})
	}
	text := fmt.Sprintf("to scale (1 mm of slot = %.1f mm here): %.1f mm deep, %.1f mm mean width; liner %.2f mm", scale, depth, width, liner)
	if sides == 2 && sep > 0 {
		text += fmt.Sprintf(", separator %.2f mm (blue) between the two coil sides", sep)
	}
	text += fmt.Sprintf("; each side %d turns", p.TurnsPerCoil)
	if p.Wire.StrandsInHand > 1 {
		text += fmt.Sprintf(" × %d strands", p.Wire.StrandsInHand)
	}
	text += fmt.Sprintf(" of %.3f mm over the enamel", od)
	if drawn < turns {
		text += fmt.Sprintf(" (%d of them fit the drawing)", drawn)
	}
	text += fmt.Sprintf(". Fill %.0f %% of the usable area (practical limit %.0f %%).", 100*p.SlotFill, 100*s.PracticalFill)
	caption(c, x, y+h-1, w, 3, "Slot cross-section", text)
}

// coilSide draws n conductors of diameter d in the box whose bottom left is
// (x, bottom), filled from the slot bottom up in rows, and returns how many
// it drew. Side k alternates the shade so the two coils tell apart.
func (b *builder) coilSide(c *canvas, x, bottom, w, h, d float64, n, k int) int {
	if d <= 0 {
		return 0
	}
	cols := max(1, int(w/d))
	rows := max(1, int(h/d))
	fill := Colour{240, 200, 150}
	if k == 1 {
		fill = Colour{220, 220, 220}
	}
	pen := Pen{Width: math.Min(0.15, d*0.08), Colour: Ink}
	drawn := 0
	for r := 0; r < rows && drawn < n; r++ {
		for cc := 0; cc < cols && drawn < n; cc++ {
			c.circle(x+d/2+float64(cc)*d, bottom-d/2-float64(r)*d, d*0.48, pen, &Fill{fill})
			drawn++
		}
	}
	return drawn
}

// leadEndView draws the stator from the lead end with every jumper as an
// arc between the slots it leaves and enters, in its phase's colour and
// pattern, each path of a phase on its own radius and the paths of a phase
// branching to one terminal.
func (b *builder) leadEndView(c *canvas, o Point, r float64, capX, capY, capW float64) {
	l := b.p.Layout
	q := l.Spec.Slots
	m := len(l.PhaseNames)
	paths := max(1, l.Spec.Paths)
	rTooth := r * 0.62
	// teeth as short radial bars
	for k := 1; k <= q; k++ {
		a := toothAngle(k, q)
		p0, p1 := polar(o, rTooth*0.8, a), polar(o, rTooth, a)
		c.line(p0.X, p0.Y, p1.X, p1.Y, Pen{Width: math.Max(0.4, math.Min(2.2, 2*math.Pi*rTooth/float64(q)*0.45)), Colour: Colour{200, 200, 200}})
	}
	// tooth numbers inside the ring, every tooth where the numbers keep
	// apart at that radius, else every 2nd, 3rd … (tooth 1 always)
	rNum := rTooth*0.8 - 3
	numW := textWidth(Regular, sizeMin, fmt.Sprint(q)) + 0.8
	every := max(1, int(math.Ceil(numW/(2*math.Pi*rNum/float64(q)))))
	if rNum > 0 && every <= 4 {
		for k := 1; k <= q; k++ {
			if (k-1)%every != 0 {
				continue
			}
			lp := polar(o, rNum, toothAngle(k, q))
			c.label(lp.X, lp.Y, sizeMin, Regular, Faint, fmt.Sprint(k))
		}
	}
	slotAngle := func(s int) float64 { return toothAngle(s, q) + 180/float64(q) }
	ring := func(phase, path int) float64 {
		return rTooth + 1.8 + (r-rTooth-4)*float64(phase*paths+path-1)/float64(max(1, m*paths-1))
	}
	jumpers := 0
	for _, st := range b.p.Steps {
		j := st.Jumper
		if j == nil || j.LeavesSlot == 0 {
			continue
		}
		cl, ok := l.CoilOn(j.FromTooth)
		if !ok {
			continue
		}
		sty := b.phaseStyle(cl.Phase)
		rr := ring(cl.Phase, cl.Path)
		a0 := slotAngle(j.LeavesSlot)
		sweep := float64(j.SlotPitches) * 360 / float64(q)
		if j.Way == plan.WayCW {
			sweep = -sweep
		}
		pen := Pen{Width: 0.5, Colour: sty.Colour, Dash: sty.Dash, Round: true}
		// down from the slot to the jumper's ring, round, and back in
		p0, p1 := polar(o, rTooth, a0), polar(o, rr, a0)
		c.line(p0.X, p0.Y, p1.X, p1.Y, pen)
		c.add(&Arc{Centre: o, Radius: rr, Start: a0, Sweep: sweep, Pen: pen})
		e0, e1 := polar(o, rr, a0+sweep), polar(o, rTooth, a0+sweep)
		c.line(e0.X, e0.Y, e1.X, e1.Y, pen)
		jumpers++
	}
	// leads: each path's start and finish out to its phase's terminal; the
	// paths of a phase branch from one tag
	tags := map[string]Point{}
	var order []string
	for _, ch := range l.Chains {
		if len(ch.Teeth) == 0 {
			continue
		}
		sty := b.phaseStyle(ch.Phase)
		pen := Pen{Width: 0.5, Colour: sty.Colour, Dash: sty.Dash, Round: true}
		for _, end := range []struct {
			mark  string
			tooth int
		}{{ch.Start, ch.Teeth[0]}, {ch.Finish, ch.Teeth[len(ch.Teeth)-1]}} {
			a := toothAngle(end.tooth, q)
			from := polar(o, rTooth, a)
			t, seen := tags[end.mark]
			if !seen {
				// out along the tooth's radius until clear of the tags so far
				tw := textWidth(Bold, sizeMin, end.mark) + 1.6
				for k := 0.0; k < 12; k++ {
					t = polar(o, r+5+4.5*k, a)
					clear := true
					for mk, u := range tags {
						uw := textWidth(Bold, sizeMin, mk) + 1.6
						if math.Abs(u.X-t.X) < (tw+uw)/2+0.6 && math.Abs(u.Y-t.Y) < 4.4 {
							clear = false
						}
					}
					if clear {
						break
					}
				}
				tags[end.mark] = t
				order = append(order, end.mark)
			}
			// out past the jumpers, then round the outside on the phase's
			// own radius to the tag's side and out to it, never across the
			// stator
			rk := r + 1.2 + 0.9*float64(ch.Phase)
			at := math.Atan2(-(t.Y-o.Y), t.X-o.X) * 180 / math.Pi
			d := math.Mod(at-a+540, 360) - 180 // the shorter way, degrees
			pts := []Point{from}
			steps := int(math.Ceil(math.Abs(d) / 5))
			for i := 0; i <= steps; i++ {
				pts = append(pts, polar(o, rk, a+d*float64(i)/float64(max(1, steps))))
			}
			c.poly(append(pts, t), false, pen, nil)
			c.circle(from.X, from.Y, 0.6, Pen{}, &Fill{sty.Colour})
		}
	}
	for _, mk := range order {
		t := tags[mk]
		tw := textWidth(Bold, sizeMin, mk) + 1.6
		c.box(t.X-tw/2, t.Y-1.9, tw, 3.8, Pen{Width: 0.3, Colour: Ink}, &Fill{White})
		c.label(t.X, t.Y, sizeMin, Bold, Ink, mk)
	}
	numbered := "teeth numbered counter-clockwise"
	if every > 1 {
		numbered = fmt.Sprintf("teeth numbered counter-clockwise (every %s tooth)", ordinal(every))
	}
	text := fmt.Sprintf("the stator seen from the lead end, "+numbered+"; every one of the %d jumpers drawn as an arc from the slot it leaves to the slot it enters, in its phase's line pattern", jumpers)
	if paths > 1 {
		text += fmt.Sprintf(", each of the %d parallel paths of a phase on its own ring and branching to the phase's terminals", paths)
	}
	text += "."
	caption(c, capX, capY, capW, 4, "Lead-end view", text)
}
