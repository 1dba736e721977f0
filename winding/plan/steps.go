package plan

import (
	"fmt"
	"strconv"
	"strings"

	"coilwright/winding"
)

func (b *builder) add(s Step) {
	s.Index = len(b.p.Steps) + 1
	b.p.Steps = append(b.p.Steps, s)
}

// steps lays out the bench work in order: preparation, each path coil by coil
// with its jumpers (and a separator before the second coil side enters a slot
// shared by two phases) and the polarity test of each phase once its last
// coil is in, the leads, the tests that need the phases apart, the joints of
// parallel paths, the polarity test of the whole stator, the star point or
// delta corners, and the tests of the finished winding.
func (b *builder) steps() error {
	p, j := b.p, b.j
	l := p.Layout
	q := l.Spec.Slots
	b.p.Steps = make([]Step, 0, 4+3*len(p.Coils)+7*len(l.PhaseNames)+13)
	b.add(setupStep(p.Rotor, q))
	b.add(Step{Kind: StepPrepare, Title: "Deburr and clean the stator",
		Detail: "File off burrs on the slot edges and tooth tips, round sharp corners at both ends of the stack, blow out the filings and wipe the slots clean. A burr cuts enamel and liner.",
		Reminders: []string{"eye protection while filing and blowing out",
			"solvent cleaners: ventilation, no flames, gloves"}})
	b.add(Step{Kind: StepPrepare, Title: fmt.Sprintf("Fit %d slot liners", q),
		Detail: fmt.Sprintf("One liner per slot, %s; it covers the walls and bottom of the slot and folds under the tooth tips, standing out %g mm at each end of the stack.",
			linerSize(p, b.stackPlusCuffs(), j.Stator.LinerMM), linerCuff)})
	b.add(Step{Kind: StepPrepare, Title: "Check and measure out the wire",
		Detail: b.wireDetail()})

	sidesIn := make([]int, q+1) // coil sides already in each slot
	total := len(p.Coils)
	lead := j.Build.LeadLengthMM
	leadText := " (" + ftoa(lead) + " mm)"
	turnsText := itoa(p.TurnsPerCoil) + " turns"
	// One slice shared by every coil step; readers do not change it.
	coilReminders := []string{"count every turn; lay each turn beside the last, no crossings",
		"keep the wire tight but do not stretch it; never let it scrape the slot edge"}
	// One slice shared by every jumper step, like the coil reminders.
	jumperReminders := []string{"sleeve the jumper where it crosses other coils; tie it down at the lead end"}
	sepSize := separatorSize(p, b.stackPlusCuffs(), j.Stator.SeparatorMM)
	ci := 0
	for chi, ch := range l.Chains {
		name := l.PhaseNames[ch.Phase]
		for i, tooth := range ch.Teeth {
			c, _ := l.CoilOn(tooth)
			before, after := winding.SlotsOf(tooth, q)
			for _, s := range []int{before, after} {
				if sidesIn[s] == 1 && j.Stator.SeparatorMM > 0 {
					if pa, pb, differ := slotPhases(l, s); differ {
						b.add(Step{Kind: StepSeparator, Slot: s,
							Title: "Phase separator in slot " + itoa(s),
							Detail: "Slot " + itoa(s) + " holds phases " + l.PhaseNames[pa] + " and " + l.PhaseNames[pb] +
								". Lay a separator (" + sepSize + ") against the coil side already in it before winding tooth " + itoa(tooth) + "."})
					}
				}
			}
			sidesIn[before]++
			sidesIn[after]++
			cp := p.Coils[ci]
			ci++
			cs := &CoilStep{Order: cp.Order, Of: total, Tooth: tooth, Phase: name, Path: c.Path, Position: c.Position,
				Direction: c.Direction.String(), Turns: p.TurnsPerCoil, WireLengthM: cp.WireLengthM,
				SlotBefore: before, SlotAfter: after}
			cs.DownSlot, cs.UpSlot = CoilSlots(p.Rotor, c.Direction, tooth, q)
			if i == 0 {
				cs.From = "start lead " + ch.Start + leadText
			} else {
				cs.From = "jumper from tooth " + itoa(ch.Teeth[i-1])
			}
			if i == len(ch.Teeth)-1 {
				cs.To = "finish lead " + ch.Finish + leadText
			} else {
				cs.To = "jumper to tooth " + itoa(ch.Teeth[i+1])
			}
			cs.HowToWind = howToWind(p.Rotor, c.Direction, tooth, cs.DownSlot, cs.UpSlot, p.TurnsPerCoil, p.Wire.StrandsInHand)
			pathWord := ""
			if l.Spec.Paths > 1 {
				pathWord = " path " + itoa(c.Path)
			}
			b.add(Step{Kind: StepCoil, Coil: cs,
				Title: "Coil " + itoa(cp.Order) + " of " + itoa(total) + ": tooth " + itoa(tooth) + ", phase " + name + pathWord +
					", " + cs.Direction + ", " + turnsText,
				Detail:    "From " + cs.From + " to " + cs.To + ". " + cs.HowToWind,
				Reminders: coilReminders})
			if i < len(ch.Jumpers) {
				jp := b.jumpers[chi][i]
				sense := "the next coil is wound the same way round"
				if jp.ReversesSense {
					sense = "the next coil is wound the other way round"
				}
				b.add(Step{Kind: StepJumper, Jumper: &jp,
					Title: "Jumper: tooth " + itoa(jp.FromTooth) + " to tooth " + itoa(jp.ToTooth),
					Detail: "Carry the wire round the lead end without cutting it: it " + jp.Words() +
						", about " + strconv.FormatFloat(jp.LengthMM, 'f', 0, 64) + " mm with slack; " + sense + ".",
					Reminders: jumperReminders})
			}
		}
		if chi == len(l.Chains)-1 || l.Chains[chi+1].Phase != ch.Phase {
			b.polarityStep(ch.Phase) // the phase's last coil is in
		}
	}
	for _, name := range l.PhaseNames {
		for _, end := range []struct{ mark, word string }{{name + "1", "start"}, {name + "2", "finish"}} {
			what := fmt.Sprintf("the %s lead of phase %s", end.word, name)
			if l.Spec.Paths > 1 {
				what = fmt.Sprintf("the %d %s leads of phase %s (one per path)", l.Spec.Paths, end.word, name)
			}
			b.add(Step{Kind: StepTerminal,
				Title: fmt.Sprintf("Lead %s", end.mark),
				Detail: fmt.Sprintf("Trim %s to %g mm beyond the stator, slide on sleeving, strip the enamel from the last 10 mm (scrape or strip chemically; test that it is bare with the meter) and mark it %s.",
					what, lead, end.mark),
				Reminders: []string{"burning off enamel or tinning gives off fumes: ventilate or use extraction"}})
		}
	}
	b.add(Step{Kind: StepTest, Test: TestContinuity, Title: "Test: continuity of every path",
		Detail: "Zero the meter leads first: touch them together and null the meter (or note what it reads and take it off every reading). Then read each path from its start lead to its finish lead, one field per path."})
	b.add(Step{Kind: StepTest, Test: TestPhaseInsulation, Title: "Test: insulation between phases (before joining)",
		Reminders: []string{cautionIR}})
	if l.Spec.Paths > 1 {
		for _, name := range l.PhaseNames {
			b.add(Step{Kind: StepJoin, Title: fmt.Sprintf("Join the paths of phase %s", name),
				Detail: fmt.Sprintf("Join the %d start leads of phase %s together as %s1, and its %d finish leads as %s2: twist, solder or crimp, sleeve.",
					l.Spec.Paths, name, name, l.Spec.Paths, name),
				Reminders: jointReminders()})
		}
	}
	b.polarityStep(-1)
	for _, jt := range winding.Joints(p.Connection, l.PhaseNames) {
		title := "Star point: " + strings.Join(jt.Marks, " + ")
		if jt.Line != "" {
			title = fmt.Sprintf("Delta corner: %s, line lead %s", strings.Join(jt.Marks, " + "), jt.Line)
		}
		b.add(Step{Kind: StepJoin, Title: title, Detail: capitalise(jt.What) + ".", Reminders: jointReminders()})
	}
	b.add(Step{Kind: StepTest, Test: TestResistance, Title: "Test: resistance of each phase"})
	b.add(Step{Kind: StepTest, Test: TestBalance, Title: "Test: resistance balance"})
	b.add(Step{Kind: StepTest, Test: TestInsulation, Title: "Test: insulation resistance to the core", Reminders: []string{cautionIR}})
	b.add(Step{Kind: StepTest, Test: TestHighVoltage, Title: "Test: high-voltage withstand", Reminders: []string{cautionHV}})
	b.add(Step{Kind: StepTest, Test: TestBackEMF, Title: "Test (optional): back-EMF balance with the rotor fitted", Reminders: []string{cautionSpin}})
	return nil
}

