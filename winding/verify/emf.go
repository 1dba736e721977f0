package verify

import (
	"fmt"
	"math"
	"math/cmplx"
	"sort"
	"strings"

	"coilwright/winding"
	"coilwright/winding/plan"
)

// Back-EMF limits (common practice for hand-built rotors, whose magnets
// vary): line voltages within the plan's limit (plan.BackEMFBalancePercent,
// 3 %) of each other pass, up to twice that warn, beyond fail; the mean
// within 10 % of the prediction passes, up to 25 % warns.
const (
	EMFImbalanceWarnPercent = plan.BackEMFBalancePercent
	EMFImbalanceFailPercent = 2 * plan.BackEMFBalancePercent
	EMFLevelWarnPercent     = 10.0
	EMFLevelFailPercent     = 25.0
)

// CoilPhasor is the EMF phasor of one coil per turn, in units of one turn's
// EMF: the coil on tooth k sits at electrical angle −p·(k−1)·360/Q, times its
// direction sign (winding package doc).
func CoilPhasor(tooth, slots, polePairs int, dir winding.Direction) complex128 {
	ang := -2 * math.Pi * float64(polePairs) * float64(tooth-1) / float64(slots)
	return complex(float64(dir.Sign()), 0) * cmplx.Rect(1, ang)
}

// emfModel holds the phase phasors of the plan's coils.
type emfModel struct {
	phase [3]complex128
	coils []plan.CoilPlan
	idx   []int        // phase index of each coil
	z     []complex128 // each coil's contribution to its phase
	delta bool
}

func newEMFModel(p *plan.Plan) *emfModel {
	m := &emfModel{delta: p.Connection == winding.Delta}
	l := p.Layout
	paths := [3]map[int]bool{{}, {}, {}}
	coils := p.Coils
	if len(coils) == 0 { // a plan without coil plans: take the layout's
		for _, c := range l.Coils {
			coils = append(coils, plan.CoilPlan{Tooth: c.Tooth, Phase: l.PhaseNames[c.Phase], Direction: c.Direction, Path: c.Path, Turns: max(1, p.TurnsPerCoil)})
		}
	}
	for _, c := range coils {
		i := indexOfName(l.PhaseNames, c.Phase)
		if i < 0 || i > 2 {
			continue
		}
		paths[i][c.Path] = true
		m.coils = append(m.coils, c)
		m.idx = append(m.idx, i)
	}
	for k, c := range m.coils {
		i := m.idx[k]
		// Paths in parallel: the open-circuit phase EMF is their mean.
		z := CoilPhasor(c.Tooth, l.Spec.Slots, l.Spec.PolePairs(), c.Direction) * complex(float64(c.Turns)/float64(max(1, len(paths[i]))), 0)
		m.z = append(m.z, z)
		m.phase[i] += z
	}
	return m
}

func indexOfName(names []string, n string) int {
	for i, x := range names {
		if x == n {
			return i
		}
	}
	return -1
}

// lines returns the magnitudes UV, VW, WU of the line voltages for phase
// phasors e. In a delta the loop sum drives a circulating current and each
// line (across one phase) reads e_k − Σe/3.
func (m *emfModel) lines(e [3]complex128) [3]float64 {
	if m.delta {
		s := (e[0] + e[1] + e[2]) / 3
		return [3]float64{cmplx.Abs(e[0] - s), cmplx.Abs(e[1] - s), cmplx.Abs(e[2] - s)}
	}
	return [3]float64{cmplx.Abs(e[0] - e[1]), cmplx.Abs(e[1] - e[2]), cmplx.Abs(e[2] - e[0])}
}

// reversed returns the line magnitudes with coil k wound the other way.
func (m *emfModel) reversed(k int) [3]float64 {
	e := m.phase
	e[m.idx[k]] -= 2 * m.z[k]
	return m.lines(e)
}

// fit scales sim to meas by least squares and returns the rms residual
// relative to the mean measured value, and the scale.
func fit(meas, sim [3]float64) (resid, scale float64) {
	var ms, ss float64
	for i := range meas {
		ms += meas[i] * sim[i]
		ss += sim[i] * sim[i]
	}
	if ss == 0 {
		return math.Inf(1), 0
	}
	scale = ms / ss
	var r, mean float64
	for i := range meas {
		r += sq(meas[i] - scale*sim[i])
		mean += meas[i] / 3
	}
	if mean == 0 {
		return math.Inf(1), scale
	}
	return math.Sqrt(r/3) / mean, scale
}

