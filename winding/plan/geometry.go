package plan

import (
	"fmt"
	"math"

	"coilwright/winding"
	"coilwright/winding/job"
)

// Fill ceilings of round wire (geometry): orthocyclic (hexagonal) packing
// fills π/√12 of the area with circles, square packing π/4.
var (
	OrthocyclicFill = math.Pi / math.Sqrt(12)
	SquareFill      = math.Pi / 4
)

// slot works out the slot areas: the free area, the liner round its lined
// perimeter (the walls, the bottom and the tooth-tip undersides beside the
// opening), and the phase separator across the depth where two phases share
// a slot.
func (b *builder) slot() error {
	st := b.j.Stator
	sl := st.Slot
	s := Slot{OpeningMM: sl.OpeningMM, PracticalFill: b.j.Build.PracticalFill}
	if sl.Parametric() {
		s.AreaMM2 = sl.DepthMM * (sl.WidthTopMM + sl.WidthBottomMM) / 2
		side := math.Hypot(sl.DepthMM, (sl.WidthTopMM-sl.WidthBottomMM)/2)
		s.LinedPerimeterMM = 2*side + sl.WidthBottomMM + (sl.WidthTopMM - sl.OpeningMM)
		s.DepthMM = sl.DepthMM
		s.MeanWidthMM = (sl.WidthTopMM + sl.WidthBottomMM) / 2
	} else {
		s.AreaMM2 = sl.AreaMM2
		s.DepthMM = sl.DepthMM
		if s.DepthMM == 0 {
			// A square slot of the same area; said in the plan's warnings.
			s.DepthMM = math.Sqrt(sl.AreaMM2)
			s.DepthEstimated = true
			b.warn("slot: depth_mm not given; the slot is taken as square, %.1f mm deep, for the liner, the separator and the coil build", s.DepthMM)
		}
		s.MeanWidthMM = sl.AreaMM2 / s.DepthMM
		s.LinedPerimeterMM = 2*s.DepthMM + s.MeanWidthMM + math.Max(0, s.MeanWidthMM-sl.OpeningMM)
	}
	s.LinerAreaMM2 = st.LinerMM * s.LinedPerimeterMM
	if b.sides == 2 && sharedSlots(b.p.Layout) > 0 {
		s.SeparatorAreaMM2 = st.SeparatorMM * math.Max(0, s.DepthMM-st.LinerMM)
	}
	s.UsableAreaMM2 = s.AreaMM2 - s.LinerAreaMM2 - s.SeparatorAreaMM2
	if s.UsableAreaMM2 <= 0 {
		return b.j.Fail("stator.liner_mm", fmt.Sprint(st.LinerMM),
			fmt.Sprintf("liner (%.1f mm²) and separator (%.1f mm²) leave no room in a slot of %.1f mm²", s.LinerAreaMM2, s.SeparatorAreaMM2, s.AreaMM2),
			"check the slot dimensions and the insulation thicknesses")
	}
	bare, od := b.p.Wire.BareDiameterMM, b.p.Wire.OverallDiameterMM
	s.CeilingFill = OrthocyclicFill * (bare / od) * (bare / od)
	s.MaxTurns = int(math.Floor(s.PracticalFill*s.UsableAreaMM2/(float64(b.sides)*b.p.Wire.CopperAreaMM2) + 1e-9))
	b.p.Slot = s
	if od > sl.OpeningMM {
		return b.j.Fail("wire", fmt.Sprintf("%.3f mm overall", od),
			fmt.Sprintf("the wire is wider than the slot opening (%.2f mm) and cannot be fed into the slot", sl.OpeningMM),
			fmt.Sprintf("use wire under %.2f mm overall, several thinner strands in hand, or check stator.slot.opening_mm", sl.OpeningMM))
	}
	if n := b.p.Wire.StrandsInHand; n > 1 && float64(n)*od > sl.OpeningMM {
		b.warn("wire: %d strands side by side (%.2f mm) are wider than the slot opening (%.2f mm); feed them through the opening one after another", n, float64(n)*od, sl.OpeningMM)
	}
	if s.DepthMM-2*st.LinerMM < od {
		return b.j.Fail("stator.slot.depth_mm", fmt.Sprintf("%.2f", s.DepthMM), fmt.Sprintf("the lined slot is shallower than one wire (%.3f mm)", od), "")
	}
	if b.j.Stator.Rotor == job.RotorOuter && s.DepthMM >= b.j.Stator.DiameterMM/2 {
		return b.j.Fail("stator.slot.area_mm2", fmt.Sprint(sl.AreaMM2),
			fmt.Sprintf("an estimated depth of %.1f mm does not fit an outer-rotor stator of radius %.1f mm", s.DepthMM, b.j.Stator.DiameterMM/2),
			"give stator.slot.depth_mm")
	}
	b.depthMM = s.DepthMM
	b.checkTrapezoid()
	return nil
}