// setupStep is the first step: the numbering every later instruction counts
// from, put on the real stator.
func setupStep(r Rotor, q int) Step {
	face := "from the bore"
	if r == OuterRotor {
		face = "from outside the stator"
	}
	return Step{Kind: StepSetup, Title: "Set up: mark the lead end, tooth 1 and the way the numbers rise",
		Detail: "Choose the end of the stack the leads will come out of: the lead end. Mark it on the core. " +
			"Standing at the lead end, mark one tooth 1 and the next tooth counter-clockwise 2: the tooth numbers rise counter-clockwise seen from the lead end. " +
			"Count the slots: there must be " + itoa(q) + ". Slot 1 is the slot between tooth 1 and tooth 2; slot k lies between tooth k and tooth k+1. " +
			"Every coil and jumper after this is counted from these marks, and every coil is wound facing its tooth from the air gap (" + face + ") with the lead end up.",
		Reminders: []string{"use marks that survive cleaning: a paint pen on the yoke or a light scribe, never on a slot wall"}}
}

// howToWind says in plain words which way the wire goes round a tooth, seen
// from the air gap as the package conventions define it, with the slots from
// CoilSlots.
func howToWind(r Rotor, d winding.Direction, tooth, down, up, turns, strands int) string {
	view := "from the bore"
	if r == OuterRotor {
		view = "from outside the stator"
	}
	s := "Wind " + SenseWords(d) + " (" + view + "), facing tooth " + itoa(tooth) + " with the lead end up: " +
		SlotWords(down, up) + "; " + itoa(turns) + " turns"
	if strands > 1 {
		s += ", " + itoa(strands) + " strands in hand laid side by side"
	}
	return s + "; start and finish at the lead end."
}

