package printout

import (
	"fmt"
	"math"
	"slices"
	"strings"
	"testing"

	"coilwright/winding"
)

// The design figures sheet carries the four figures with their captions,
// read back from the PDF.
func TestFiguresCaptions(t *testing.T) {
	p := demoPlan(t)
	texts := sheetTexts(t, p, Options{}, FiguresPage)
	for _, want := range []string{"Figure 1. Star of slots.", "Figure 2. Harmonic spectrum.", "Figure 3. Slot cross-section.", "Figure 4. Lead-end view.", "sub-harmonics",
		fmt.Sprintf("working order p = %d", p.Layout.Spec.PolePairs())} {
		if !slices.Contains(texts, want) {
			t.Errorf("design figures of the demo lack %q", want)
		}
	}
}

// Every coil's phasor is drawn and numbered by its tooth; the phase sums
// lie 360/m degrees apart (a balanced winding: the phase sequence of package winding).
func TestStarOfSlotsPhasors(t *testing.T) {
	for i, fx := range fixtures {
		t.Run(fx.name, func(t *testing.T) {
			pk := buildFixture(t, i)
			fig := pagesOf(pk, FiguresPage)[0]
			l, _ := winding.Design(fx.spec)
			// the star's labels: the words above its caption, left half
			numbers := map[string]bool{}
			capY := 0.0
			for _, s := range fig.Shapes {
				if tx, ok := s.(*Text); ok && tx.S == "Figure 1. Star of slots." {
					capY = tx.Y
				}
			}
			for _, s := range fig.Shapes {
				if tx, ok := s.(*Text); ok && tx.Y < capY && tx.X < fig.W/2 {
					for _, n := range strings.Split(tx.S, ",") {
						numbers[n] = true
					}
				}
			}
			if len(l.Coils) <= 48 {
				for _, c := range l.Coils {
					if !numbers[fmt.Sprint(c.Tooth)] {
						t.Errorf("star of slots lacks the phasor of tooth %d", c.Tooth)
					}
				}
			}
			m := len(l.PhaseNames)
			sums := make([]complex128, m)
			for _, c := range l.Coils {
				a := coilPhasor(c, fx.spec.Slots, fx.spec.Poles/2) * math.Pi / 180
				sums[c.Phase] += complex(math.Cos(a), math.Sin(a))
			}
			for k := 1; k < m; k++ {
				d := math.Mod((math.Atan2(imag(sums[k-1]), real(sums[k-1]))-math.Atan2(imag(sums[k]), real(sums[k])))*180/math.Pi+720, 360)
				d = math.Min(d, 360-d)
				if want := 360 / float64(m); math.Abs(d-want) > 0.01 && math.Abs(d-2*want) > 0.01 {
					t.Errorf("phase sums %d and %d lie %.2f° apart; want %.0f° (or twice)", k-1, k, d, want)
				}
			}
		})
	}
}

// The lead-end view draws one arc per jumper of the plan.
func TestLeadEndViewJumpers(t *testing.T) {
	p := demoPlan(t)
	pk, err := Build(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	fig := pagesOf(pk, FiguresPage)[0]
	jumpers := 0
	for _, st := range p.Steps {
		if st.Jumper != nil {
			jumpers++
		}
	}
	arcs := 0
	for _, s := range fig.Shapes {
		if a, ok := s.(*Arc); ok && a.Sweep != 0 && math.Abs(a.Sweep) < 360 && a.Pen.Width == 0.5 {
			arcs++
		}
	}
	if jumpers == 0 || arcs != jumpers {
		t.Errorf("lead-end view draws %d jumper arcs; want one per jumper, %d", arcs, jumpers)
	}
}

// The lead-end view of a delta winding with two parallel paths: tooth
// numbers keep apart (every 2nd where every tooth would crowd), and the
// branch of a second path runs round the outside to its phase's terminal,
// never across the stator (no point of a lead comes nearer the centre than
// the tooth it leaves).
func TestLeadEndViewBranchesRoundTheOutside(t *testing.T) {
	p := testJobPlan(t, "delta_paths_airgap.toml")
	pk, err := Build(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	fig := pagesOf(pk, FiguresPage)[0]
	if o := overlappingTexts(fig); len(o) > 0 {
		t.Errorf("figures sheet: %d words overlap, first %s", len(o), o[0])
	}
	var o Point
	found := false
	for _, s := range fig.Shapes {
		if a, ok := s.(*Arc); ok && a.Pen.Width == 0.5 && math.Abs(a.Sweep) < 360 {
			o, found = a.Centre, true
		}
	}
	if !found {
		t.Fatal("lead-end view has no jumper arc")
	}
	leads := 0
	for _, s := range fig.Shapes {
		pl, ok := s.(*Poly)
		if !ok || pl.Closed || len(pl.Points) < 3 || pl.Pen.Width != 0.5 {
			continue
		}
		leads++
		r0 := math.Hypot(pl.Points[0].X-o.X, pl.Points[0].Y-o.Y)
		near := r0
		for i := 1; i < len(pl.Points); i++ {
			a, z := pl.Points[i-1], pl.Points[i]
			for k := 0; k <= 40; k++ { // along each segment, not only its ends
				f := float64(k) / 40
				near = math.Min(near, math.Hypot(a.X+f*(z.X-a.X)-o.X, a.Y+f*(z.Y-a.Y)-o.Y))
			}
		}
		if near < r0-0.01 {
			t.Errorf("lead from (%.1f, %.1f) passes %.1f mm from the centre, inside the teeth at %.1f mm", pl.Points[0].X, pl.Points[0].Y, near, r0)
		}
	}
	if want := 2 * len(p.Layout.Chains); leads != want {
		t.Errorf("lead-end view draws %d leads; want %d (start and finish of every path)", leads, want)
	}
}
