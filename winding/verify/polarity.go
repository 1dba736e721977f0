package verify

import (
	"fmt"
	"sort"
	"strconv"
	"strings"

	"coilwright/winding"
	"coilwright/winding/plan"
)

// PoleReading is what a compass (or a Hall probe, viewing film, a phone's
// magnetometer) showed at one wound tooth face with DC into the tooth's phase
// at its start terminal.
type PoleReading struct {
	Phase string    `json:"phase"`
	Tooth int       `json:"tooth"`
	Pole  plan.Pole `json:"pole"`
}

// PolarityError is a polarity observation that cannot be judged. Token is the
// part of the input at fault, as written ("U=1X", "U=5S").
type PolarityError struct {
	Token  string
	Reason string
}

func (e *PolarityError) Error() string {
	return fmt.Sprintf("verify: polarity %s: %s", e.Token, e.Reason)
}

// Is lets errors.Is(err, ErrInput) match.
func (e *PolarityError) Is(target error) bool { return target == ErrInput }

// maxTooth bounds a tooth number before the plan is known; no hand-wound
// stator comes near it.
const maxTooth = 10000

// ParsePolarity reads one phase's observations as the check command takes
// them: the phase, "=", then each tooth number followed by its pole, N or S,
// separated by commas or spaces: "U=1S,2N,7N,8S". Letter case carries no
// meaning ("u=1s" is the same). It checks the form only; ValidatePolarity
// checks the teeth against the plan.
func ParsePolarity(s string) ([]PoleReading, error) {
	phase, list, ok := strings.Cut(s, "=")
	if !ok {
		return nil, &PolarityError{Token: strconv.Quote(s), Reason: "give the phase, =, then each tooth with the pole it showed: U=1S,2N,7N,8S"}
	}
	return ParsePhasePoles(phase, list)
}

// ParsePhasePoles reads the observations of one phase given apart from its
// name (the measurements file's form: U = "1S 2N 7N 8S").
func ParsePhasePoles(phase, list string) ([]PoleReading, error) {
	name := strings.ToUpper(strings.TrimSpace(phase))
	if name == "" || strings.IndexFunc(name, func(r rune) bool { return r < 'A' || r > 'Z' }) >= 0 {
		return nil, &PolarityError{Token: strconv.Quote(phase + "=" + list), Reason: "the phase is named by its letters, as on the leads: U, V or W"}
	}
	fields := strings.FieldsFunc(list, func(r rune) bool { return r == ',' || r == ' ' || r == '\t' || r == ';' })
	if len(fields) == 0 {
		return nil, &PolarityError{Token: strconv.Quote(name + "=" + list), Reason: "no teeth given; write each tooth with the pole it showed: " + name + "=1S,2N"}
	}
	out := make([]PoleReading, 0, len(fields))
	for _, f := range fields {
		token := name + "=" + f
		i := strings.IndexFunc(f, func(r rune) bool { return r < '0' || r > '9' })
		if i <= 0 {
			return nil, &PolarityError{Token: strconv.Quote(token), Reason: "write the tooth number, then its pole: 1N or 1S"}
		}
		n, err := strconv.Atoi(f[:i])
		if err != nil || n < 1 || n > maxTooth {
			return nil, &PolarityError{Token: strconv.Quote(token), Reason: "not a tooth number; teeth count from 1"}
		}
		var pole plan.Pole
		switch strings.ToUpper(f[i:]) {
		case "N":
			pole = plan.North
		case "S":
			pole = plan.South
		default:
			return nil, &PolarityError{Token: strconv.Quote(token), Reason: strconv.Quote(f[i:]) + " is not a pole: write N (north) or S (south) after the tooth number"}
		}
		out = append(out, PoleReading{Phase: name, Tooth: n, Pole: pole})
	}
	return out, nil
}