func itoa(n int) string { return strconv.Itoa(n) }

func ftoa(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }

const linerCuff = 3.0 // mm the liner stands out at each end of the stack (common practice)

func linerSize(p *Plan, length, t float64) string {
	return fmt.Sprintf("%.1f mm × %.0f mm of %g mm insulation", p.Slot.LinedPerimeterMM, length, t)
}

func separatorSize(p *Plan, length, t float64) string {
	return fmt.Sprintf("%.1f mm × %.0f mm of %g mm film", p.Slot.DepthMM, length, t)
}

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}

func capitalise(s string) string {
	if s == "" {
		return s
	}
	return strings.ToUpper(s[:1]) + s[1:]
}

func (b *builder) wireDetail() string {
	p := b.p
	w := p.Wire
	var s strings.Builder
	fmt.Fprintf(&s, "Measure the bare copper with a micrometer after scraping the enamel off: %.3f mm ±%.3f mm. ", w.BareDiameterMM, w.DiameterTolMM)
	if w.StrandsInHand > 1 {
		fmt.Fprintf(&s, "Wind %d strands in hand from %d spools (or a measured bundle). ", w.StrandsInHand, w.StrandsInHand)
	}
	s.WriteString("Each path is one continuous wire; cut from the spool per strand:")
	for _, pp := range p.Paths {
		fmt.Fprintf(&s, " %s%s %.2f m;", pp.Phase, pathSuffix(len(p.Paths)/len(p.Layout.PhaseNames), pp.Path), pp.CutLengthM)
	}
	return strings.TrimSuffix(s.String(), ";") + "."
}

func pathSuffix(paths, path int) string {
	if paths <= 1 {
		return ""
	}
	return fmt.Sprintf(" path %d", path)
}

// jointReminders go with every joint made at the terminals: parallel paths,
// the star point, the delta corners (common practice).
// Each step gets its own slice: plans are plain data a reader may change.
func jointReminders() []string {
	return []string{"solder fumes: ventilate", "sleeve the joint and tie it down clear of the rotor"}
}