// checkTrapezoid warns when the slot and tooth widths do not add up to the
// tooth pitch at their radius (a loose check: tooth tips and rounding are not
// modelled, so 15 % is allowed).
func (b *builder) checkTrapezoid() {
	st := b.j.Stator
	if !st.Slot.Parametric() {
		return
	}
	q := float64(b.j.Winding.Slots)
	r := st.DiameterMM / 2
	var gapSide, yokeSide float64
	if st.Rotor == job.RotorInner {
		gapSide, yokeSide = 2*math.Pi*r/q, 2*math.Pi*(r+st.Slot.DepthMM)/q
	} else {
		gapSide, yokeSide = 2*math.Pi*r/q, 2*math.Pi*(r-st.Slot.DepthMM)/q
	}
	if sum := st.Slot.WidthTopMM + st.ToothWidthMM; sum > 1.15*gapSide {
		b.warn("slot: width_top_mm + tooth_width_mm = %.1f mm is more than the tooth pitch on the air-gap side (%.1f mm); check the dimensions", sum, gapSide)
	}
	if sum := st.Slot.WidthBottomMM + st.ToothWidthMM; sum > 1.15*yokeSide {
		b.warn("slot: width_bottom_mm + tooth_width_mm = %.1f mm is more than the tooth pitch at the yoke (%.1f mm); check the dimensions", sum, yokeSide)
	}
}

// sharedSlots counts the slots whose two coil sides belong to different phases.
func sharedSlots(l *winding.Layout) int {
	n := 0
	for k := 1; k <= l.Spec.Slots; k++ {
		if _, _, ok := slotPhases(l, k); ok {
			n++
		}
	}
	return n
}

// slotPhases returns the phases of the two coils whose sides lie in slot k
// (the coil on tooth k and the one on tooth k+1), and whether they differ.
func slotPhases(l *winding.Layout, k int) (a, b int, differ bool) {
	q := l.Spec.Slots
	c1, ok1 := l.CoilOn(k)
	c2, ok2 := l.CoilOn(k%q + 1)
	if !ok1 || !ok2 {
		return 0, 0, false
	}
	return c1.Phase, c2.Phase, c1.Phase != c2.Phase
}