// ValidatePolarity refuses observations the plan cannot judge: a phase the
// plan does not have, a tooth it does not have or that is not wound, a tooth
// of another phase, a tooth given twice.
func ValidatePolarity(p *plan.Plan, obs []PoleReading) error {
	if p == nil || p.Layout == nil {
		return fmt.Errorf("%w: no plan or no layout", ErrUnsupported)
	}
	l := p.Layout
	seen := map[int]plan.Pole{}
	for _, o := range obs {
		token := strconv.Quote(o.Phase + "=" + strconv.Itoa(o.Tooth) + string(o.Pole))
		ph := -1
		for i, n := range l.PhaseNames {
			if n == o.Phase {
				ph = i
			}
		}
		switch c, wound := l.CoilOn(o.Tooth); {
		case ph < 0:
			return &PolarityError{Token: token, Reason: "the plan has no phase " + o.Phase + "; its phases are " + strings.Join(l.PhaseNames, ", ")}
		case o.Tooth > l.Spec.Slots:
			return &PolarityError{Token: token, Reason: fmt.Sprintf("the stator has %d teeth", l.Spec.Slots)}
		case !wound:
			return &PolarityError{Token: token, Reason: fmt.Sprintf("tooth %d carries no coil (single layer: the odd teeth are wound)", o.Tooth)}
		case c.Phase != ph:
			return &PolarityError{Token: token, Reason: fmt.Sprintf("tooth %d carries phase %s, not %s; phase %s is on teeth %s",
				o.Tooth, l.PhaseNames[c.Phase], o.Phase, o.Phase, toothList(p.PolesOf(o.Phase)))}
		}
		if _, twice := seen[o.Tooth]; twice {
			return &PolarityError{Token: token, Reason: fmt.Sprintf("tooth %d is given twice; give each tooth once", o.Tooth)}
		}
		seen[o.Tooth] = o.Pole
	}
	return nil
}

func toothList(tps []plan.ToothPole) string {
	n := make([]int, len(tps))
	for i, tp := range tps {
		n[i] = tp.Tooth
	}
	return winding.NumberList(n)
}

// PolarityResult is the polarity test of the phases read: each tooth as seen
// against the plan.
type PolarityResult struct {
	Phases []PhasePolarity `json:"phases"`
	// Reversed lists every tooth, of any phase, that showed the other pole.
	Reversed []int   `json:"reversed_teeth"`
	Verdict  Verdict `json:"verdict"`
}

// PhasePolarity is one phase's teeth as read.
type PhasePolarity struct {
	Phase    string      `json:"phase"`
	Teeth    []ToothSeen `json:"teeth"`              // the teeth read, in tooth order
	Reversed []int       `json:"reversed,omitempty"` // teeth showing the other pole
	NotRead  []int       `json:"not_read,omitempty"` // wound teeth of the phase not given
	// Pattern names what the reversed teeth fit: "coil" (one reversed coil),
	// "coils", "jumper" (two coils of a path wound in each other's place),
	// "leads" (every tooth reversed: start and finish swapped), "path-leads"
	// (every tooth of a path), "leads-and-coils"; empty when none.
	Pattern string  `json:"pattern,omitempty"`
	Verdict Verdict `json:"verdict"`
}

// ToothSeen is one tooth: the pole of the plan and the pole seen.
type ToothSeen struct {
	Tooth    int       `json:"tooth"`
	Expected plan.Pole `json:"expected"`
	Seen     plan.Pole `json:"seen"`
}

// polarity judges the observations (already validated) phase by phase.
func (c *checker) polarity() {
	res := &PolarityResult{Verdict: Pass, Reversed: []int{}}
	c.rep.Polarity = res
	c.rep.Cautions = append(c.rep.Cautions, plan.PolarityCaution)
	byPhase := map[string][]PoleReading{}
	for _, o := range c.r.Polarity {
		byPhase[o.Phase] = append(byPhase[o.Phase], o)
	}
	for _, name := range c.p.Layout.PhaseNames {
		obs, ok := byPhase[name]
		if !ok {
			continue
		}
		pp, f := judgePhasePolarity(c.p, name, obs)
		res.Phases = append(res.Phases, pp)
		res.Reversed = append(res.Reversed, pp.Reversed...)
		res.Verdict = Worst(res.Verdict, pp.Verdict)
		c.add(f)
	}
	sort.Ints(res.Reversed)
}

