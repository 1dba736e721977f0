package plan

import (
	"fmt"
	"strings"
	"text/tabwriter"

	"coilwright/winding"
)

// Text renders the plan as plain text for a terminal or a printer: the
// winding, turns, wire, fill, lengths, resistance, the cut list, the steps in
// short, the tests with their sources, warnings and cautions. It is
// deterministic (golden-tested).
func (p *Plan) Text() string {
	var b strings.Builder
	l := p.Layout
	head := p.Name
	var meta []string
	if p.Revision != "" {
		meta = append(meta, "rev "+p.Revision)
	}
	if !p.Date.IsZero() {
		meta = append(meta, p.Date.Format("2006-01-02"))
	}
	if len(meta) > 0 {
		head += "  (" + strings.Join(meta, ", ") + ")"
	}
	fmt.Fprintf(&b, "%s\n%s\n\n", head, strings.Repeat("=", len([]rune(head))))

	tw := tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	row := func(k, format string, a ...any) { fmt.Fprintf(tw, "%s\t%s\n", k, fmt.Sprintf(format, a...)) }
	layers := "double layer"
	if l.Spec.Layers == 1 {
		layers = "single layer"
	}
	row("Winding", "%d slots / %d poles, %d phases, %s, %d path%s per phase, %s; %s rotor",
		l.Spec.Slots, l.Spec.Poles, l.Spec.Phases, layers, l.Spec.Paths, plural(l.Spec.Paths, "", "s"), p.Connection, p.Rotor)
	row("", "winding factor %.3f, q = %s, %d coils per phase", l.WindingFactor, l.Q, l.CoilsPerPhase)
	row("Layout", "%s", l.Sequence())
	row("", "tooth 1 first; %s", winding.SenseLegend)
	turns := fmt.Sprintf("%d per coil", p.TurnsPerCoil)
	if p.TurnsSolved && p.EMF != nil {
		turns += ", solved for " + p.EMF.Target
	} else {
		turns += ", as given"
	}
	row("Turns", "%s", turns)
	if e := p.EMF; e != nil {
		row("EMF", "flux per pole %.4g Wb; %.4f V rms per rpm per phase", e.FluxPerPoleWb, e.VoltsPerRPMPhase)
		if e.RatedSpeedRPM > 0 {
			row("", "at %g rpm: phase %.2f V, line %.2f V rms (open circuit)", e.RatedSpeedRPM, e.PhaseRMSAtRated, e.LineRMSAtRated)
		}
		if e.CutInSpeedRPM > 0 {
			row("", "cut-in at %.1f rpm: line %.2f V rms, its peak %.2f V = bus %.2f V + diodes %.2f V (current flows above it)",
				e.CutInSpeedRPM, e.LineRMSAtCutIn, e.PeakLineAtCutIn, e.TargetV, e.PeakLineAtCutIn-e.TargetV)
			row("", "at %g rpm the peak line EMF less the diodes is %.2f V (target %g V)", e.TargetSpeedRPM, e.AtTargetV, e.TargetV)
		} else if p.TurnsSolved {
			row("", "at %g rpm the whole turns give %.2f V (target %g V)", e.TargetSpeedRPM, e.AtTargetV, e.TargetV)
		}
	}
	w := p.Wire
	enamel := fmt.Sprintf("IEC 60317 grade %d", w.Grade)
	if w.Grade == 0 {
		enamel = "measured"
	}
	size := fmt.Sprintf("%.3f mm", w.BareDiameterMM)
	if w.AWG != 0 {
		size = fmt.Sprintf("AWG %d = %.3f mm", w.AWG, w.BareDiameterMM)
	}
	strands := ""
	if w.StrandsInHand > 1 {
		strands = fmt.Sprintf("%d strands in hand of ", w.StrandsInHand)
	}
	row("Wire", "%s%s bare ±%.3f, %.3f mm overall (%s); %.3f mm² copper", strands, size, w.DiameterTolMM, w.OverallDiameterMM, enamel, w.CopperAreaMM2)
	s := p.Slot
	row("Slot", "%.1f mm², usable %.1f mm² (liner %.1f, separator %.1f mm²)", s.AreaMM2, s.UsableAreaMM2, s.LinerAreaMM2, s.SeparatorAreaMM2)
	row("Fill", "%.3f of the usable area; practical %.2f allows %d turns; round-wire ceiling %.2f", p.SlotFill, s.PracticalFill, s.MaxTurns, s.CeilingFill)
	row("Mean turn", "%.1f mm (coil build %.2f mm across the slot)", p.MeanTurnLengthMM, s.CoilBuildMM)
	if len(p.Coils) > 0 {
		row("Coil", "%.3f m of wire per strand", p.Coils[0].WireLengthM)
	}
	for i, pp := range p.Paths {
		k := ""
		if i == 0 {
			k = "Paths"
		}
		row(k, "%s%s: %d coils, %.2f m between terminals (jumpers %.2f m), %s at 20 °C with its two leads",
			pp.Phase, pathSuffix(l.Spec.Paths, pp.Path), pp.Coils, pp.WireLengthM, pp.JumperLengthM, FormatValue(pp.Ohm20C, UnitOhm))
	}
	if p.AmbientC == 20 {
		row("Resistance", "phase %s at 20 °C at the lead ends (IEC 60028)", FormatValue(p.PhaseResistance20C, UnitOhm))
	} else {
		row("Resistance", "phase %s at 20 °C, %s at %s, at the lead ends (IEC 60028)", FormatValue(p.PhaseResistance20C, UnitOhm), FormatValue(p.PhaseResistanceAmbient, UnitOhm), FormatValue(p.AmbientC, UnitCelsius))
	}
	if l.Spec.Paths > 1 {
		row("", "each path with its own start and finish lead; the paths joined at the lead ends, so in parallel")
	}
	row("Current", "%.2f A per phase, %.2f A/mm²", p.PhaseCurrentA, p.CurrentDensityAmm2)
	row("", "copper loss %.1f W at %g °C working (%s); %.1f W at %g °C", p.CopperLossW, p.CopperLossTemperatureC, p.CopperLossTemperatureBasis, p.CopperLossAmbientW, p.AmbientC)
	row("Copper", "%.1f m in the winding with leads (%.3f kg); buy %.1f m (%.3f kg)", p.CopperLengthM, p.CopperMassKg, p.BuyLengthM, p.BuyMassKg)
	tw.Flush()
	p.machineText(&b)

	b.WriteString("\nPolarity (DC into X1 of one phase at a time, all its paths at once; compass at each tooth face)\n")
	for _, n := range l.PhaseNames {
		fmt.Fprintf(&b, "  %s  %s\n", n, PoleString(p.PolesOf(n)))
	}

	b.WriteString("\nCut list\n")
	tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	for i, pp := range p.Paths {
		note := ""
		if i == 0 {
			note = "one continuous length per strand, with leads and allowances"
		}
		fmt.Fprintf(tw, "  wire %s%s\t%d × %.2f m\t%s\n", pp.Phase, pathSuffix(l.Spec.Paths, pp.Path), w.StrandsInHand, pp.CutLengthM, note)
	}
	for _, m := range p.Materials {
		fmt.Fprintf(tw, "  %s\t%d × %s\t%s\n", m.Item, m.Count, m.SizeText, m.Note)
	}
	tw.Flush()

	fmt.Fprintf(&b, "\nSteps (%d)\n", len(p.Steps))
	tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
	for _, st := range p.Steps {
		switch st.Kind {
		case StepJumper:
			if jp := st.Jumper; jp != nil {
				fmt.Fprintf(tw, "  %d\tjumper\ttooth %d to %d\t%s\n", st.Index, jp.FromTooth, jp.ToTooth, jp.Words())
			}
		case StepCoil:
			c := st.Coil
			fmt.Fprintf(tw, "  %d\tcoil\t%d/%d  tooth %d  %s%s  %s  %s  %d turns\t%s -> %s\n", st.Index, c.Order, c.Of, c.Tooth, c.Phase,
				pathSuffix(l.Spec.Paths, c.Path), c.Direction, SlotWords(c.DownSlot, c.UpSlot), c.Turns, c.From, c.To)
		default:
			fmt.Fprintf(tw, "  %d\t%s\t%s\t\n", st.Index, st.Kind, st.Title)
		}
	}
	tw.Flush()

	b.WriteString("\nTests\n")
	for _, t := range p.Tests {
		fmt.Fprintf(&b, "  %s: %s\n", t.Name, LimitText(t))
		fmt.Fprintf(&b, "    %s\n", t.What)
		if r := expectedText(t.Readings); r != "" {
			fmt.Fprintf(&b, "    Expect: %s\n", r)
		}
		if t.Resolution != "" {
			fmt.Fprintf(&b, "    Sees: %s\n", t.Resolution)
		}
		if t.Note != "" {
			fmt.Fprintf(&b, "    Note: %s\n", t.Note)
		}
		fmt.Fprintf(&b, "    Source: %s\n", t.Source)
		if t.Caution != "" {
			fmt.Fprintf(&b, "    CAUTION: %s\n", t.Caution)
		}
	}
	if len(p.Layout.Warnings) > 0 || len(p.Warnings) > 0 {
		b.WriteString("\nWarnings\n")
		for _, w := range p.Layout.Warnings {
			fmt.Fprintf(&b, "  - layout: %s\n", w.Message)
		}
		for _, w := range p.Warnings {
			fmt.Fprintf(&b, "  - %s\n", w)
		}
	}
	b.WriteString("\nCautions\n")
	for _, c := range p.Cautions {
		fmt.Fprintf(&b, "  - %s\n", c)
	}
	return b.String()
}

// expectedText lists what the meter should show for each reading that has an
// expected value: "U–V 278.4 mΩ (259.2 mΩ .. 298.1 mΩ)".
func expectedText(rs []Reading) string {
	var out []string
	for _, r := range rs {
		e := r.Expected
		if e == nil {
			continue
		}
		s := r.Label + " " + FormatValue(e.Value, r.Unit)
		if e.Low > 0 {
			s += " (" + FormatValue(e.Low, r.Unit) + " .. " + FormatValue(e.High, r.Unit) + ")"
		} else if e.High > 0 {
			s += " (at most " + FormatValue(e.High, r.Unit) + ")"
		}
		out = append(out, s)
	}
	return strings.Join(out, ", ")
}
