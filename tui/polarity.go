package tui

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/plan"
	"coilwright/winding/verify"
)

// The polarity step: DC through one phase (or each phase in turn) and a
// compass held at each wound tooth face. The guide walks the step's teeth in
// order, shows the tooth and the pole it must show, and takes what the
// compass showed with one key. Every key is recorded at once, as the whole
// step's readings so far under the test's reading keys (plan.PoleKey):
// +1 north, −1 south, 0 unsure (plan.Pole.Value); a tooth not yet read has
// no key (NaN here).

// polarityKeys are the keys of a polarity step.
type polarityKeys struct {
	North, South, Unsure, Reread, Done key.Binding
}

func newPolarityKeys() polarityKeys {
	return polarityKeys{
		North:  key.NewBinding(key.WithKeys("n", "N"), key.WithHelp("n", "north")),
		South:  key.NewBinding(key.WithKeys("s", "S"), key.WithHelp("s", "south")),
		Unsure: key.NewBinding(key.WithKeys("x", "X"), key.WithHelp("x", "unsure")),
		Reread: key.NewBinding(key.WithKeys("backspace"), key.WithHelp("bksp", "re-read last")),
		Done:   key.NewBinding(key.WithKeys("enter"), key.WithHelp("enter", "step done")),
	}
}

// isPolarity reports whether a step is a polarity test.
func isPolarity(s plan.Step) bool { return s.Kind == plan.StepTest && s.Test == plan.TestPolarity }

// polarityTeeth lists the teeth a polarity step walks, phase by phase in the
// step's order, each phase in tooth order.
func polarityTeeth(p *plan.Plan, s plan.Step) []plan.ToothPole {
	if p == nil {
		return nil
	}
	var out []plan.ToothPole
	for _, ph := range s.Phases {
		out = append(out, p.PolesOf(ph)...)
	}
	return out
}

// polarityValues are the recorded values of step i, one per tooth of the
// step, NaN where not read.
func (c *shared) polarityValues(s plan.Step) []float64 {
	teeth := polarityTeeth(c.plan, s)
	out := make([]float64, len(teeth))
	for k := range out {
		out[k] = math.NaN()
	}
	if i := s.Index - 1; i >= 0 && i < len(c.prog.Steps) {
		if r := c.prog.Steps[i].Reading; r != nil {
			for k, tp := range teeth {
				if x, ok := r.Values[plan.PoleKey(tp.Tooth)]; ok {
					out[k] = x
				}
			}
		}
	}
	return out
}

// polarityNext is the index of the first tooth not read, len when all are.
func polarityNext(v []float64) int {
	for i, x := range v {
		if math.IsNaN(x) {
			return i
		}
	}
	return len(v)
}

// polarityAgain is the index of the first tooth read as unsure once every
// tooth is read, -1 when none: it is read again next.
func polarityAgain(v []float64) int {
	if polarityNext(v) < len(v) {
		return -1
	}
	for i, x := range v {
		if x == 0 {
			return i
		}
	}
	return -1
}

// polarityHand is the index of the tooth in hand: the first not read, then
// the first unsure; len when there is none.
func polarityHand(v []float64) int {
	if a := polarityAgain(v); a >= 0 {
		return a
	}
	return polarityNext(v)
}

// polarityTooth is the tooth to read now on step i (0-based), 0 when none.
func (c *shared) polarityTooth(i int) int {
	s, ok := c.step(i)
	if !ok || !isPolarity(s) {
		return 0
	}
	teeth := polarityTeeth(c.plan, s)
	if n := polarityHand(c.polarityValues(s)); n < len(teeth) {
		return teeth[n].Tooth
	}
	return 0
}

