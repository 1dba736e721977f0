package plan

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"coilwright/winding"
	"coilwright/winding/job"
)

// The vectors (vec, at) are those of polarity_test.go: z along the axis out
// of the lead end, angles counter-clockwise seen from the lead end.

// TestCoilSlotsGeometry checks the down and up slots of every coil and the
// slots, pitches, way and length of every jumper against a derivation from
// the positions of teeth and slots in space, independent of CoilSlots:
//
//   - tooth k's centre lies at (k−1)·360°/Q and slot k's at (k−½)·360°/Q,
//     counter-clockwise seen from the lead end (slot k between tooth k and k+1);
//   - the winder faces the tooth from the air gap with the lead end up: for an
//     outer rotor from outside, looking in (forward −r̂); for an inner rotor
//     from the bore, looking out (forward +r̂);
//   - the coil runs from the lead end down its down slot, across the far end,
//     up its up slot and back across the lead end. By the right-hand rule its
//     vector area ½·Σ pᵢ×pᵢ₊₁ points away from the viewer (along forward) when
//     the current circulates clockwise as the viewer sees it;
//   - a jumper runs from the up slot of one coil to the down slot of the next
//     along the arc at mid slot depth the shorter way; its way seen from the
//     lead end is the sign of the z component of p_leave × p_enter.
func TestCoilSlotsGeometry(t *testing.T) {
	inner := job.Demo()
	inner.Stator.Rotor = job.RotorInner
	single := mustJob(t, strings.Replace(handJob, "poles = 10", "poles = 10\nlayers = 1", 1))
	outer12 := mustJob(t, strings.Replace(handJob, `rotor = "inner"`, `rotor = "outer"`, 1))
	paths := mustJob(t, strings.Replace(handJob, "poles = 10", "poles = 10\npaths = 2", 1))
	ways := map[string]int{}
	for _, c := range []struct {
		name string
		j    *job.Job
	}{
		{"demo 24/28 outer", job.Demo()},
		{"demo 24/28 inner", inner},
		{"12/10 inner", mustJob(t, handJob)},
		{"12/10 outer", outer12},
		{"12/10 inner single layer", single},
		{"12/10 inner two paths", paths},
	} {
		p := mustPlan(t, c.j)
		q := p.Layout.Spec.Slots
		alpha := 2 * math.Pi / float64(q)
		toothAngle := func(k int) float64 { return float64(k-1) * alpha }
		slotAngle := func(s int) float64 { return (float64(s) - 0.5) * alpha }
		const r, h = 50.0, 20.0 // any radius and half stack do
		outer := c.j.Stator.Rotor == job.RotorOuter
		rj := c.j.Stator.DiameterMM/2 - c.j.Stator.Slot.DepthMM/2
		if !outer {
			rj = c.j.Stator.DiameterMM/2 + c.j.Stator.Slot.DepthMM/2
		}
		coils := map[int]*CoilStep{}
		for _, s := range p.Steps {
			if s.Kind != StepCoil {
				continue
			}
			cs := s.Coil
			coils[cs.Tooth] = cs
			th := toothAngle(cs.Tooth)
			// Both slots lie half a slot pitch either side of the tooth.
			for _, sl := range []int{cs.DownSlot, cs.UpSlot} {
				d := math.Remainder(slotAngle(sl)-th, 2*math.Pi)
				if math.Abs(math.Abs(d)-alpha/2) > 1e-9 {
					t.Errorf("%s: coil on tooth %d uses slot %d, not beside the tooth", c.name, cs.Tooth, sl)
				}
			}
			if cs.DownSlot == cs.UpSlot {
				t.Errorf("%s: coil on tooth %d goes down and up slot %d", c.name, cs.Tooth, cs.DownSlot)
			}
			dn, up := slotAngle(cs.DownSlot), slotAngle(cs.UpSlot)
			loop := []vec{at(r, dn, h), at(r, dn, -h), at(r, up, -h), at(r, up, h)}
			var area vec
			for i := range loop {
				area = area.add(loop[i].cross(loop[(i+1)%len(loop)]).mul(0.5))
			}
			forward := at(1, th, 0) // outward
			if outer {
				forward = vec{}.sub(forward)
			}
			seenCW := area.dot(forward) > 0
			if want := cs.Direction == "cw"; seenCW != want {
				t.Errorf("%s: coil on tooth %d (%s) down slot %d, up slot %d circulates clockwise=%v seen from the air gap; want %v",
					c.name, cs.Tooth, cs.Direction, cs.DownSlot, cs.UpSlot, seenCW, want)
			}
			if got, want := cs.HowToWind, SlotWords(cs.DownSlot, cs.UpSlot); !strings.Contains(got, want) {
				t.Errorf("%s: coil on tooth %d HowToWind = %q; want it to say %q", c.name, cs.Tooth, got, want)
			}
		}
		for _, s := range p.Steps {
			if s.Kind != StepJumper {
				continue
			}
			jp := s.Jumper
			from, to := coils[jp.FromTooth], coils[jp.ToTooth]
			if from == nil || to == nil {
				t.Fatalf("%s: jumper %d→%d joins a tooth without a coil step", c.name, jp.FromTooth, jp.ToTooth)
			}
			if jp.LeavesSlot != from.UpSlot || jp.EntersSlot != to.DownSlot {
				t.Errorf("%s: jumper %d→%d leaves slot %d, enters %d; want the up slot %d of tooth %d and the down slot %d of tooth %d",
					c.name, jp.FromTooth, jp.ToTooth, jp.LeavesSlot, jp.EntersSlot, from.UpSlot, from.Tooth, to.DownSlot, to.Tooth)
			}
			a, b := at(1, slotAngle(from.UpSlot), 0), at(1, slotAngle(to.DownSlot), 0)
			turn := math.Atan2(a.cross(b)[2], a.dot(b)) // counter-clockwise positive, in (−π, π]
			pitches := int(math.Round(math.Abs(turn) / alpha))
			way := WayCCW
			if turn < 0 && pitches != q-pitches {
				way = WayCW
			}
			length := rj*float64(pitches)*alpha + c.j.Build.JumperSlackMM
			if jp.SlotPitches != pitches || (pitches > 0 && jp.Way != way) || math.Abs(jp.LengthMM-length) > 1e-9 {
				t.Errorf("%s: jumper %d→%d = %d pitches %s, %.3f mm; want %d pitches %s, %.3f mm",
					c.name, jp.FromTooth, jp.ToTooth, jp.SlotPitches, jp.Way, jp.LengthMM, pitches, way, length)
			}
			if !strings.Contains(s.Detail, jp.Words()) {
				t.Errorf("%s: jumper step detail %q; want it to say %q", c.name, s.Detail, jp.Words())
			}
			ways[jp.Way]++
		}
	}
	t.Logf("jumper ways over all cases: %v", ways)
}

