package verify

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"coilwright/winding"
	"coilwright/winding/plan"
	"coilwright/winding/wire"
)

// openFactor: a converted phase above this multiple of the expected value is
// taken as open (a delta with an open phase converts to a huge value, not +Inf,
// when the readings carry a little noise).
const openFactor = 20.0

func (c *checker) resistance() {
	ph := c.phasesAtTemp()
	exp20 := c.p.PhaseResistance20C
	expT := c.rep.Expected.AtTemp
	var r20 [3]float64
	var open []int
	for i, v := range ph {
		if math.IsInf(v, 1) || v > openFactor*expT {
			open = append(open, i)
			c.rep.Phases = append(c.rep.Phases, Phase{Phase: c.name(i), Open: true})
			continue
		}
		r20[i] = wire.To20(v, c.r.TempC)
		dev := 100 * (r20[i]/exp20 - 1)
		c.rep.Phases = append(c.rep.Phases, Phase{
			Phase: c.name(i), OhmAtTemp: v, Ohm20C: r20[i], DeviationPercent: dev,
			InBand: dev >= c.rep.Band.LowPercent && dev <= c.rep.Band.HighPercent,
		})
	}
	if len(open) > 0 {
		c.openCircuit(open)
		return
	}
	for i, v := range ph {
		if v <= 0.02*expT {
			c.add(Finding{Severity: Fail, Phase: c.name(i), Test: plan.TestResistance, Message: fmt.Sprintf(
				"the three readings fit no %s winding (phase %s computes to %.4g Ω): one reading is wrong or a phase is shorted to another; read again",
				c.p.Connection, c.name(i), v)})
			return
		}
	}
	// Imbalance as EASA AR100 states it: the largest deviation from the
	// mean, over the mean (plan.ImbalancePercent).
	imb, mean := plan.ImbalancePercent(r20[:])
	c.rep.ImbalancePercent = imb
	level := mean / exp20
	good := []int{0, 1, 2}
	if c.rep.ImbalancePercent > ImbalanceLimitPercent {
		x, ref := outlier(r20)
		c.add(c.outlierFinding(x, r20[x], ref, ph))
		level = ref / exp20
		good = others(x)
	} else {
		c.add(Finding{Severity: Pass, Test: plan.TestBalance, Message: fmt.Sprintf(
			"phases balanced: the largest deviation from the mean is %.2f %%, within %.0f %% (EASA AR100)", c.rep.ImbalancePercent, ImbalanceLimitPercent)})
	}
	c.level(level, good)
}

func others(x int) []int {
	var o []int
	for i := 0; i < 3; i++ {
		if i != x {
			o = append(o, i)
		}
	}
	return o
}

// outlier returns the phase farthest from the median and the mean of the
// other two.
func outlier(r [3]float64) (int, float64) {
	idx := []int{0, 1, 2}
	sort.Slice(idx, func(a, b int) bool { return r[idx[a]] < r[idx[b]] })
	med := r[idx[1]]
	x := idx[0]
	if r[idx[2]]-med > med-r[idx[0]] {
		x = idx[2]
	}
	o := others(x)
	return x, (r[o[0]] + r[o[1]]) / 2
}

func (c *checker) openCircuit(open []int) {
	if len(open) == 3 {
		what := "the star point is not made, or more than one phase is open"
		if c.p.Connection == winding.Delta {
			what = "two or more phases are open"
		}
		if c.rep.Method == "per-phase" {
			what = "no phase conducts: check the meter leads and range"
		}
		c.add(Finding{Severity: Fail, Test: plan.TestResistance, Message: "no reading shows continuity as a winding: " + what})
		return
	}
	for _, i := range open {
		c.add(Finding{Severity: Fail, Phase: c.name(i), Test: plan.TestResistance, Teeth: c.teethOf(i), Message: fmt.Sprintf(
			"phase %s is open: a broken wire, enamel not stripped at a lead or joint, or a joint not made between %s1 and %s2; check continuity coil by coil (teeth %s)",
			c.name(i), c.name(i), c.name(i), winding.NumberList(c.teethOf(i)))})
	}
}