// polarityKey handles a key on a polarity step; handled is false for keys it
// leaves to the guide (look, undo, overview...).
func (g guideModel) polarityKey(msg tea.KeyMsg, s plan.Step) (guideModel, tea.Cmd, bool) {
	k := g.c.keys.polarity
	teeth := polarityTeeth(g.c.plan, s)
	v := g.c.polarityValues(s)
	next := polarityNext(v)
	hand := polarityHand(v) // an unsure tooth is read again once all are read
	var pole float64
	switch {
	case hand >= len(teeth) && key.Matches(msg, g.c.keys.guide.Note):
		return g, nil, false // every tooth is read: n takes a note, as on other steps
	case key.Matches(msg, k.North):
		pole = plan.North.Value()
	case key.Matches(msg, k.South):
		pole = plan.South.Value()
	case key.Matches(msg, k.Unsure):
		pole = 0
	case key.Matches(msg, k.Reread):
		if next == 0 {
			g.flash = "no tooth read yet"
			return g, nil, true
		}
		v[next-1] = math.NaN()
		g.recordPolarity(s, v)
		g.flash = fmt.Sprintf("tooth %d to be read again", teeth[next-1].Tooth)
		return g, nil, true
	case key.Matches(msg, k.Done):
		if next < len(teeth) {
			g.flash = fmt.Sprintf("%d of %d teeth still to read: n, s or x for tooth %d", len(teeth)-next, len(teeth), teeth[next].Tooth)
			return g, nil, true
		}
		verdict := polarityVerdict(g.c.plan, s, v)
		g.c.record(Entry{Kind: EntryDone, Step: s.Index})
		g.flash = fmt.Sprintf("step %d recorded: polarity %s", s.Index, strings.ToUpper(verdict.Level))
		return g, nil, true
	default:
		return g, nil, false
	}
	if hand >= len(teeth) {
		g.flash = "every tooth is read: enter records the step, n adds a note, bksp reads the last again"
		return g, nil, true
	}
	v[hand] = pole
	g.recordPolarity(s, v)
	tp := teeth[hand]
	switch seen, sure := plan.PoleFromValue(pole); {
	case !sure && hand == next:
		g.flash = fmt.Sprintf("tooth %d: unsure; it comes up again once every tooth is read", tp.Tooth)
	case !sure:
		g.flash = fmt.Sprintf("tooth %d: still unsure; note it, or enter records the step with it unsure", tp.Tooth)
	case seen == tp.Pole:
		g.flash = fmt.Sprintf("tooth %d: %s as planned", tp.Tooth, seen)
	default:
		g.flash = fmt.Sprintf("tooth %d shows %s where the plan has %s: coil %d (step %d)", tp.Tooth, seen, tp.Pole, tp.Coil, tp.Step)
	}
	return g, nil, true
}

// recordPolarity records the step's readings so far with their verdict.
func (g guideModel) recordPolarity(s plan.Step, v []float64) {
	verdict := polarityVerdict(g.c.plan, s, v)
	readings := map[string]float64{}
	for i, tp := range polarityTeeth(g.c.plan, s) {
		if i < len(v) && !math.IsNaN(v[i]) {
			readings[plan.PoleKey(tp.Tooth)] = v[i]
		}
	}
	g.c.record(Entry{Kind: EntryReading, Step: s.Index, Test: s.Test, Readings: readings, Verdict: verdict.Level})
}

