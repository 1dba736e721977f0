package plan

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"coilwright/winding"
	"coilwright/winding/job"
)

type vec [3]float64

func (a vec) add(b vec) vec     { return vec{a[0] + b[0], a[1] + b[1], a[2] + b[2]} }
func (a vec) sub(b vec) vec     { return vec{a[0] - b[0], a[1] - b[1], a[2] - b[2]} }
func (a vec) mul(k float64) vec { return vec{k * a[0], k * a[1], k * a[2]} }
func (a vec) dot(b vec) float64 { return a[0]*b[0] + a[1]*b[1] + a[2]*b[2] }
func (a vec) cross(b vec) vec {
	return vec{a[1]*b[2] - a[2]*b[1], a[2]*b[0] - a[0]*b[2], a[0]*b[1] - a[1]*b[0]}
}
func (a vec) norm() float64      { return math.Sqrt(a.dot(a)) }
func radial(theta float64) vec   { return vec{math.Cos(theta), math.Sin(theta), 0} }
func at(r, theta, z float64) vec { return radial(theta).mul(r).add(vec{0, 0, z}) }

func reverse(loop []vec) []vec {
	out := make([]vec, len(loop))
	for i, p := range loop {
		out[len(loop)-1-i] = p
	}
	return out
}

// rightHandPole derives the pole of a tooth face from first principles, apart
// from the code under test. The stator: axis z, the lead end towards +z;
// teeth counter-clockwise seen from the lead end, so tooth k stands at angle
// 2π(k−1)/Q and its slots at ±π/Q. The coil: a rectangle whose sides lie in
// those two slots. Its sense is made to match the layout's direction as a
// viewer in the air gap sees it (the signed area of the loop projected on the
// viewer's image plane: right = forward × up). Current flows round the loop in
// that sense (DC entering at the start terminal, the coil's sense being taken
// along the path from it). The field at a point in the air gap just in front
// of the face is summed by the Biot–Savart law (B ∝ Σ I dl × r̂ / r²); a
// compass's north end points along B, so B pointing into the face makes it a
// south pole (flux enters a south pole).
func rightHandPole(q, tooth int, d winding.Direction, rotor Rotor) string {
	const rFace, depth, half = 30.0, 8.0, 15.0 // mm: face radius, coil sides behind the face, half the stack
	theta := 2 * math.Pi * float64(tooth-1) / float64(q)
	half1 := math.Pi / float64(q)
	outward := radial(theta)
	// The viewer stands in the air gap looking at the face: from the bore
	// outward for an inner rotor, from outside inward for an outer rotor.
	forward, rSide, gap := outward, rFace+depth, rFace-1
	if rotor == OuterRotor {
		forward, rSide, gap = outward.mul(-1), rFace-depth, rFace+1
	}
	up := vec{0, 0, 1}
	right := forward.cross(up)
	loop := []vec{
		at(rSide, theta-half1, half), at(rSide, theta-half1, -half),
		at(rSide, theta+half1, -half), at(rSide, theta+half1, half),
	}
	area := 0.0 // shoelace in (right, up) image coordinates; > 0 counter-clockwise
	for i := range loop {
		a, b := loop[i], loop[(i+1)%len(loop)]
		area += a.dot(right)*b.dot(up) - b.dot(right)*a.dot(up)
	}
	if (area < 0) != (d == winding.CW) {
		loop = reverse(loop)
	}
	point := at(gap, theta, 0)
	var bField vec
	const n = 200 // pieces per side
	for i := range loop {
		a, b := loop[i], loop[(i+1)%len(loop)]
		dl := b.sub(a).mul(1.0 / n)
		for k := 0; k < n; k++ {
			mid := a.add(dl.mul(float64(k) + 0.5))
			r := point.sub(mid)
			bField = bField.add(dl.cross(r).mul(1 / math.Pow(r.norm(), 3)))
		}
	}
	intoFace := forward // from the air gap towards the tooth
	if bField.dot(intoFace) > 0 {
		return "S"
	}
	return "N"
}

// TestPolesRightHandRule checks the pole of every wound tooth of several
// layouts against the Biot–Savart derivation above, for both rotor types.
func TestPolesRightHandRule(t *testing.T) {
	specs := []winding.Spec{
		{Slots: 12, Poles: 10, Phases: 3, Layers: 2, Paths: 1},
		{Slots: 12, Poles: 10, Phases: 3, Layers: 1, Paths: 1},
		{Slots: 24, Poles: 28, Phases: 3, Layers: 2, Paths: 2},
		{Slots: 24, Poles: 20, Phases: 3, Layers: 1, Paths: 2},
		{Slots: 9, Poles: 8, Phases: 3, Layers: 2, Paths: 1},
		{Slots: 20, Poles: 18, Phases: 5, Layers: 2, Paths: 1},
		{Slots: 20, Poles: 22, Phases: 5, Layers: 1, Paths: 2},
	}
	for _, s := range specs {
		l, err := winding.Design(s)
		if err != nil {
			t.Fatalf("Design(%+v): %v", s, err)
		}
		poles := Poles(l)
		if len(poles) != len(l.Coils) {
			t.Errorf("%d/%d layers %d: %d poles; want one per wound tooth, %d", s.Slots, s.Poles, s.Layers, len(poles), len(l.Coils))
		}
		for _, tp := range poles {
			c, ok := l.CoilOn(tp.Tooth)
			if !ok || l.PhaseNames[c.Phase] != tp.Phase || c.Path != tp.Path {
				t.Errorf("%d/%d: pole entry %+v does not match the coil on its tooth (%+v)", s.Slots, s.Poles, tp, c)
				continue
			}
			for _, r := range []Rotor{InnerRotor, OuterRotor} {
				if want := rightHandPole(s.Slots, tp.Tooth, c.Direction, r); string(tp.Pole) != want {
					t.Errorf("%d/%d layers %d %s rotor: tooth %d (%s %s) pole %s; want %s (Biot–Savart)",
						s.Slots, s.Poles, s.Layers, r, tp.Tooth, tp.Phase, c.Direction, tp.Pole, want)
				}
			}
		}
	}
}

