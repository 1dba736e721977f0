package plan

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"coilwright/winding"
)

// Pole is the magnetic pole a wound tooth face shows while DC flows through
// its phase from the start terminal (X1) to the finish terminal (X2).
type Pole string

const (
	North Pole = "N" // a compass's south end points at the face
	South Pole = "S" // a compass's north end points at the face
)

// PoleOf is the pole of the face of a tooth whose coil is wound in sense d
// (seen from the air gap, following the path from its start terminal) when
// current enters the path at its start terminal. Right-hand rule (Ampère's
// law for a current loop): current going clockwise as seen by a viewer makes
// the loop's field point away from the viewer, into the tooth, so the flux
// enters the face: a south pole. Counter-clockwise makes a north pole.
func PoleOf(d winding.Direction) Pole {
	if d == winding.CCW {
		return North
	}
	return South
}

// Opposite is the other pole.
func (p Pole) Opposite() Pole {
	if p == North {
		return South
	}
	return North
}

// Value is the pole as a reading is stored in the progress record: +1 for
// north, -1 for south (0 stands for "unsure", no pole read).
func (p Pole) Value() float64 {
	switch p {
	case North:
		return 1
	case South:
		return -1
	}
	return 0
}

// PoleFromValue is the pole a stored reading stands for; false for 0
// (unsure) or any other value.
func PoleFromValue(v float64) (Pole, bool) {
	switch v {
	case 1:
		return North, true
	case -1:
		return South, true
	}
	return "", false
}

// PoleKey is the key of the pole read at a tooth, in the progress record and
// the polarity test's readings: "tooth_7".
func PoleKey(tooth int) string { return "tooth_" + itoa(tooth) }

// ToothPole is the pole one wound tooth shows with DC into its phase at X1
// (every parallel path of the phase fed at once).
type ToothPole struct {
	Phase string `json:"phase"`
	Tooth int    `json:"tooth"`
	Pole  Pole   `json:"pole"`
	Path  int    `json:"path"`
	Coil  int    `json:"coil"` // the coil's order: N of "coil N of M"
	Step  int    `json:"step"` // index of the coil's step in Plan.Steps
}

// Poles lists the expected pole of every wound tooth of a layout, phase by
// phase in phase order and, within a phase, in tooth order (the order in
// which a person walks round the stator with a compass). Coil and Step are
// left zero: Build fills them from the plan's coil steps.
func Poles(l *winding.Layout) []ToothPole {
	if l == nil {
		return nil
	}
	out := make([]ToothPole, 0, len(l.Coils))
	for ph, name := range l.PhaseNames {
		for _, c := range l.Coils { // in tooth order
			if c.Phase == ph {
				out = append(out, ToothPole{Phase: name, Tooth: c.Tooth, Pole: PoleOf(c.Direction), Path: c.Path})
			}
		}
	}
	return out
}

// PolesOf returns the expected poles of one phase, in tooth order; nil for a
// phase the plan does not have.
func (p *Plan) PolesOf(phase string) []ToothPole {
	var out []ToothPole
	for _, tp := range p.Polarity {
		if tp.Phase == phase {
			out = append(out, tp)
		}
	}
	return out
}

// PoleString writes expected poles the way a person reads them off the
// stator: tooth number then pole, "1S 2N 7N 8S".
func PoleString(tps []ToothPole) string {
	parts := make([]string, len(tps))
	for i, tp := range tps {
		parts[i] = itoa(tp.Tooth) + string(tp.Pole)
	}
	return strings.Join(parts, " ")
}

// Polarity test current (common practice): enough for a compass to swing
// firmly at the tooth face, little enough to leave the winding cool. A fifth of
// the rated phase current, and no more than a bench supply's few amperes.
const (
	PolarityCurrentFraction = 0.2
	PolarityCurrentMaxA     = 5.0
)

// PolarityCurrent is the DC to drive through one phase for the polarity test,
// and the heat it makes in that phase (I²·R at the phase resistance between its
// terminals, ambient temperature) and the supply voltage it needs (I·R).
func PolarityCurrent(p *Plan) (amps, watts, volts float64) {
	amps = math.Min(PolarityCurrentFraction*p.PhaseCurrentA, PolarityCurrentMaxA)
	amps = math.Round(amps*10) / 10
	if amps <= 0 {
		amps = 0.1
	}
	r := p.PhaseResistanceAmbient
	return amps, amps * amps * r, amps * r
}

// PolarityCaution goes with every polarity step, the polarity test and a
// check of polarity readings (common practice).
const PolarityCaution = "Use a current-limited DC supply (or a battery with a series resistor), set the limit before connecting. " +
	"Switch the supply off before breaking the circuit: the winding's inductance kicks back a high voltage when the current is interrupted, " +
	"which can bite and can damage a meter connected across it. Steel tools near the energised teeth get magnetised; keep the compass " +
	"away from steel and check it points north before each phase (a strong field can reverse a small compass)."