// polarityVerdict judges the teeth read so far by the check engine: fail
// when a tooth shows the other pole, warn while teeth are unsure or not
// read, pass when every tooth shows the pole of the plan.
func polarityVerdict(p *plan.Plan, s plan.Step, v []float64) Verdict {
	teeth := polarityTeeth(p, s)
	var obs []verify.PoleReading
	var unsure, unread []string
	for i, tp := range teeth {
		x := math.NaN()
		if i < len(v) {
			x = v[i]
		}
		pole, ok := plan.PoleFromValue(x)
		switch {
		case math.IsNaN(x):
			unread = append(unread, strconv.Itoa(tp.Tooth))
		case !ok:
			unsure = append(unsure, strconv.Itoa(tp.Tooth))
		default:
			obs = append(obs, verify.PoleReading{Phase: tp.Phase, Tooth: tp.Tooth, Pole: pole})
		}
	}
	out := Verdict{Level: "pass"}
	if len(obs) > 0 {
		rep, err := verify.Check(p, verify.Readings{Polarity: obs})
		if err != nil {
			return Verdict{Level: "warn", Lines: []string{"the check engine cannot judge these poles: " + err.Error()}}
		}
		for _, f := range rep.Findings {
			if f.Severity == verify.Fail {
				out.Level = "fail"
				out.Lines = append(out.Lines, "phase "+f.Phase+": "+f.Message)
			}
		}
	}
	if len(unsure) > 0 {
		out.Level = string(verify.Worst(verify.Verdict(out.Level), verify.Warn))
		out.Lines = append(out.Lines, "unsure at tooth "+strings.Join(unsure, ", ")+": read them again with more current or a closer compass")
	}
	if len(unread) > 0 {
		out.Level = string(verify.Worst(verify.Verdict(out.Level), verify.Warn))
		out.Lines = append(out.Lines, "not read yet: tooth "+strings.Join(unread, ", "))
	}
	if len(out.Lines) == 0 {
		out.Lines = []string{"every tooth shows the pole of the plan"}
	}
	return out
}

// polarityView is the panel of a polarity step: the current, the cautions,
// the tooth to read with the pole it must show, every tooth of the step with
// what was seen, and what to do about a tooth that shows the other pole.
func (g guideModel) polarityView(pp *panelParts, s plan.Step) {
	c := g.c
	st := c.st
	t := c.tests[s.Test]
	teeth := polarityTeeth(c.plan, s)
	v := c.polarityValues(s)
	next := polarityNext(v)
	_, looking := g.lookedAt()
	// Live: the tooth in hand, what each tooth showed, a tooth that showed
	// the other pole, the verdict, and the caution in short.
	pp.add(partLive, func(b *lines) {
		b.titled("polarity test", g.stepOf(s))
		if hand := polarityHand(v); hand < len(teeth) && !looking {
			tp := teeth[hand]
			where := "points AT the face"
			if tp.Pole == plan.North {
				where = "points AWAY from the face"
			}
			of := fmt.Sprintf("(%d of %d)", hand+1, len(teeth))
			if hand != next {
				of = "(again: it was unsure)"
			}
			b.raw(fmt.Sprintf("tooth %s  phase %s  expect %s  %s",
				st.strong.Render(strconv.Itoa(tp.Tooth)), st.phaseStyle(c.phaseIndex(tp.Phase)).Render(tp.Phase),
				st.strong.Render(poleWord(tp.Pole)), of))
			b.text("the compass's north end "+where, st.value.Render)
			if len(s.Phases) > 1 && hand == next && (next == 0 || teeth[next-1].Phase != tp.Phase) {
				b.text(fmt.Sprintf("clips on %s1 (+) and %s2 (-) now; switch the supply off before moving them", tp.Phase, tp.Phase), st.warn.Render)
			}
		}
		verdictShown := next == len(teeth) && !looking
		if row := polarityRow(teeth, v, !verdictShown); !verdictShown || len(row) <= b.w {
			b.text(row, st.value.Render)
		} else {
			// Every tooth is read: the verdict names the teeth that
			// matter, and the row of them all gives way to a count.
			b.text(polaritySummary(teeth, v), st.value.Render)
		}
		for i, tp := range teeth {
			if seen, ok := plan.PoleFromValue(v[i]); ok && seen != tp.Pole && !verdictShown {
				// Once every tooth is read the verdict names it, with
				// what to do: said once.
				b.text(mismatchText(tp, seen), st.fail.Render)
			}
		}
		if verdictShown {
			verdict := polarityVerdict(c.plan, s, v)
			g.verdictLines(b, &verdict) // its lines say what to do
			b.text("enter records the step; bksp reads the last tooth again.", st.statusNow.Render)
		}
		b.text(polarityCautionShort, st.caution.Render)
	})
	pp.add(partUseful, func(b *lines) {
		b.text(s.Title, st.strong.Render)
		if t.Current > 0 {
			how := "into each phase's start lead (+), out of its finish lead (-), one phase at a time"
			if len(s.Phases) == 1 {
				how = fmt.Sprintf("into %s1 (+), out of %s2 (-)", s.Phases[0], s.Phases[0])
			}
			b.kv("DC", fmt.Sprintf("%s A %s; %s of heat in the phase", fmtNum(t.Current), how, plan.FormatWatts(t.HeatW)))
		}
	})
	pp.add(partProse, func(b *lines) {
		b.text("CAUTION "+plan.PolarityCaution, st.caution.Render)
		b.kv("source", t.Source)
	})
}