// TestPlanPolarity checks the poles of the demo and of the demo with two
// parallel paths through Build: every wound tooth listed once with its coil
// step, a polarity step after each phase's last coil, one before the star
// point, and the test plan's entry.
func TestPlanPolarity(t *testing.T) {
	for _, paths := range []int{1, 2} {
		j := job.Demo()
		j.Winding.Paths = paths
		p := mustPlan(t, j)
		name := fmt.Sprintf("demo, %d path(s)", paths)
		seen := map[int]bool{}
		for _, tp := range p.Polarity {
			if seen[tp.Tooth] {
				t.Errorf("%s: tooth %d listed twice", name, tp.Tooth)
			}
			seen[tp.Tooth] = true
			st := p.Steps[tp.Step-1]
			if st.Kind != StepCoil || st.Coil.Tooth != tp.Tooth || st.Coil.Order != tp.Coil {
				t.Errorf("%s: tooth %d names step %d (%s); want its coil step", name, tp.Tooth, tp.Step, st.Title)
			}
			if want := rightHandPole(24, tp.Tooth, map[string]winding.Direction{"cw": winding.CW, "ccw": winding.CCW}[st.Coil.Direction], p.Rotor); string(tp.Pole) != want {
				t.Errorf("%s: tooth %d pole %s; want %s", name, tp.Tooth, tp.Pole, want)
			}
		}
		if len(seen) != 24 {
			t.Errorf("%s: %d teeth listed; want 24", name, len(seen))
		}
		// Each phase's polarity step follows its last coil and comes before
		// the first coil of a later phase.
		lastCoil := map[string]int{}
		for _, s := range p.Steps {
			if s.Kind == StepCoil {
				lastCoil[s.Coil.Phase] = s.Index
			}
		}
		var phaseSteps, whole []Step
		for _, s := range p.Steps {
			if s.Kind == StepTest && s.Test == TestPolarity {
				if len(s.Phases) == 1 {
					phaseSteps = append(phaseSteps, s)
				} else {
					whole = append(whole, s)
				}
				if len(s.Reminders) == 0 || !strings.Contains(s.Reminders[0], "current-limited") {
					t.Errorf("%s: polarity step %d without its caution", name, s.Index)
				}
			}
		}
		if len(phaseSteps) != 3 {
			t.Fatalf("%s: %d per-phase polarity steps; want 3", name, len(phaseSteps))
		}
		for _, s := range phaseSteps {
			ph := s.Phases[0]
			if s.Index != lastCoil[ph]+1 {
				t.Errorf("%s: polarity step of %s at %d; want right after its last coil (step %d)", name, ph, s.Index, lastCoil[ph])
			}
			if !strings.Contains(s.Detail, PoleString(p.PolesOf(ph))) {
				t.Errorf("%s: polarity step of %s does not list its poles: %q", name, ph, s.Detail)
			}
		}
		star := index(p, func(s Step) bool { return s.Kind == StepJoin && strings.HasPrefix(s.Title, "Star point") })
		if len(whole) != 1 || whole[0].Index > star || len(whole[0].Phases) != 3 {
			t.Errorf("%s: whole-stator polarity steps %v; want one with every phase before the star point (step %d)", name, whole, star)
		}
		pt := testNamed(p, TestPolarity)
		if pt.Name == "" || !strings.Contains(pt.Source, "right-hand rule") || !strings.Contains(pt.Source, "common practice") || pt.Caution == "" {
			t.Errorf("%s: polarity test %+v; want it in the test plan with its source and caution", name, pt)
		}
		// A fifth of the 6.5 A rated current; heat I²R of one phase.
		if want := 1.3; math.Abs(pt.Current-want) > 1e-9 {
			t.Errorf("%s: polarity current %g A; want %g A", name, pt.Current, want)
		}
		if want := 1.3 * 1.3 * p.PhaseResistanceAmbient; math.Abs(pt.HeatW-want) > 0.005*want {
			t.Errorf("%s: polarity heat %g W; want I²R = %g W", name, pt.HeatW, want)
		}
	}
}

func TestPoleString(t *testing.T) {
	tps := []ToothPole{{Tooth: 1, Pole: South}, {Tooth: 2, Pole: North}, {Tooth: 17, Pole: South}}
	if got, want := PoleString(tps), "1S 2N 17S"; got != want {
		t.Errorf("PoleString = %q; want %q", got, want)
	}
	if North.Opposite() != South || South.Opposite() != North {
		t.Error("Opposite does not swap N and S")
	}
}