// polarityStep adds the polarity test of one phase (phase >= 0) or of every
// phase in turn (phase < 0).
func (b *builder) polarityStep(phase int) {
	l := b.p.Layout
	names := l.PhaseNames
	if phase >= 0 {
		names = names[phase : phase+1]
	}
	amps, _, _ := PolarityCurrent(b.p)
	var what strings.Builder
	for _, n := range names {
		fmt.Fprintf(&what, " Phase %s, DC into %s1 and out of %s2: %s.", n, n, n, PoleString(phasePoles(l, n)))
	}
	feed := "the start lead"
	if l.Spec.Paths > 1 {
		feed = "the start leads of all its paths (twisted together if not yet joined)"
	}
	title := "Test: polarity of every phase (before the " + b.jointWord() + ")"
	detail := "With about " + ftoa(amps) + " A DC from a current-limited supply fed into " + feed +
		" and out of the finish, hold a compass at each wound tooth face: its north end points at a south (S) face and away from a north (N) face."
	if phase >= 0 {
		title = "Test: polarity of phase " + names[0] + ", tooth by tooth"
		detail = "Before the next phase is wound over its slots, while a coil is still easy to reach: scrape the enamel off the ends of the leads for the clips. " + detail
	}
	b.add(Step{Kind: StepTest, Test: TestPolarity, Title: title, Phases: names,
		Detail: detail + what.String(), Reminders: []string{PolarityCaution}})
}

// jointWord names the joints that close the winding: the star point or the
// delta corners.
func (b *builder) jointWord() string {
	if b.p.Connection == winding.Delta {
		return "delta corners"
	}
	return "star point"
}

// phasePoles are the expected poles of one phase of a layout, tooth order.
func phasePoles(l *winding.Layout, phase string) []ToothPole {
	var out []ToothPole
	for _, tp := range Poles(l) {
		if tp.Phase == phase {
			out = append(out, tp)
		}
	}
	return out
}

// polarity fills Plan.Polarity from the layout and ties each tooth to its
// coil step.
func (b *builder) polarity() error {
	p := b.p
	p.Polarity = Poles(p.Layout)
	at := make(map[int]int, len(p.Polarity)) // tooth -> index in Polarity
	for i, tp := range p.Polarity {
		at[tp.Tooth] = i
	}
	for _, s := range p.Steps {
		if s.Kind == StepCoil && s.Coil != nil {
			if i, ok := at[s.Coil.Tooth]; ok {
				p.Polarity[i].Coil = s.Coil.Order
				p.Polarity[i].Step = s.Index
			}
		}
	}
	return nil
}

// polarityTest is the test plan's entry for the polarity test.
func (b *builder) polarityTest() Test {
	p := b.p
	amps, watts, volts := PolarityCurrent(p)
	paths := ""
	if p.Layout.Spec.Paths > 1 {
		paths = " (all its parallel paths at once)"
	}
	return Test{Name: TestPolarity, Title: "Polarity of every tooth (DC and compass)",
		What: fmt.Sprintf("Drive %g A DC through one phase at a time%s from its start terminal to its finish terminal and hold a compass "+
			"(or a Hall probe, magnetic viewing film, a phone's magnetometer) at each wound tooth face: each shows the pole of the plan.",
			amps, paths),
		Unit: UnitPole, Compare: Matches, Current: amps, HeatW: round3(watts), Readings: poleReadings(p.Polarity),
		Source: "common practice (the DC polarity test of rewinders); poles by the right-hand rule: a coil wound clockwise seen from the air gap, current entering at its start, makes its tooth face a south pole (a compass's north end points at it), counter-clockwise a north pole",
		Note: fmt.Sprintf("%g A is %s of the rated phase current of %s (at most %g A); it needs about %s across the phase and makes %s of heat in it (I²R at %s), "+
			"so the winding stays cool; a reversed coil shows the opposite pole of the plan, swapped start and finish leads reverse every tooth of the phase (or of the path)",
			amps, fractionWords(amps, p.PhaseCurrentA), strconv.FormatFloat(p.PhaseCurrentA, 'g', 3, 64)+" A", PolarityCurrentMaxA, formatVolts(volts), FormatWatts(watts), FormatValue(p.PhaseResistanceAmbient, UnitOhm)),
		Caution: PolarityCaution}
}

// fractionWords says what share of the rated current the test current is,
// as rounded to 0.1 A: "a fifth" when it is within 5 % of one, else "about
// a fifth" (or the bench supply's limit when that set it).
func fractionWords(amps, rated float64) string {
	switch {
	case rated <= 0:
		return "a share"
	case PolarityCurrentFraction*rated > PolarityCurrentMaxA:
		return "the bench supply's limit, less than a fifth"
	case math.Abs(amps/(PolarityCurrentFraction*rated)-1) <= 0.05:
		return "a fifth"
	}
	return "about a fifth"
}

func formatVolts(v float64) string {
	if v < 1 {
		return fmt.Sprintf("%.0f mV", v*1000)
	}
	return fmt.Sprintf("%.2g V", v)
}

// FormatWatts writes a small power, such as the heat a test current makes
// in a phase, to two figures, in mW below 1 W: the one way the plan text and
// the bench guide say it.
func FormatWatts(w float64) string {
	if w < 1 {
		return fmt.Sprintf("%.0f mW", w*1000)
	}
	return fmt.Sprintf("%.2g W", w)
}

// poleReadings is the reading schema of the polarity test: the pole seen at
// every wound tooth, in the order of Plan.Polarity, under PoleKey, with the
// pole of the plan as its expected value (Pole.Value: +1 N, -1 S; no
// window: a pole is right or it is not).
func poleReadings(tps []ToothPole) []Reading {
	out := make([]Reading, len(tps))
	for i, tp := range tps {
		v := tp.Pole.Value()
		out[i] = Reading{Key: PoleKey(tp.Tooth), Label: tp.Phase + " tooth " + itoa(tp.Tooth), Unit: UnitPole,
			Expected: &Expected{Value: v}}
	}
	return out
}
