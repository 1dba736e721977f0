package plan

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"coilwright/winding"
	"coilwright/winding/job"
	"coilwright/winding/wire"
)

// Build makes the plan of a job. It validates the job first (a Job built in
// code gets its defaults filled on a copy; the caller's value is not changed).
// Its refusals are *job.FieldError naming the field: a slot/pole pair with no
// balanced winding, turns that do not fit the slot, a wire wider than the slot
// opening.
func Build(j *job.Job) (*Plan, error) {
	if j == nil {
		return nil, errors.New("plan: no job")
	}
	jc := *j
	jc.Normalize()
	if err := jc.Validate(); err != nil {
		return nil, err
	}
	b := &builder{j: &jc, p: &Plan{}}
	for _, step := range []func() error{b.header, b.layout, b.wire, b.slot, b.flux, b.turns, b.fit,
		b.lengths, b.electrical, b.machine, b.materials, b.steps, b.polarity, b.tests, b.cautions} {
		if err := step(); err != nil {
			return nil, err
		}
	}
	if b.p.Warnings == nil {
		b.p.Warnings = []string{}
	}
	return b.p, nil
}

// builder carries the intermediate values between the parts of Build.
type builder struct {
	j *job.Job
	p *Plan

	strandArea float64        // mm², one strand
	sides      int            // coil sides per slot: 2 for double layer, 1 for single
	depthMM    float64        // slot depth (estimated from the area where not given)
	phiWb      float64        // fundamental flux per pole; 0 when no source
	emfPerTurn float64        // phase EMF rms per turn per coil per rpm
	lineFactor float64        // line EMF / phase EMF
	phaseCurr  float64        // phase current at rated line current
	jumpers    [][]JumperStep // per chain, in the order of Layout.Chains
}

func (b *builder) warn(format string, a ...any) {
	b.p.Warnings = append(b.p.Warnings, fmt.Sprintf(format, a...))
}

func (b *builder) header() error {
	j := b.j
	b.p.Name, b.p.Revision, b.p.Date = j.Name, j.Revision, j.Date
	b.p.Rotor = Rotor(j.Stator.Rotor)
	b.p.AmbientC = j.Build.Ambient()
	b.p.RatedCurrentA = j.Rating.CurrentA
	conn, _ := winding.ParseConnection(j.Winding.Connection)
	b.p.Connection = conn
	return nil
}

func (b *builder) layout() error {
	w := b.j.Winding
	l, err := winding.Design(winding.Spec{Slots: w.Slots, Poles: w.Poles, Phases: w.Phases, Layers: w.Layers, Paths: w.Paths})
	if err != nil {
		var se *winding.SpecError
		if errors.As(err, &se) {
			hint := ""
			if len(se.Nearest) > 0 {
				var s []string
				for _, n := range se.Nearest {
					s = append(s, fmt.Sprintf("%d/%d", n.Slots, n.Poles))
				}
				hint = "nearest feasible slot/pole pairs: " + strings.Join(s, ", ")
			}
			fe := b.j.Fail("winding."+se.Field, fmt.Sprint(se.Value), se.Reason, hint)
			fe.Unsupported = errors.Is(err, winding.ErrInfeasible)
			return fe
		}
		return err
	}
	b.p.Layout = l
	b.sides = w.Layers
	m := float64(w.Phases)
	if b.p.Connection == winding.Star {
		// Line EMF between adjacent phases 360/m apart: 2·sin(π/m)·E (√3 for three phases).
		b.lineFactor = 2 * math.Sin(math.Pi/m)
		b.phaseCurr = b.j.Rating.CurrentA
	} else {
		b.lineFactor = 1
		b.phaseCurr = b.j.Rating.CurrentA / (2 * math.Sin(math.Pi/m))
		if w.Phases == 3 {
			b.warn("delta: any third-harmonic EMF of the magnets adds round the delta and drives a circulating current that heats the winding even at no load; star is the usual choice for tooth-coil PM machines (common practice)")
		}
	}
	return nil
}

func (b *builder) wire() error {
	jw := b.j.Wire
	bare, err := b.j.BareDiameter()
	if err != nil {
		return b.j.Fail("wire.awg", "", err.Error(), "")
	}
	w := Wire{BareDiameterMM: bare, StrandsInHand: jw.StrandsInHand, Grade: jw.Grade}
	if jw.AWG != nil {
		w.AWG = *jw.AWG
	}
	if jw.Grade != 0 {
		e, err := wire.EnamelFor(bare, jw.Grade)
		if err != nil {
			return b.j.Fail("wire.grade", fmt.Sprint(jw.Grade), err.Error(), "give overall_diameter_mm as measured")
		}
		w.OverallDiameterMM = e.MaxOverallMM
		w.DiameterTolMM = e.TolMM
		if e.Interpolated {
			b.warn("wire: %.3f mm is between the rows of the IEC 60317-0-1 table; its enamel build and tolerance were interpolated (%.3f mm overall, ±%.3f mm)", bare, e.MaxOverallMM, e.TolMM)
		}
	} else {
		w.OverallDiameterMM = jw.OverallDiameterMM
		w.DiameterTolMM = wire.ToleranceFor(bare)
	}
	b.strandArea = wire.Area(bare)
	w.CopperAreaMM2 = b.strandArea * float64(jw.StrandsInHand)
	b.p.Wire = w
	return nil
}
