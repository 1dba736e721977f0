package tui

import (
	"fmt"
	"testing"

	"coilwright/winding"
	"coilwright/winding/plan"
)

// handPlan builds a plan by hand from a layout, as the plan builder would in
// outline: preparation, then each path coil by coil with its jumpers, the
// phase separators, terminals, a test before the star point, the star point,
// and the resistance and insulation tests. The numbers are invented for the
// tests only.
func handPlan(tb testing.TB, slots, poles, layers int) *plan.Plan {
	tb.Helper()
	l, err := winding.Design(winding.Spec{Slots: slots, Poles: poles, Layers: layers})
	if err != nil {
		tb.Fatalf("winding.Design(%d/%d) = %v", slots, poles, err)
	}
	ambient, v500, v570 := 15.0, 500.0, 570.0
	p := &plan.Plan{
		Name:                   "test stator",
		Layout:                 l,
		Connection:             winding.Star,
		Rotor:                  plan.OuterRotor,
		TurnsPerCoil:           12,
		Wire:                   plan.Wire{BareDiameterMM: 0.8, OverallDiameterMM: 0.88, StrandsInHand: 1, DiameterTolMM: 0.008},
		PhaseResistance20C:     0.5,
		PhaseResistanceAmbient: 0.49,
		AmbientC:               15,
		Tests: []plan.Test{
			{Name: "phase_pairs", What: "insulation between phases before the star point, 500 V DC", Limit: 5, Unit: plan.UnitMegaohm, Compare: plan.AtLeast, Voltage: 500, Source: "IEEE 43-2013 (borrowed)",
				Readings: []plan.Reading{{Key: "u_v", Label: "U–V", Unit: plan.UnitMegaohm}, {Key: "u_w", Label: "U–W", Unit: plan.UnitMegaohm}, {Key: "v_w", Label: "V–W", Unit: plan.UnitMegaohm}}},
			{Name: plan.TestInsulation, What: "insulation resistance to core at 500 V DC after 1 min", Limit: 5, Unit: plan.UnitMegaohm, Compare: plan.AtLeast, Voltage: 500, Source: "IEEE 43-2013", Caution: "test voltage: keep clear, discharge after",
				Readings: []plan.Reading{{Key: plan.KeyIR1, Label: "IR 1 min", Unit: plan.UnitMegaohm}, {Key: plan.KeyVolts, Label: "test V", Unit: plan.UnitVolt, Preset: &v500},
					{Key: plan.KeyTemp, Label: "temp", Unit: plan.UnitCelsius, Preset: &ambient}, {Key: plan.KeyIR10, Label: "IR 10 min", Unit: plan.UnitMegaohm, Optional: true}}},
			{Name: plan.TestResistance, What: "resistance of each phase", Limit: 7, Unit: plan.UnitPercent, Compare: plan.InBand, Source: "IEC 60028",
				Readings: []plan.Reading{{Key: "uv", Label: "U–V", Unit: plan.UnitOhm}, {Key: "vw", Label: "V–W", Unit: plan.UnitOhm}, {Key: "wu", Label: "W–U", Unit: plan.UnitOhm},
					{Key: plan.KeyTemp, Label: "temp", Unit: plan.UnitCelsius, Preset: &ambient}}},
			{Name: plan.TestHighVoltage, What: "570 V AC for 1 min, winding to core", Limit: 60, Unit: plan.UnitSecond, Compare: plan.AtLeast, Voltage: 570, Source: "IEC 60034-1 clause 9.2",
				Readings: []plan.Reading{{Key: plan.KeyVolts, Label: "volts", Unit: plan.UnitVolt, Preset: &v570}, {Key: plan.KeySeconds, Label: "held", Unit: plan.UnitSecond}}},
		},
	}
	add := func(s plan.Step) {
		s.Index = len(p.Steps) + 1
		p.Steps = append(p.Steps, s)
	}
	add(plan.Step{Kind: plan.StepPrepare, Title: "deburr the slots and fit the slot liners", Reminders: []string{"liner ends stand 2 mm proud of the core"}})
	m := len(l.Coils)
	order := 0
	how := map[winding.Direction]string{
		winding.CW:  "clockwise, seen from the air gap (outside the stator, outer rotor)",
		winding.CCW: "counter-clockwise, seen from the air gap (outside the stator, outer rotor)",
	}
	for _, ch := range l.Chains {
		for i, t := range ch.Teeth {
			if i > 0 {
				j := ch.Jumpers[i-1]
				from, _ := l.CoilOn(j.FromTooth)
				to, _ := l.CoilOn(j.ToTooth)
				laid := plan.LayJumper(plan.OuterRotor, j, from.Direction, to.Direction, slots, 40, 20)
				add(plan.Step{Kind: plan.StepJumper, Title: fmt.Sprintf("carry the wire from tooth %d to tooth %d", j.FromTooth, j.ToTooth), Jumper: &laid})
			}
			order++
			c, _ := l.CoilOn(t)
			before, after := winding.SlotsOf(t, slots)
			down, up := plan.CoilSlots(plan.OuterRotor, c.Direction, t, slots)
			from := fmt.Sprintf("start lead %s (300 mm)", ch.Start)
			if i > 0 {
				from = fmt.Sprintf("jumper from tooth %d", ch.Teeth[i-1])
			}
			to := fmt.Sprintf("finish lead %s (300 mm)", ch.Finish)
			if i < len(ch.Teeth)-1 {
				to = fmt.Sprintf("jumper to tooth %d", ch.Teeth[i+1])
			}
			add(plan.Step{Kind: plan.StepCoil, Title: fmt.Sprintf("wind tooth %d", t), Coil: &plan.CoilStep{
				Order: order, Of: m, Tooth: t, Phase: l.PhaseNames[c.Phase], Path: c.Path, Position: c.Position,
				Direction: c.Direction.String(), HowToWind: how[c.Direction], Turns: p.TurnsPerCoil,
				WireLengthM: 1.5, From: from, To: to, SlotBefore: before, SlotAfter: after,
				DownSlot: down, UpSlot: up,
			}})
		}
	}
	for s := 1; s <= slots; s++ {
		a, _ := l.CoilOn(s)
		b, _ := l.CoilOn(s%slots + 1)
		if a.Phase != b.Phase {
			add(plan.Step{Kind: plan.StepSeparator, Title: fmt.Sprintf("phase separator in slot %d", s), Slot: s})
		}
	}
	add(plan.Step{Kind: plan.StepTerminal, Title: "strip, sleeve and mark the six leads"})
	add(plan.Step{Kind: plan.StepTest, Title: "insulation between phases", Test: "phase_pairs"})
	add(plan.Step{Kind: plan.StepJoin, Title: "make the star point U2+V2+W2"})
	add(plan.Step{Kind: plan.StepTest, Title: "resistance of each phase", Test: plan.TestResistance})
	add(plan.Step{Kind: plan.StepTest, Title: "insulation resistance to core", Test: plan.TestInsulation})
	add(plan.Step{Kind: plan.StepTest, Title: "high-voltage withstand", Test: plan.TestHighVoltage})
	return p
}
