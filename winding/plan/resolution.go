package plan

import (
	"fmt"
	"math"

	"coilwright/winding"
)

// Resolution is the smallest turn error a test can see on this job: how many
// turns a phase (or every coil) must be off before the reading leaves the
// test's limit. Plain data; the plan's test text and the check both state it.
type Resolution struct {
	Test string `json:"test"`
	// Turns is the smallest error the test sees, in turns (in one phase, or
	// per coil for the resistance band); 0 where the test does not count
	// turns (continuity: an open or a bad joint).
	Turns int `json:"turns"`
	// PerTurnPercent is how far one turn moves the quantity the test judges.
	PerTurnPercent float64 `json:"per_turn_percent"`
	Text           string  `json:"text"`
}

// Resolutions works out what each test can see on this plan.
//
// One extra turn on one path lengthens it by a mean turn: the path's
// resistance moves by MLT/L (L the wire between the lead ends), and a phase
// of a paths in parallel by about 1/a of that (small change, parallel
// conductances add).
//
//   - resistance band: an error on every coil alike (wrong wire gauge, a
//     turn more on every coil) moves every phase by coils·MLT/L per turn per
//     coil; seen once it passes the nearer edge of the band.
//   - balance (largest deviation from the mean, EASA AR100): one phase x off
//     the others lies x·(m−1)/m from the mean of m phases, so the limit needs
//     x = limit·m/(m−1).
//   - back-EMF balance: one phase's EMF x off moves the largest line
//     deviation from the mean by x/6 in a star (the two lines through that
//     phase rise by x/2, the mean by x/3) and by x/3 in a delta (its own line
//     rises 2x/3, the mean x/3), first order in the phasor sums; one turn in
//     the N series turns of a phase of a paths moves its EMF 1/(a·N).
//   - continuity: a path reading above ContinuityFactor × its expected value:
//     an open or a joint adding that much, not a turn count.
func (p *Plan) Resolutions() []Resolution {
	j := p.Connection
	if p.Layout == nil || len(p.Paths) == 0 || p.MeanTurnLengthMM <= 0 {
		return nil
	}
	m := float64(len(p.Layout.PhaseNames))
	a := float64(max(1, p.Layout.Spec.Paths))
	var lread, coils float64
	for _, pp := range p.Paths {
		lread += pp.LeadEndsLengthM
		coils += float64(pp.Coils)
	}
	n := float64(len(p.Paths))
	lread /= n
	coils /= n
	if lread <= 0 || m < 2 {
		return nil
	}
	mlt := p.MeanTurnLengthMM / 1000
	phaseTurnPct := 100 * mlt / lread / a // one turn in one path, on its phase
	coilTurnPct := 100 * coils * mlt / lread
	lo, hi := ResistanceBand(p.Wire)
	edge := math.Min(-lo, hi)
	bandTurns := int(math.Ceil(edge/coilTurnPct - 1e-9))
	balX := BalanceLimitPercent * m / (m - 1)
	balTurns := int(math.Ceil(balX/phaseTurnPct - 1e-9))
	series := coils * float64(p.TurnsPerCoil) // turns of one path = series turns of the phase
	emfFactor := 6.0
	if j == winding.Delta {
		emfFactor = 3
	}
	emfTurnPct := 100 / (a * series)
	emfTurns := int(math.Ceil(BackEMFBalancePercent*emfFactor/emfTurnPct - 1e-9))
	return []Resolution{
		{Test: TestContinuity, Text: fmt.Sprintf("an open path, or a joint adding more than %.0f %% of a path (one turn adds %s %%: turns are for the other tests)",
			100*(ContinuityFactor-1), sig(100*mlt/lread, 2))},
		{Test: TestResistance, Turns: bandTurns, PerTurnPercent: coilTurnPct, Text: fmt.Sprintf("an error common to every coil of %d turns per coil (of %d) or more: one turn on every coil moves every phase %s %%, the band's nearer edge is %s %%",
			bandTurns, p.TurnsPerCoil, sig(coilTurnPct, 3), sig(edge, 2))},
		{Test: TestBalance, Turns: balTurns, PerTurnPercent: phaseTurnPct, Text: fmt.Sprintf("%d turns too many or too few in one phase: one turn moves a phase %s %%, and the %s %% limit needs one phase %s %% off the others; a single shorted turn is below what it can see",
			balTurns, sig(phaseTurnPct, 2), sig(BalanceLimitPercent, 2), sig(balX, 2))},
		{Test: TestBackEMF, Turns: emfTurns, PerTurnPercent: emfTurnPct, Text: fmt.Sprintf("%d turns in one phase (one turn moves a phase's EMF %s %%, and a phase x off moves the largest line deviation x/%g in a %s); %s",
			emfTurns, sig(emfTurnPct, 2), emfFactor, j, reversedCoilWords(2*p.TurnsPerCoil, emfTurns))},
	}
}

// reversedCoilWords says whether a coil wound the wrong way round (its turns
// counted twice: taken away and added the other way) is above what the
// back-EMF balance sees.
func reversedCoilWords(reversed, seen int) string {
	if reversed >= seen {
		return fmt.Sprintf("a coil wound the wrong way round (%d turns the other way) shows plainly", reversed)
	}
	return fmt.Sprintf("even a coil wound the wrong way round (%d turns the other way) can hide in the rotor's own spread: the polarity test finds it", reversed)
}
