package verify

import (
	"errors"
	"fmt"
	"math"

	"coilwright/winding"
	"coilwright/winding/plan"
	"coilwright/winding/wire"
)

// ImbalanceLimitPercent is the largest deviation of a phase resistance from
// the mean of the phases, over that mean, of a random-wound winding (EASA
// AR100-2020; 1 % for form-wound coils). The plan's test plan states the
// same limit.
const ImbalanceLimitPercent = plan.BalanceLimitPercent

// LengthUncertainty is the stated uncertainty of the plan's wire length, a
// geometric mean-turn estimate of a hand-wound coil (coil build, tension,
// jumper routing), as a fraction; the plan's test plan uses the same figure
// (common practice).
const LengthUncertainty = plan.LengthUncertaintyPercent / 100

// ErrUnsupported marks a plan this package cannot judge (not three phases,
// no expected resistance).
var ErrUnsupported = errors.New("verify: not supported")

// Check judges the readings against the plan. It returns an *InputError
// (errors.Is ErrInput) for readings that cannot be judged. Each section of the
// readings that is present is judged; the report's verdict is the worst of
// its findings.
func Check(p *plan.Plan, r Readings) (*Report, error) {
	if err := r.Validate(); err != nil {
		return nil, err
	}
	if p == nil || p.Layout == nil {
		return nil, fmt.Errorf("%w: no plan or no layout", ErrUnsupported)
	}
	if len(r.Polarity) > 0 {
		if err := ValidatePolarity(p, r.Polarity); err != nil {
			return nil, err
		}
	}
	if n := len(p.Layout.PhaseNames); n != 3 && !r.onlyPolarity() {
		return nil, fmt.Errorf("%w: %d phases; the check handles three-phase windings", ErrUnsupported, n)
	}
	c := &checker{p: p, r: r, rep: &Report{
		TemperatureC: r.TempC, Connection: p.Connection.String(), FourWire: r.FourWire, LeadOhm: r.LeadOhm,
		ImbalanceLimit: ImbalanceLimitPercent, Verdict: Pass, Phases: []Phase{}, Findings: []Finding{},
	}}
	c.rep.Expected = ExpectedOhm{At20C: p.PhaseResistance20C, AtTemp: wire.ResistanceAt(p.PhaseResistance20C, r.TempC)}
	c.rep.Band = bandFor(p)
	if r.HasResistance() {
		if p.PhaseResistance20C <= 0 {
			return nil, fmt.Errorf("%w: the plan has no expected phase resistance", ErrUnsupported)
		}
		c.resistance()
	}
	if r.Insulation != nil {
		c.insulation()
	}
	if r.Withstand != nil {
		c.withstand()
	}
	if r.EMF != nil {
		c.backEMF()
	}
	if len(r.Polarity) > 0 {
		c.polarity()
	}
	c.resolution()
	c.cautions()
	return c.rep, nil
}

type checker struct {
	p   *plan.Plan
	r   Readings
	rep *Report
	// connectionProven: the resistance readings of this check fit the
	// plan's connection (every phase within 25 % of the plan, far from the
	// 1/3 or 3 that star and delta confused give).
	connectionProven bool
}

func (c *checker) add(f Finding) {
	c.rep.Findings = append(c.rep.Findings, f)
	c.rep.Verdict = Worst(c.rep.Verdict, f.Severity)
}

func (c *checker) name(i int) string { return c.p.Layout.PhaseNames[i] }

// bandFor is the band of a correct winding about the plan's value
// (plan.ResistanceBand: the IEC 60317 diameter tolerance, R ∝ 1/d², times the
// length uncertainty), with its two parts shown apart.
func bandFor(p *plan.Plan) Band {
	lo, hi := plan.DiameterBand(p.Wire)
	b := Band{DiameterMM: p.Wire.BareDiameterMM, DiameterTolMM: p.Wire.DiameterTolMM, LengthPercent: 100 * LengthUncertainty,
		DiameterPercent: [2]float64{100 * (lo - 1), 100 * (hi - 1)}}
	b.LowPercent, b.HighPercent = plan.ResistanceBand(p.Wire)
	b.Low20C = p.PhaseResistance20C * (1 + b.LowPercent/100)
	b.High20C = p.PhaseResistance20C * (1 + b.HighPercent/100)
	return b
}

func sq(x float64) float64 { return x * x }

// phasesAtTemp turns the readings into phase values at the winding
// temperature, lead resistance removed.
func (c *checker) phasesAtTemp() [3]float64 {
	r := c.r
	sub := func(v float64) float64 {
		if math.IsInf(v, 1) {
			return v
		}
		return v - r.LeadOhm
	}
	if len(r.PerPhase) == 3 {
		c.rep.Method = "per-phase"
		return [3]float64{sub(r.PerPhase[0]), sub(r.PerPhase[1]), sub(r.PerPhase[2])}
	}
	c.rep.Method = "line-to-line"
	uv, vw, wu := sub(r.UV), sub(r.VW), sub(r.WU)
	for i, v := range []float64{uv, vw, wu} {
		l := Line{Lines: []string{"UV", "VW", "WU"}[i], Ohm: v}
		if math.IsInf(v, 1) {
			l.Ohm, l.Open = 0, true
		}
		c.rep.Lines = append(c.rep.Lines, l)
	}
	if c.p.Connection == winding.Delta {
		return DeltaPhases(uv, vw, wu)
	}
	return StarPhases(uv, vw, wu)
}

// resolution states, for the tests this check judged, the smallest turn
// error each can see on this job.
func (c *checker) resolution() {
	judged := map[string]bool{}
	for _, f := range c.rep.Findings {
		judged[f.Test] = true
	}
	for _, r := range c.p.Resolutions() {
		if judged[r.Test] {
			c.rep.Resolution = append(c.rep.Resolution, r)
		}
	}
}