func TestSlotWords(t *testing.T) {
	cases := []struct {
		name string
		got  string
		want string
	}{
		{"coil", SlotWords(6, 5), "down slot 6, up slot 5"},
		{"cw sense", SenseWords(winding.CW), "CLOCKWISE seen from the air gap"},
		{"ccw sense", SenseWords(winding.CCW), "COUNTER-CLOCKWISE seen from the air gap"},
		{"jumper ccw", JumperStep{LeavesSlot: 2, EntersSlot: 6, SlotPitches: 4, Way: WayCCW}.Words(),
			"leaves slot 2 at the lead end, enters slot 6: 4 slot pitches, counter-clockwise seen from the lead end"},
		{"jumper cw", JumperStep{LeavesSlot: 1, EntersSlot: 12, SlotPitches: 1, Way: WayCW}.Words(),
			"leaves slot 1 at the lead end, enters slot 12: 1 slot pitch, clockwise seen from the lead end"},
		{"jumper same slot", JumperStep{LeavesSlot: 3, EntersSlot: 3}.Words(),
			"leaves slot 3 at the lead end, enters slot 3: straight back down the same slot"},
	}
	for _, c := range cases {
		if c.got != c.want {
			t.Errorf("%s = %q; want %q", c.name, c.got, c.want)
		}
	}
}

func ExampleCoilSlots() {
	for _, r := range []Rotor{OuterRotor, InnerRotor} {
		down, up := CoilSlots(r, winding.CW, 1, 24)
		fmt.Printf("%s rotor, tooth 1 %s: %s\n", r, SenseWords(winding.CW), SlotWords(down, up))
	}
	// Output:
	// outer rotor, tooth 1 CLOCKWISE seen from the air gap: down slot 1, up slot 24
	// inner rotor, tooth 1 CLOCKWISE seen from the air gap: down slot 24, up slot 1
}