// polarityCautionShort is the caution in one line, kept with the live part
// on small terminals; the whole caution follows it.
const polarityCautionShort = "CAUTION current-limited supply; switch it off before unclipping (inductive kick); steel tools get magnetised"

// polaritySummary counts the teeth read by what they showed.
func polaritySummary(teeth []plan.ToothPole, v []float64) string {
	right, other, unsure := 0, 0, 0
	for i, tp := range teeth {
		switch seen, ok := plan.PoleFromValue(v[i]); {
		case math.IsNaN(v[i]):
		case !ok:
			unsure++
		case seen == tp.Pole:
			right++
		default:
			other++
		}
	}
	out := fmt.Sprintf("read: %d teeth, %d as planned", len(teeth), right)
	if other > 0 {
		out += fmt.Sprintf(", %d the other pole", other)
	}
	if unsure > 0 {
		out += fmt.Sprintf(", %d unsure", unsure)
	}
	return out
}

// polarityRow shows every tooth of the step: tooth, planned pole, and what
// was seen (= as planned, ! the other pole, ? unsure, . not read), with the
// marks explained when legend is set.
func polarityRow(teeth []plan.ToothPole, v []float64, legend bool) string {
	parts := make([]string, len(teeth))
	for i, tp := range teeth {
		mark := "."
		switch seen, ok := plan.PoleFromValue(v[i]); {
		case math.IsNaN(v[i]):
		case !ok:
			mark = "?"
		case seen == tp.Pole:
			mark = "="
		default:
			mark = "!" + string(seen)
		}
		parts[i] = fmt.Sprintf("%d%s%s", tp.Tooth, tp.Pole, mark)
	}
	if !legend {
		return "read: " + strings.Join(parts, " ")
	}
	return "read: " + strings.Join(parts, " ") + "   (= as planned, ! other pole, ? unsure, . to read)"
}

// mismatchText names the coil of a tooth that showed the other pole, its
// step and what to do.
func mismatchText(tp plan.ToothPole, seen plan.Pole) string {
	return fmt.Sprintf("tooth %d shows %s, plan %s: coil %d (step %d) is wound the wrong way round. Rewind it; or, where a joint is acceptable, swap its two ends at their jumpers.",
		tp.Tooth, seen, tp.Pole, tp.Coil, tp.Step)
}

func poleWord(p plan.Pole) string {
	if p == plan.North {
		return "N (north)"
	}
	return "S (south)"
}

// polarityShortHelp is the help line of a polarity step.
func (g guideModel) polarityShortHelp() []key.Binding {
	k := g.c.keys.polarity
	s, _ := g.c.step(g.c.prog.Current())
	v := g.c.polarityValues(s)
	if polarityNext(v) >= len(v) { // every tooth read: n takes a note
		return []key.Binding{k.Done, k.Reread, g.c.keys.guide.Note}
	}
	return []key.Binding{k.North, k.South, k.Unsure, k.Done, k.Reread}
}