// pathGeometry gives, for a phase, the number of parallel paths, the length of
// one path in metres, the mean turn in metres and the turns per coil.
func (c *checker) pathGeometry(phase int) (a int, pathM, turnM float64, turns int) {
	name := c.name(phase)
	var lengths []float64
	for _, pp := range c.p.Paths {
		if pp.Phase == name {
			lengths = append(lengths, pp.LeadEndsLengthM) // what the meter reads across
		}
	}
	turnM = c.p.MeanTurnLengthMM / 1000
	turns = c.p.TurnsPerCoil
	a = len(lengths)
	if a == 0 {
		a = max(1, c.p.Layout.Spec.Paths)
		pathM = float64(c.p.Layout.CoilsPerPhase/a*turns) * turnM
	} else {
		for _, l := range lengths {
			pathM += l
		}
		pathM /= float64(a)
	}
	return a, pathM, turnM, turns
}

func (c *checker) outlierFinding(x int, rx, ref float64, atTemp [3]float64) Finding {
	name := c.name(x)
	ratio := rx / ref
	o := others(x)
	a, pathM, turnM, turns := c.pathGeometry(x)
	// One path of a carries the fault; the others are as the reference:
	// G = (a−1)/Rp + 1/Rj', a/Rp = 1/ref, so Rj'/Rp = 1/(a/ratio − (a−1)).
	g := float64(a)/ratio - float64(a-1)
	where := fmt.Sprintf("phase %s reads %.1f %% %s the mean of %s and %s (%.3f×)",
		name, math.Abs(100*(ratio-1)), map[bool]string{true: "below", false: "above"}[ratio < 1], c.name(o[0]), c.name(o[1]), ratio)
	inPath := ""
	if a > 1 {
		inPath = " in one of its paths"
	}
	f := Finding{Severity: Fail, Phase: name, Test: plan.TestBalance}
	var causes []string
	if ratio < 1 {
		k := (1 - 1/g) * pathM / turnM
		coils := k / float64(max(turns, 1))
		if n := math.Round(coils); n >= 1 && math.Abs(coils-n) <= 0.2 {
			causes = append(causes, fmt.Sprintf("about %s share (%.0f turns at %d per coil)%s: a coil shorted or bypassed (a jumper touching, start and finish joined, a coil left out); look at teeth %s",
				plural(int(n), "one coil's", "coils'"), k, turns, inPath, winding.NumberList(c.teethOf(x))))
			f.Teeth = c.teethOf(x)
		} else {
			causes = append(causes, fmt.Sprintf("about %.0f turns fewer than planned%s: turns miscounted on a coil, or shorted turns (enamel damaged at a slot exit)", k, inPath))
		}
	} else {
		pathOpen := a > 1 && math.Abs(ratio/(float64(a)/float64(a-1))-1) < 0.05
		if pathOpen {
			causes = append(causes, fmt.Sprintf("one of its %d parallel paths is open (%.3f× fits %d paths becoming %d): a broken wire or a path end not joined at the terminals", a, ratio, a, a-1))
		}
		dOhm := atTemp[x] - (atTemp[o[0]]+atTemp[o[1]])/2
		causes = append(causes, fmt.Sprintf("a poor joint or crimp adding about %s", ohm(dOhm)))
		// Extra turns only while they are a plausible count: at most as many
		// again as the path holds (a path that reads twice its length or
		// more, or an open parallel path, is no miscount).
		if k := (1/g - 1) * pathM / turnM; g > 0 && !pathOpen && k <= pathM/turnM {
			causes = append(causes, fmt.Sprintf("about %.0f extra turns%s", k, inPath))
		}
		if d := c.p.Wire.BareDiameterMM; d > 0 {
			causes = append(causes, fmt.Sprintf("the phase wound from thinner wire (about %.3f mm instead of %.3f mm)", d/math.Sqrt(ratio), d))
		}
	}
	f.Message = where + ", beyond the " + fmt.Sprintf("%.0f %%", ImbalanceLimitPercent) + " balance limit (EASA AR100): " + strings.Join(causes, "; or ")
	if !c.r.FourWire && c.rep.Expected.AtTemp < 1 {
		f.Message += fmt.Sprintf("; at %.3g Ω a two-wire meter's contact resistance matters: clean the leads, read again or use four-wire", c.rep.Expected.AtTemp)
	}
	return f
}

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return fmt.Sprintf("%d %s", n, many)
}

// ratioCause is a whole-winding factor that points at one mistake.
type ratioCause struct {
	factor float64
	why    string
}

