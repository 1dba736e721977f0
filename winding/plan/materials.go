package plan

import (
	"fmt"
	"strings"

	"coilwright/winding"
)

// stackPlusCuffs is the length of a liner or separator: the stack and a cuff
// at each end.
func (b *builder) stackPlusCuffs() float64 { return b.j.Stator.StackLengthMM + 2*linerCuff }

// materials lists the cut list besides copper.
func (b *builder) materials() error {
	p, j := b.p, b.j
	l := p.Layout
	q := l.Spec.Slots
	p.Materials = append(p.Materials, Material{Item: "slot liner", Count: q,
		SizeText: fmt.Sprintf("%.1f × %.0f mm, %g mm thick", p.Slot.LinedPerimeterMM, b.stackPlusCuffs(), j.Stator.LinerMM),
		LengthMM: b.stackPlusCuffs(), Note: fmt.Sprintf("stands out %g mm at each end of the stack", linerCuff)})
	if n := sharedSlots(l); n > 0 && b.sides == 2 && j.Stator.SeparatorMM > 0 {
		p.Materials = append(p.Materials, Material{Item: "phase separator", Count: n,
			SizeText: fmt.Sprintf("%.1f × %.0f mm, %g mm thick", p.Slot.DepthMM, b.stackPlusCuffs(), j.Stator.SeparatorMM),
			LengthMM: b.stackPlusCuffs(), Note: "one in every slot that holds two phases: slots " + winding.NumberList(sharedList(l))})
	}
	leads := 2 * len(l.PhaseNames) * l.Spec.Paths
	p.Materials = append(p.Materials, Material{Item: "lead sleeving", Count: leads,
		SizeText: fmt.Sprintf("%g mm long, to fit %d × %.2f mm wire", j.Build.LeadLengthMM, p.Wire.StrandsInHand, p.Wire.OverallDiameterMM),
		LengthMM: j.Build.LeadLengthMM})
	jumpers := 0
	for _, ch := range b.jumpers {
		jumpers += len(ch)
	}
	if jumpers > 0 {
		p.Materials = append(p.Materials, Material{Item: "jumper sleeving", Count: jumpers,
			SizeText: "as long as each jumper where it crosses other coils", Note: "optional where jumpers lie clear"})
	}
	var marks []string
	for _, n := range l.PhaseNames {
		marks = append(marks, n+"1", n+"2")
	}
	p.Materials = append(p.Materials, Material{Item: "terminal marker", Count: len(marks), SizeText: strings.Join(marks, " ")})
	joints, where := 1, "the star point"
	if p.Connection.String() == "delta" {
		joints, where = len(l.PhaseNames), fmt.Sprintf("the %d delta corners", len(l.PhaseNames))
	}
	if l.Spec.Paths > 1 {
		joints += 2 * len(l.PhaseNames)
		where += fmt.Sprintf(", and the %d joints of the parallel paths at the terminals", 2*len(l.PhaseNames))
	}
	p.Materials = append(p.Materials, Material{Item: "joint sleeve (heat-shrink) or crimp", Count: joints,
		SizeText: "to take the joined wires", Note: where})
	p.Materials = append(p.Materials, Material{Item: "lacing cord", Count: 1,
		SizeText: "to tie jumpers and leads at the lead end", Note: "common practice"})
	return nil
}

// sharedList lists the slots whose two coil sides belong to different phases.
func sharedList(l *winding.Layout) []int {
	var out []int
	for k := 1; k <= l.Spec.Slots; k++ {
		if _, _, differ := slotPhases(l, k); differ {
			out = append(out, k)
		}
	}
	return out
}
