package printout

import (
	"regexp"
	"slices"
	"testing"

	"coilwright/winding"
)

// The star point or delta joints never take a sheet of their own: every
// connection sheet carries coils of the chains, and the joints are printed
// once.
func TestJointsBesideTheChains(t *testing.T) {
	coil := regexp.MustCompile(`^T\d+$`)
	specs := []winding.Spec{{Slots: 120, Poles: 112, Paths: 2}, {Slots: 96, Poles: 88}, {Slots: 72, Poles: 66}, {Slots: 12, Poles: 10}}
	for _, s := range specs {
		for _, paper := range PaperSizes {
			pk, err := Build(fixturePlan(t, s, winding.Star), Options{Paper: paper})
			if err != nil {
				t.Fatal(err)
			}
			joints := 0
			for _, pg := range pagesOf(pk, ConnectionPage) {
				texts := pg.Texts()
				if slices.Contains(texts, "Star point") {
					joints++
				}
				if !slices.ContainsFunc(texts, coil.MatchString) {
					t.Errorf("%d/%d %s: sheet %q has no coil of the chains", s.Slots, s.Poles, paper.Name, pg.Title)
				}
			}
			if joints != 1 {
				t.Errorf("%d/%d %s: star point printed %d times; want once", s.Slots, s.Poles, paper.Name, joints)
			}
		}
	}
}

// On the connection sheets no word runs into another or across the border
// of a coil box: the jumper labels between the boxes and "reverse" under
// them keep clear of the boxes (read back from the page model's word boxes
// against the drawn box rectangles), for the demo and every fixture, a
// five-phase star among them.
func TestConnectionWordsClearOfCoilBoxes(t *testing.T) {
	packs := packsUnderTest(t)
	pk, err := Build(fixturePlan(t, winding.Spec{Slots: 20, Poles: 18, Phases: 5}, winding.Star), Options{})
	if err != nil {
		t.Fatal(err)
	}
	packs["20-18-five-phase-star"] = pk
	for name, pk := range packs {
		reverse := 0
		for _, pg := range pagesOf(pk, ConnectionPage) {
			if o := overlappingTexts(pg); len(o) > 0 {
				t.Errorf("%s %q: %d words overlap, first %s", name, pg.Title, len(o), o[0])
			}
			var boxes []*Box
			for _, sh := range pg.Shapes {
				if bx, ok := sh.(*Box); ok && bx.W == conBoxW && bx.H == conBoxH {
					boxes = append(boxes, bx)
				}
			}
			for _, sh := range pg.Shapes {
				tx, ok := sh.(*Text)
				if !ok {
					continue
				}
				if tx.S == "reverse" {
					reverse++
				}
				x0, y0, x1, y1 := tx.bounds()
				for _, bx := range boxes {
					inside := x0 >= bx.X && x1 <= bx.X+bx.W && y0 >= bx.Y && y1 <= bx.Y+bx.H
					if !inside && shapesMeet(tx, bx, 0.1) {
						t.Errorf("%s %q: %q at (%.1f, %.1f) runs into the coil box at (%.1f, %.1f)", name, pg.Title, tx.S, tx.X, tx.Y, bx.X, bx.Y)
					}
				}
			}
		}
		if len(pagesOf(pk, ConnectionPage)) > 0 && reverse == 0 && name == "demo" {
			t.Errorf("%s: no jumper marked reverse", name)
		}
	}
}

// Every jumper on the connection sheets is labelled slot to slot from the
// engine's values: the demo's first jumper of phase U leaves slot 24 and
// enters slot 1, one slot pitch counter-clockwise seen from the lead end,
// and the second leaves slot 2 and enters slot 6, four pitches (the slots
// the bench guide names; tooth pitches would count 5 and land on the up
// slot of tooth 7).
func TestJumpersLabelledSlotToSlot(t *testing.T) {
	p := demoPlan(t)
	pk, err := Build(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	var texts []string
	for _, pg := range pagesOf(pk, ConnectionPage) {
		texts = append(texts, pg.Texts()...)
	}
	for _, want := range []string{"s24→s1", "s2→s6", "4 up", "1 up"} {
		if !slices.Contains(texts, want) {
			t.Errorf("connection sheets lack the jumper label %q", want)
		}
	}
	// one label per jumper step of the plan, with its slots
	n := 0
	for _, st := range p.Steps {
		if j := st.Jumper; j != nil {
			n++
			s, w := jumperLabels(*j)
			if !slices.Contains(texts, s) || !slices.Contains(texts, w) {
				t.Errorf("jumper %d→%d: labels %q, %q not on the connection sheets", j.FromTooth, j.ToTooth, s, w)
			}
		}
	}
	if n == 0 {
		t.Fatal("demo plan has no jumper steps")
	}
	for _, s := range texts {
		if regexp.MustCompile(`^\+\d+$`).MatchString(s) {
			t.Errorf("connection sheets still print a tooth-pitch count %q", s)
		}
		// the way round the lead end is said by the slot numbers, never as
		// cw/ccw beside coil boxes whose cw/ccw is seen from the air gap
		if regexp.MustCompile(`^\d+ c?cw$`).MatchString(s) {
			t.Errorf("connection sheets print a jumper's way as %q, which reads as a coil sense", s)
		}
	}
}

// The finish marks at the star point (U2, V2, …) keep clear of every line
// drawn to the star point, for three and five phases: each word box is at
// least 0.3 mm from every line of the drawing (sampled along the line).
func TestStarPointMarksClearOfLines(t *testing.T) {
	for _, s := range []winding.Spec{{Slots: 12, Poles: 10}, {Slots: 20, Poles: 18, Phases: 5}} {
		pk, err := Build(fixturePlan(t, s, winding.Star), Options{})
		if err != nil {
			t.Fatal(err)
		}
		finish := regexp.MustCompile(`^[A-Z]2$`)
		marks := 0
		b := &builder{}
		for _, pg := range pagesOf(pk, ConnectionPage) {
			var panel *Box
			for _, sh := range pg.Shapes {
				if bx, ok := sh.(*Box); ok && bx.H == b.jointsHeight() && bx.Fill != nil {
					panel = bx
				}
			}
			for _, sh := range pg.Shapes {
				tx, ok := sh.(*Text)
				if !ok || !finish.MatchString(tx.S) || panel == nil || tx.Y < panel.Y || tx.Y > panel.Y+panel.H {
					continue // the finish tags of the chains are not the star point's
				}
				marks++
				x0, y0, x1, y1 := tx.bounds()
				for _, o := range pg.Shapes {
					ln, ok := o.(*Line)
					if !ok {
						continue
					}
					for k := 0; k <= 50; k++ {
						f := float64(k) / 50
						x := ln.From.X + f*(ln.To.X-ln.From.X)
						y := ln.From.Y + f*(ln.To.Y-ln.From.Y)
						if x > x0-0.3 && x < x1+0.3 && y > y0-0.3 && y < y1+0.3 {
							t.Errorf("%d/%d: finish mark %q at (%.1f, %.1f) touches a line at (%.1f, %.1f)", s.Slots, s.Poles, tx.S, tx.X, tx.Y, x, y)
							break
						}
					}
				}
			}
		}
		if want := max(3, s.Phases); marks != want {
			t.Errorf("%d/%d: %d finish marks at the star point; want %d", s.Slots, s.Poles, marks, want)
		}
	}
}