// level judges the (balanced) level of the good phases against the plan.
func (c *checker) level(level float64, good []int) {
	c.connectionProven = math.Abs(level-1) <= 0.25
	b := c.rep.Band
	dev := 100 * (level - 1)
	names := make([]string, len(good))
	for i, g := range good {
		names[i] = c.name(g)
	}
	who := "all phases"
	if len(good) < 3 {
		who = "phases " + strings.Join(names, " and ")
	}
	if dev >= b.LowPercent && dev <= b.HighPercent {
		c.add(Finding{Severity: Pass, Test: plan.TestResistance, Message: fmt.Sprintf(
			"%s within the band %s of the plan's %s at 20 °C (%s)", who, plan.BandText(b.LowPercent, b.HighPercent), ohm(c.p.PhaseResistance20C), plan.SignedPercent(dev))})
		return
	}
	for _, rc := range c.ratioCauses() {
		if math.Abs(level/rc.factor-1) < 0.08 {
			c.add(Finding{Severity: Fail, Test: plan.TestResistance, Message: fmt.Sprintf(
				"%s read about %s the plan (%.2f×): %s", who, factorText(rc.factor), level, rc.why)})
			return
		}
	}
	sev := Warn
	if math.Abs(dev) > 25 {
		sev = Fail
	}
	t := c.r.TempC
	var causes []string
	if d := c.p.Wire.BareDiameterMM; d > 0 {
		causes = append(causes, fmt.Sprintf("wire of about %.3f mm instead of %.3f mm (R ∝ 1/d²)", d/math.Sqrt(level), d))
	}
	if n := c.p.TurnsPerCoil; n > 0 {
		causes = append(causes, fmt.Sprintf("about %.0f turns per coil instead of %d", float64(n)*level, n))
	}
	causes = append(causes, fmt.Sprintf("a winding at %.0f °C rather than the %.1f °C given", level*(wire.InferredZeroC+t)-wire.InferredZeroC, t))
	c.add(Finding{Severity: sev, Test: plan.TestResistance, Message: fmt.Sprintf(
		"%s read %.1f %% %s the plan, outside the band %s, and equally, so the cause is common to all: %s",
		who, math.Abs(dev), map[bool]string{true: "below", false: "above"}[dev < 0], plan.BandText(b.LowPercent, b.HighPercent), strings.Join(causes, "; or "))})
}

func factorText(f float64) string {
	switch {
	case f >= 1:
		return fmt.Sprintf("%g×", math.Round(f*100)/100)
	default:
		return fmt.Sprintf("1/%g of", math.Round(100/f)/100)
	}
}

func (c *checker) ratioCauses() []ratioCause {
	star := c.p.Connection == winding.Star
	perPhase := c.rep.Method == "per-phase"
	var rc []ratioCause
	if star {
		rc = append(rc, ratioCause{1.0 / 3, "star and delta confused: the readings fit the winding connected in delta, the plan connects star; check the terminal joints against the connection sheet"},
			ratioCause{3, "star and delta confused: the readings fit a plan three times the phase resistance (a delta plan read as star?), or wire and turns far from the plan"})
	} else {
		rc = append(rc, ratioCause{3, "star and delta confused: the readings fit the winding connected in star, the plan connects delta; check the terminal joints against the connection sheet"},
			ratioCause{1.0 / 3, "star and delta confused: the readings fit a plan of a third of the phase resistance (a star plan read as delta?)"})
	}
	if perPhase {
		rc = append(rc, ratioCause{2, "line-to-line readings given as per-phase values (a star line reading is two phases in series); give them as --uv --vw --wu"},
			ratioCause{0.5, "each phase reads half the plan: two paths in parallel where the plan has one, or the reading taken across half a phase"})
	} else {
		rc = append(rc, ratioCause{0.5, "phase values given as line-to-line readings (each reading is one phase, not two in series); give them with --per-phase"},
			ratioCause{2, "two phases in series read where one was meant, or every path twice as long as planned"})
	}
	if a := c.p.Layout.Spec.Paths; a > 1 {
		fa := float64(a * a)
		rc = append(rc, ratioCause{fa, fmt.Sprintf("the %d parallel paths of each phase seem joined in series, not in parallel", a)},
			ratioCause{1 / fa, fmt.Sprintf("the coils seem joined as %d parallel paths where the plan has them in series", a)})
	}
	return rc
}

// teethOf lists the wound teeth of a phase, in tooth order.
func (c *checker) teethOf(phase int) []int {
	var t []int
	for _, co := range c.p.Layout.Coils {
		if co.Phase == phase {
			t = append(t, co.Tooth)
		}
	}
	return t
}