// judgePhasePolarity compares one phase's observations with the plan and
// says what a difference fits.
func judgePhasePolarity(p *plan.Plan, name string, obs []PoleReading) (PhasePolarity, Finding) {
	want := map[int]plan.ToothPole{}
	expected := p.PolesOf(name)
	for _, tp := range expected {
		want[tp.Tooth] = tp
	}
	pp := PhasePolarity{Phase: name, Verdict: Pass}
	seen := map[int]bool{}
	sort.Slice(obs, func(i, k int) bool { return obs[i].Tooth < obs[k].Tooth })
	for _, o := range obs {
		tp := want[o.Tooth]
		pp.Teeth = append(pp.Teeth, ToothSeen{Tooth: o.Tooth, Expected: tp.Pole, Seen: o.Pole})
		seen[o.Tooth] = true
		if o.Pole != tp.Pole {
			pp.Reversed = append(pp.Reversed, o.Tooth)
		}
	}
	for _, tp := range expected {
		if !seen[tp.Tooth] {
			pp.NotRead = append(pp.NotRead, tp.Tooth)
		}
	}
	f := Finding{Severity: Pass, Phase: name, Test: plan.TestPolarity}
	read := fmt.Sprintf("%d of %d teeth", len(pp.Teeth), len(expected))
	notRead := ""
	if len(pp.NotRead) > 0 {
		notRead = "; not read: tooth " + winding.NumberList(pp.NotRead)
	}
	rev := pp.Reversed
	switch {
	case len(rev) == 0 && len(pp.NotRead) == 0:
		f.Message = fmt.Sprintf("every tooth (%s) shows the pole of the plan", read)
	case len(rev) == 0:
		f.Severity = Warn
		f.Message = fmt.Sprintf("the %s read show the pole of the plan%s: read them too before the next phase covers their slots", read, notRead)
	case len(pp.NotRead) == 0 && len(rev) == len(expected):
		pp.Pattern = "leads"
		f.Severity, f.Teeth = Fail, rev
		f.Message = fmt.Sprintf("every tooth shows the other pole: the DC went in at %s2, or the leads %s1 and %s2 are swapped; no coil is reversed. "+
			"Check the supply's + is on %s1; if it was, the marks %s1 and %s2 belong the other way round", name, name, name, name, name, name)
	case len(pp.NotRead) == 0 && wholePaths(p, name, rev) != nil:
		paths := wholePaths(p, name, rev)
		pp.Pattern = "path-leads"
		f.Severity, f.Teeth = Fail, rev
		f.Message = fmt.Sprintf("every tooth of path %s shows the other pole (teeth %s): that path's start and finish leads are swapped; "+
			"join its other end to %s1 (no coil is reversed)", winding.NumberList(paths), winding.NumberList(rev), name)
	case len(pp.NotRead) == 0 && 2*len(rev) > len(expected):
		right := complement(expected, rev)
		pp.Pattern = "leads-and-coils"
		f.Severity, f.Teeth = Fail, rev
		f.Message = fmt.Sprintf("%d of %d teeth show the other pole (%s): this fits the leads %s1 and %s2 swapped (or the DC in at %s2) with the coil%s on tooth %s wound the wrong way round; "+
			"swap the supply's clips and read again", len(rev), len(expected), winding.NumberList(rev), name, name, name, plural(len(right), "", "s"), winding.NumberList(right))
	case len(rev) == 2 && jumperSwap(p, want, rev):
		a, b := want[rev[0]], want[rev[1]]
		pp.Pattern = "jumper"
		f.Severity, f.Teeth = Fail, rev
		f.Message = fmt.Sprintf("teeth %d and %d show the other pole: they follow each other on the path and are wound opposite ways, so this fits a jumper taken to the wrong tooth "+
			"(coils %d and %d wound in each other's place, steps %d and %d), or both coils wound the wrong way round; rewind them as planned%s",
			a.Tooth, b.Tooth, a.Coil, b.Coil, a.Step, b.Step, notRead)
	case len(rev) == 1:
		tp := want[rev[0]]
		seenPole := tp.Pole.Opposite()
		pp.Pattern = "coil"
		f.Severity, f.Tooth = Fail, tp.Tooth
		f.Message = fmt.Sprintf("tooth %d shows %s where the plan has %s: coil %d (step %d) is wound the wrong way round. %s%s",
			tp.Tooth, seenPole, tp.Pole, tp.Coil, tp.Step, remedy, notRead)
	default:
		var coils []string
		for _, t := range rev {
			tp := want[t]
			coils = append(coils, fmt.Sprintf("tooth %d (coil %d, step %d)", t, tp.Coil, tp.Step))
		}
		pp.Pattern = "coils"
		f.Severity, f.Teeth = Fail, rev
		f.Message = fmt.Sprintf("%d teeth show the other pole: %s are wound the wrong way round. %s%s",
			len(rev), strings.Join(coils, ", "), remedyEach, notRead)
	}
	pp.Verdict = f.Severity
	return pp, f
}

