package printout

import (
	"fmt"
	"testing"
	"time"

	"coilwright/winding"
	"coilwright/winding/plan"
)

// fixturePlan builds a plan by hand from a layout, with invented wire and
// lengths (test data only, not a design).
func fixturePlan(t testing.TB, s winding.Spec, conn winding.Connection) *plan.Plan {
	t.Helper()
	l, err := winding.Design(s)
	if err != nil {
		t.Fatalf("winding.Design(%v) = %v", s, err)
	}
	turns := 36
	meanTurn := 0.094 // m
	p := &plan.Plan{
		Name: fmt.Sprintf("Test stator %d/%d", s.Slots, s.Poles), Revision: "B",
		Date:   time.Date(2025, 3, 14, 0, 0, 0, 0, time.UTC),
		Layout: l, Connection: conn, Rotor: plan.InnerRotor, TurnsPerCoil: turns,
		Wire:             plan.Wire{BareDiameterMM: 0.8, OverallDiameterMM: 0.855, StrandsInHand: 1, CopperAreaMM2: 0.503, Grade: 1, DiameterTolMM: 0.008},
		MeanTurnLengthMM: meanTurn * 1000,
		Slot:             plan.Slot{AreaMM2: 60, UsableAreaMM2: 52, MaxTurns: 40, PracticalFill: 0.4},
		SlotFill:         0.35,
		AmbientC:         20,
	}
	names := l.PhaseNames
	order := 0
	var steps []plan.Step
	add := func(st plan.Step) {
		st.Index = len(steps) + 1
		steps = append(steps, st)
	}
	add(plan.Step{Kind: plan.StepPrepare, Title: "Deburr and clean the stator", Detail: "Break every sharp edge at the slot openings."})
	add(plan.Step{Kind: plan.StepPrepare, Title: "Fit slot liners", Detail: fmt.Sprintf("%d liners, one per slot", s.Slots)})
	for _, ch := range l.Chains {
		pp := plan.PathPlan{Phase: names[ch.Phase], Path: ch.Path, Coils: len(ch.Teeth)}
		for i, tooth := range ch.Teeth {
			c, _ := l.CoilOn(tooth)
			order++
			wl := float64(turns) * meanTurn
			p.Coils = append(p.Coils, plan.CoilPlan{Tooth: tooth, Phase: names[c.Phase], Direction: c.Direction, Path: c.Path, Position: c.Position, Turns: turns, WireLengthM: wl, Order: order})
			pp.WireLengthM += wl
			before, after := winding.SlotsOf(tooth, s.Slots)
			down, up := plan.CoilSlots(plan.InnerRotor, c.Direction, tooth, s.Slots)
			add(plan.Step{Kind: plan.StepCoil, Title: fmt.Sprintf("Wind tooth %d", tooth), Coil: &plan.CoilStep{
				Order: order, Of: len(l.Coils), Tooth: tooth, Phase: names[c.Phase], Path: c.Path, Position: c.Position,
				Direction: c.Direction.String(), Turns: turns, WireLengthM: wl, SlotBefore: before, SlotAfter: after, DownSlot: down, UpSlot: up}})
			if i < len(ch.Jumpers) {
				j := ch.Jumpers[i]
				pp.WireLengthM += float64(j.Span) * 0.012
				add(plan.Step{Kind: plan.StepJumper, Title: fmt.Sprintf("Jumper from tooth %d to tooth %d", j.FromTooth, j.ToTooth), Jumper: &plan.JumperStep{Jumper: j}})
			}
		}
		pp.CutLengthM = pp.WireLengthM + 0.6
		pp.Ohm20C = pp.WireLengthM * 0.017241 / 0.503
		p.Paths = append(p.Paths, pp)
		add(plan.Step{Kind: plan.StepTerminal, Title: fmt.Sprintf("Sleeve and mark leads %s and %s", ch.Start, ch.Finish)})
	}
	add(plan.Step{Kind: plan.StepJoin, Title: "Make the star point"})
	p.Tests = []plan.Test{
		{Name: "phase-resistance", What: "Resistance of each phase at ambient", Limit: 2, Unit: "%", Compare: "band", Source: "EASA AR100-2020"},
		{Name: "insulation-resistance", What: "Insulation resistance, winding to core, 1 min", Limit: 5, Unit: "MΩ", Compare: "min", Voltage: 500, Source: "IEEE 43-2013", Caution: "test voltage: keep clear"},
		{Name: "high-voltage", What: "Withstand test, all phases to core, 1 min", Limit: 1, Unit: "mA", Compare: "max", Voltage: 1000, Source: "IEC 60034-1 cl. 9.2", Caution: "lethal voltage"},
	}
	for _, tt := range p.Tests {
		add(plan.Step{Kind: plan.StepTest, Title: tt.What, Test: tt.Name})
	}
	p.Steps = steps
	for _, pp := range p.Paths {
		p.CopperLengthM += pp.CutLengthM
	}
	p.CopperMassKg = p.CopperLengthM * 0.503e-6 * 8890
	p.BuyLengthM = p.CopperLengthM * 1.1
	p.BuyMassKg = p.CopperMassKg * 1.1
	p.PhaseResistance20C = p.Paths[0].Ohm20C / float64(s.Normalize().Paths)
	p.PhaseResistanceAmbient = p.PhaseResistance20C
	p.Materials = []plan.Material{
		{Item: "slot liner", Count: s.Slots, SizeText: "0.25 mm × 22 mm × 34 mm", Note: "NMN or aramid paper"},
		{Item: "phase separator", Count: s.Slots, SizeText: "0.18 mm × 10 mm × 38 mm"},
		{Item: "sleeving", Count: 6, SizeText: "2 mm bore × 60 mm", LengthMM: 60},
	}
	p.Cautions = []string{
		"High voltage: insulation and withstand tests use lethal voltages. Only trained persons, with the stator isolated and a barrier round the test area.",
		"Strong magnets: the rotor pulls hard on steel and can trap fingers; keep it away from the stator until assembly.",
		"Rotating parts: keep clear of the shaft when spinning the rotor for back-EMF checks.",
		"These notes do not replace local codes and licensed practice; follow them where they differ.",
	}
	return p
}