func (c *checker) backEMF() {
	e := c.r.EMF
	meas := [3]float64{e.UV, e.VW, e.WU}
	res := &EMFResult{RPM: e.RPM, Lines: meas, Verdict: Pass}
	c.rep.EMF = res
	add := func(sev Verdict, msg string, teeth []int) {
		res.Verdict = Worst(res.Verdict, sev)
		c.add(Finding{Severity: sev, Phase: c.phaseOfTeeth(teeth), Test: plan.TestBackEMF, Message: msg, Teeth: teeth})
	}
	mean := (meas[0] + meas[1] + meas[2]) / 3
	if mean == 0 {
		add(Fail, "no back-EMF on any line: the leads are not connected to the meter, the rotor has no magnetised poles, or the winding is open", nil)
		return
	}
	// The same imbalance as the resistances: largest deviation from the
	// mean, over the mean (plan.ImbalancePercent).
	res.ImbalancePercent, _ = plan.ImbalancePercent(meas[:])
	if c.p.EMF != nil && c.p.EMF.VoltsPerRPMPhase > 0 {
		ph := c.p.EMF.VoltsPerRPMPhase * e.RPM
		res.ExpectedLineV = ph
		if c.p.Connection == winding.Star {
			res.ExpectedLineV = math.Sqrt(3) * ph
		}
		ratio := mean / res.ExpectedLineV
		res.DeviationPercent = 100 * (ratio - 1)
		dev := math.Abs(res.DeviationPercent)
		switch {
		case (math.Abs(ratio/math.Sqrt(3)-1) < 0.05 || math.Abs(ratio*math.Sqrt(3)-1) < 0.05) && c.connectionProven:
			// The line resistances have shown the connection (a star
			// plan connected delta reads a third, IEC 60028 series and
			// parallel sums), so a √3 factor in the EMF is not star and
			// delta confused: the flux estimate behind the prediction (an
			// air-gap flux density or test-coil figure) is the likely
			// cause, or the speed.
			sev := Warn
			if dev > EMFLevelFailPercent {
				sev = Fail
			}
			add(sev, fmt.Sprintf("back-EMF %.3g V is about %s the predicted %.3g V line to line at %.0f rpm; the resistance readings of this check prove the %s connection, so star and delta are not confused: the magnet flux per pole is about %s the plan's estimate (check the air-gap flux density or test-coil figure it came from), or the speed reading is off",
				mean, map[bool]string{true: "√3×", false: "1/√3 of"}[ratio > 1], res.ExpectedLineV, e.RPM, c.p.Connection,
				map[bool]string{true: "√3×", false: "1/√3 of"}[ratio > 1]), nil)
		case math.Abs(ratio/math.Sqrt(3)-1) < 0.05 || math.Abs(ratio*math.Sqrt(3)-1) < 0.05:
			add(Fail, fmt.Sprintf("back-EMF %.3g V is about %s the predicted %.3g V line to line at %.0f rpm: star and delta confused, a phase voltage read as line voltage, or the magnet flux per pole that far from the plan's estimate; the line resistances (--uv --vw --wu) tell the connection",
				mean, map[bool]string{true: "√3×", false: "1/√3 of"}[ratio > 1], res.ExpectedLineV, e.RPM), nil)
		case dev <= EMFLevelWarnPercent:
			add(Pass, fmt.Sprintf("back-EMF %.3g V line to line at %.0f rpm, %s from the predicted %.3g V", mean, e.RPM, plan.SignedPercent(res.DeviationPercent), res.ExpectedLineV), nil)
		default:
			sev := Warn
			if dev > EMFLevelFailPercent {
				sev = Fail
			}
			add(sev, fmt.Sprintf("back-EMF %.3g V line to line at %.0f rpm is %s from the predicted %.3g V: the magnet flux differs from the plan's estimate, the turns differ (about %.0f per coil fits), or the speed reading is off",
				mean, e.RPM, plan.SignedPercent(res.DeviationPercent), res.ExpectedLineV, ratio*float64(c.p.TurnsPerCoil)), nil)
		}
	}
	if res.ImbalancePercent <= EMFImbalanceWarnPercent {
		add(Pass, fmt.Sprintf("back-EMF balanced: the largest deviation from the mean is %.2f %%", res.ImbalancePercent), nil)
		return
	}
	sev := Warn
	if res.ImbalancePercent > EMFImbalanceFailPercent {
		sev = Fail
	}
	text := c.reversedCoilText(meas, res)
	add(sev, text, res.Reversed)
}

// reversedCoilText names the coils whose reversal fits the measured pattern.
func (c *checker) reversedCoilText(meas [3]float64, res *EMFResult) string {
	m := newEMFModel(c.p)
	base := fmt.Sprintf("back-EMF unbalanced: a line %.1f %% from the mean (UV %.3g, VW %.3g, WU %.3g V)", res.ImbalancePercent, meas[0], meas[1], meas[2])
	if len(m.coils) == 0 {
		return base
	}
	r0, _ := fit(meas, m.lines(m.phase))
	type cand struct {
		k     int
		resid float64
		sim   [3]float64
		scale float64
	}
	var cs []cand
	for k := range m.coils {
		sim := m.reversed(k)
		r, s := fit(meas, sim)
		cs = append(cs, cand{k, r, sim, s})
	}
	sort.SliceStable(cs, func(a, b int) bool { return cs[a].resid < cs[b].resid })
	best := cs[0]
	if best.resid > 0.03 || best.resid > 0.5*r0 {
		return base + ": the pattern fits no single reversed coil; look for uneven magnets, a shorted coil, or a mistake in more than one coil"
	}
	var teeth []int
	for _, cd := range cs {
		if cd.resid > best.resid+0.003 {
			break
		}
		teeth = append(teeth, m.coils[cd.k].Tooth)
	}
	sort.Ints(teeth)
	var desc []string
	for _, t := range teeth {
		co, _ := c.p.Layout.CoilOn(t)
		desc = append(desc, fmt.Sprintf("tooth %d (phase %s)", t, c.name(co.Phase)))
	}
	res.Reversed = teeth
	sim := best.sim
	return fmt.Sprintf("%s: the pattern fits one coil wound the wrong way round or with its start and finish swapped: %s; with it reversed the lines would read %.3g, %.3g, %.3g V",
		base, strings.Join(desc, " or "), best.scale*sim[0], best.scale*sim[1], best.scale*sim[2])
}

// phaseOfTeeth names the phase all the given teeth belong to, or "".
func (c *checker) phaseOfTeeth(teeth []int) string {
	name := ""
	for _, t := range teeth {
		co, ok := c.p.Layout.CoilOn(t)
		if !ok {
			return ""
		}
		n := c.name(co.Phase)
		if name != "" && n != name {
			return ""
		}
		name = n
	}
	return name
}