// remedy is what to do with a coil wound the wrong way round (common
// practice).
const remedy = "Rewind it in the planned sense; or, where a joint in the winding is acceptable, cut the wire at both its ends and join each end to the other's jumper (its start and finish swapped)"

// remedyEach is remedy for more than one coil.
const remedyEach = "Rewind each in the planned sense; or, where joints in the winding are acceptable, cut the wire at both ends of each and join each end to the other's jumper (its start and finish swapped)"

// wholePaths returns the paths of the phase whose every tooth is reversed
// when the reversed teeth are exactly those paths; nil otherwise (or when the
// phase has one path).
func wholePaths(p *plan.Plan, name string, rev []int) []int {
	if p.Layout.Spec.Paths < 2 {
		return nil
	}
	isRev := map[int]bool{}
	for _, t := range rev {
		isRev[t] = true
	}
	byPath := map[int][2]int{} // path -> reversed, total
	for _, tp := range p.PolesOf(name) {
		v := byPath[tp.Path]
		if isRev[tp.Tooth] {
			v[0]++
		}
		v[1]++
		byPath[tp.Path] = v
	}
	var paths []int
	for path, v := range byPath {
		switch v[0] {
		case v[1]:
			paths = append(paths, path)
		case 0:
		default:
			return nil
		}
	}
	sort.Ints(paths)
	return paths
}

// jumperSwap reports whether two reversed teeth follow each other on one
// path and are planned to be wound opposite ways: winding each in the
// other's place, after a jumper taken to the wrong tooth, reverses both.
func jumperSwap(p *plan.Plan, want map[int]plan.ToothPole, rev []int) bool {
	a, b := want[rev[0]], want[rev[1]]
	if a.Path != b.Path || a.Pole == b.Pole {
		return false
	}
	for _, ch := range p.Layout.Chains {
		for i := 1; i < len(ch.Teeth); i++ {
			x, y := ch.Teeth[i-1], ch.Teeth[i]
			if (x == a.Tooth && y == b.Tooth) || (x == b.Tooth && y == a.Tooth) {
				return true
			}
		}
	}
	return false
}

func complement(all []plan.ToothPole, rev []int) []int {
	isRev := map[int]bool{}
	for _, t := range rev {
		isRev[t] = true
	}
	var out []int
	for _, tp := range all {
		if !isRev[tp.Tooth] {
			out = append(out, tp.Tooth)
		}
	}
	return out
}

// text is the polarity part of the report: per phase, each tooth read as
// tooth, pole seen and, where it differs, the pole of the plan in brackets.
func (pr *PolarityResult) text() string {
	var b strings.Builder
	b.WriteString("Polarity    pole seen at each tooth with DC into X1 (plan in brackets where it differs)\n")
	for _, ph := range pr.Phases {
		parts := make([]string, len(ph.Teeth))
		for i, t := range ph.Teeth {
			parts[i] = strconv.Itoa(t.Tooth) + string(t.Seen)
			if t.Seen != t.Expected {
				parts[i] += "(" + string(t.Expected) + ")"
			}
		}
		wrap(&b, fmt.Sprintf("  %-5s %-4s  ", ph.Phase, ph.Verdict), strings.Join(parts, " "))
	}
	return b.String()
}

// polarityStepOf is the plan's polarity step the observations belong to:
// the step of their phase when they are of one phase, else the step that
// tests every phase; 0 when the plan has none.
func polarityStepOf(p *plan.Plan, obs []PoleReading) int {
	phases := map[string]bool{}
	for _, o := range obs {
		phases[o.Phase] = true
	}
	whole := 0
	for _, s := range p.Steps {
		if s.Kind != plan.StepTest || s.Test != plan.TestPolarity {
			continue
		}
		if len(s.Phases) == 1 && len(phases) == 1 && phases[s.Phases[0]] {
			return s.Index
		}
		if len(s.Phases) > 1 {
			whole = s.Index
		}
	}
	return whole
}