// fit checks that the turns fit the slot and sets the fill.
func (b *builder) fit() error {
	p := b.p
	s := &p.Slot
	copper := float64(b.sides*p.TurnsPerCoil) * p.Wire.CopperAreaMM2
	p.SlotFill = copper / s.UsableAreaMM2
	field, val := "turns.per_coil", fmt.Sprint(p.TurnsPerCoil)
	if p.TurnsSolved {
		field, val = "turns.target", fmt.Sprintf("%q (solved to %d turns per coil)", b.j.Turns.Target, p.TurnsPerCoil)
	}
	if p.SlotFill > s.CeilingFill {
		return b.j.Fail(field, val,
			fmt.Sprintf("%d coil side%s of %d turns × %d strand%s of %.3f mm need %.1f mm² of copper in a slot with %.1f mm² usable: a fill of %.2f, above the %.2f that round wire of %.3f mm overall can reach even perfectly layered",
				b.sides, plural(b.sides, "", "s"), p.TurnsPerCoil, p.Wire.StrandsInHand, plural(p.Wire.StrandsInHand, "", "s"), p.Wire.BareDiameterMM, copper, s.UsableAreaMM2, p.SlotFill, s.CeilingFill, p.Wire.OverallDiameterMM),
			fmt.Sprintf("at most %d turns fit at the practical fill %.2f; use thinner wire with parallel paths, fewer turns, or a larger slot", s.MaxTurns, s.PracticalFill))
	}
	if p.SlotFill > s.PracticalFill {
		b.warn("fill: slot fill %.2f is beyond the practical %.2f for hand winding (at most %d turns at that fill); the last turns may not go in, or the coils may touch across the slot", p.SlotFill, s.PracticalFill, s.MaxTurns)
	}
	// Coil build across the slot: the wires of one coil side in square packing
	// over the enamel, spread over the lined depth.
	h := b.depthMM - b.j.Stator.LinerMM
	gross := float64(p.TurnsPerCoil*p.Wire.StrandsInHand) * p.Wire.OverallDiameterMM * p.Wire.OverallDiameterMM
	s.CoilBuildMM = gross / h
	room := s.MeanWidthMM - 2*b.j.Stator.LinerMM
	if b.sides == 2 {
		room = (room - b.j.Stator.SeparatorMM) / 2
	}
	if s.CoilBuildMM > room {
		b.warn("fill: a coil side is about %.1f mm thick, more than the %.1f mm of slot width it has; wind tighter layers or fewer turns", s.CoilBuildMM, room)
	}
	return nil
}

// lengths works out the mean turn, every coil, jumper and path.
func (b *builder) lengths() error {
	p, j := b.p, b.j
	t := j.Stator.LinerMM
	// Mean turn: the coil sits on the tooth grown by the liner on every face
	// (L+2t by w+2t), and its mean turn runs at half the build b, round the
	// corners with radius b/2: 2·(L+2t) + 2·(w+2t) + π·b (geometry of a coil
	// wound on a rectangular former; common practice for the mean length of
	// turn of a bobbin or tooth coil, checked by hand in plan_test.go).
	p.MeanTurnLengthMM = 2*(j.Stator.StackLengthMM+2*t) + 2*(j.Stator.ToothWidthMM+2*t) + math.Pi*p.Slot.CoilBuildMM
	coilM := float64(p.TurnsPerCoil) * p.MeanTurnLengthMM / 1000
	// Jumpers run round the lead end at mid slot depth, from the up slot of
	// one coil to the down slot of the next (LayJumper).
	r := j.Stator.DiameterMM / 2
	if j.Stator.Rotor == job.RotorInner {
		r += b.depthMM / 2
	} else {
		r -= b.depthMM / 2
	}
	p.JumperPitchMM = 2 * math.Pi * r / float64(j.Winding.Slots)
	p.JumperRadiusMM = r
	l := p.Layout
	lead := j.Build.LeadLengthMM / 1000
	order := 0
	for _, ch := range l.Chains {
		pp := PathPlan{Phase: l.PhaseNames[ch.Phase], Path: ch.Path, Coils: len(ch.Teeth)}
		for _, tooth := range ch.Teeth {
			c, _ := l.CoilOn(tooth)
			order++
			p.Coils = append(p.Coils, CoilPlan{Tooth: tooth, Phase: l.PhaseNames[c.Phase], Direction: c.Direction,
				Path: c.Path, Position: c.Position, Turns: p.TurnsPerCoil, WireLengthM: coilM, Order: order})
			pp.WireLengthM += coilM
		}
		laid := make([]JumperStep, 0, len(ch.Jumpers))
		for _, jp := range ch.Jumpers {
			from, _ := l.CoilOn(jp.FromTooth)
			to, _ := l.CoilOn(jp.ToTooth)
			js := LayJumper(p.Rotor, jp, from.Direction, to.Direction, l.Spec.Slots, r, j.Build.JumperSlackMM)
			laid = append(laid, js)
			pp.JumperLengthM += js.LengthMM / 1000
		}
		b.jumpers = append(b.jumpers, laid)
		pp.WireLengthM += pp.JumperLengthM
		pp.CutLengthM = pp.WireLengthM + 2*lead + float64(pp.Coils)*j.Build.ExtraPerCoilMM/1000
		p.Paths = append(p.Paths, pp)
	}
	return nil
}
