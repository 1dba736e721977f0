package plan

import (
	"fmt"
	"strings"

	"coilwright/winding"
	"coilwright/winding/wire"
)

// Reading is one value a test asks the person to read: the schema of the
// test's readings, shared by the bench guide (its fields), the progress
// record (its keys), the check (what it judges) and the printed test record
// (its cells). It is plain data; a test lists its readings in the order they
// are taken.
type Reading struct {
	// Key is stable lower-case ASCII, unique within the test: "uv", "u1_u2",
	// "u1_u2_p2", "ir1", "temp". Records store values under it.
	Key string `json:"key"`
	// Label names the reading for people, with phase letters as printed on
	// the lead marks: "U–V", "U1–U2 path 2", "winding temperature".
	Label string `json:"label"`
	Unit  Unit   `json:"unit"`
	// Preset is filled in beforehand where the plan knows it (a test
	// voltage, the job's ambient temperature); nil when not.
	Preset *float64 `json:"preset,omitempty"`
	// Optional readings may be left out; 0 then means "not taken".
	Optional bool `json:"optional,omitempty"`
	// Expected is what the meter should show, where the plan can say.
	Expected *Expected `json:"expected,omitempty"`
}

// Expected is what a meter should show for one reading, in the reading's
// unit, at the job's ambient temperature, with the window a correct winding
// reads within.
type Expected struct {
	Value float64 `json:"value"`
	Low   float64 `json:"low"` // 0 when only High applies
	High  float64 `json:"high"`
	AtC   float64 `json:"at_c"` // the winding temperature the values are for
}

// The keys of the readings that are not named after phases (those are the
// lower-case phase names: "uv" for U–V, "u1_u2" for U1–U2, "u_v" for the
// insulation between U and V).
const (
	KeyTemp    = "temp"    // winding temperature, °C
	KeyVolts   = "volts"   // test voltage applied, V
	KeyIR1     = "ir1"     // insulation resistance after 1 min, MΩ
	KeyIR10    = "ir10"    // after 10 min, MΩ (polarization index)
	KeySeconds = "seconds" // how long the withstand voltage was held, s
	KeyPassed  = "passed"  // withstand result: 1 held, 0 broke down
	KeyRPM     = "rpm"     // speed of the rotor for the back-EMF, rpm
)

// PhaseKey is the key of a reading of one phase alone (a phase measured
// before the star point or delta corners are made): "u".
func PhaseKey(name string) string { return key(name) }

// key is the lower-case ASCII form of a phase name, for reading keys.
func key(name string) string {
	b := []byte(name)
	for i, c := range b {
		if c >= 'A' && c <= 'Z' {
			b[i] = c + 'a' - 'A'
		}
	}
	return string(b)
}

func preset(v float64) *float64 { return &v }

// LinePairs returns the m pairs of adjacent line terminals a meter is put
// across on a connected m-phase winding: U–V, V–W, W–U for three phases.
// Each pair is the index of its first phase; the second is the next one.
func LinePairs(names []string) [][2]int {
	m := len(names)
	if m < 2 {
		return nil
	}
	if m == 2 {
		return [][2]int{{0, 1}}
	}
	out := make([][2]int, m)
	for i := range names {
		out[i] = [2]int{i, (i + 1) % m}
	}
	return out
}

// LineOhms returns what a meter reads between adjacent line terminals
// (LinePairs order) of a connected winding whose phases, at their lead ends,
// are phase[i].
//
// Star: the reading between lines a and b goes out through phase a and back
// through phase b, R_ab = R_a + R_b (the star point is not brought out).
// Delta (ring of m phases, phase i between lines i and i+1): between adjacent
// lines the meter sees phase i in parallel with the other m−1 in series,
// R = R_i·(S − R_i)/S with S the sum of all phases; a balanced delta of three
// reads 2R/3. (Series and parallel resistance, any circuits text.)
func LineOhms(c winding.Connection, phase []float64) []float64 {
	pairs := LinePairs(make([]string, len(phase)))
	out := make([]float64, len(pairs))
	var sum float64
	for _, r := range phase {
		sum += r
	}
	for i, pr := range pairs {
		if c == winding.Star || len(phase) < 3 {
			out[i] = phase[pr[0]] + phase[pr[1]]
			continue
		}
		r := phase[pr[0]]
		out[i] = r * (sum - r) / sum
	}
	return out
}

// continuityReadings: one reading per path of every phase, from its start
// lead to its finish lead, read before the paths are joined.
func (b *builder) continuityReadings(band [2]float64) []Reading {
	p := b.p
	var out []Reading
	many := b.j.Winding.Paths > 1
	for _, pp := range p.Paths {
		r := Reading{
			Key:   key(pp.Phase) + "1_" + key(pp.Phase) + "2",
			Label: pp.Phase + "1–" + pp.Phase + "2",
			Unit:  UnitOhm,
		}
		if many {
			r.Key += fmt.Sprintf("_p%d", pp.Path)
			r.Label += fmt.Sprintf(" path %d", pp.Path)
		}
		amb := wire.ResistanceAt(pp.Ohm20C, p.AmbientC)
		r.Expected = &Expected{Value: amb, Low: amb * (1 + band[0]/100), High: ContinuityFactor * amb, AtC: p.AmbientC}
		out = append(out, r)
	}
	return out
}

// pairReadings: insulation between every pair of phases.
func pairReadings(names []string) []Reading {
	var out []Reading
	for i := range names {
		for k := i + 1; k < len(names); k++ {
			out = append(out, Reading{Key: key(names[i]) + "_" + key(names[k]), Label: names[i] + "–" + names[k], Unit: UnitMegaohm})
		}
	}
	return out
}

// lineReadings: the line-to-line resistances of the connected winding with
// what each should read at ambient (leads included, LineOhms), and the
// winding temperature.
func (b *builder) lineReadings(band [2]float64) []Reading {
	p := b.p
	names := p.Layout.PhaseNames
	phase := make([]float64, len(p.PhaseOhms))
	for i, ph := range p.PhaseOhms {
		phase[i] = ph.OhmAmbient
	}
	lines := LineOhms(p.Connection, phase)
	var out []Reading
	for i, pr := range LinePairs(names) {
		a, c := names[pr[0]], names[pr[1]]
		v := lines[i]
		out = append(out, Reading{Key: key(a) + key(c), Label: a + "–" + c, Unit: UnitOhm,
			Expected: &Expected{Value: v, Low: v * (1 + band[0]/100), High: v * (1 + band[1]/100), AtC: p.AmbientC}})
	}
	return append(out, Reading{Key: KeyTemp, Label: "winding temperature", Unit: UnitCelsius, Preset: preset(p.AmbientC)})
}

// insulationReadings: the insulation resistance to the core after 1 and 10
// minutes (the second for the polarization index, optional), the test
// voltage and the winding temperature.
func insulationReadings(p *Plan) []Reading {
	return []Reading{
		{Key: KeyIR1, Label: "IR after 1 min", Unit: UnitMegaohm},
		{Key: KeyVolts, Label: "test voltage (DC)", Unit: UnitVolt, Preset: preset(InsulationTestVolts)},
		{Key: KeyTemp, Label: "winding temperature", Unit: UnitCelsius, Preset: preset(p.AmbientC)},
		{Key: KeyIR10, Label: "IR after 10 min", Unit: UnitMegaohm, Optional: true},
	}
}

// withstandReadings: the voltage applied, how long it was held, and whether
// the winding held.
func withstandReadings(volts float64) []Reading {
	return []Reading{
		{Key: KeyVolts, Label: "applied (AC)", Unit: UnitVolt, Preset: preset(volts)},
		{Key: KeySeconds, Label: "held for", Unit: UnitSecond, Preset: preset(60)},
		{Key: KeyPassed, Label: "result", Unit: UnitPassFail},
	}
}

// emfReadings: the open-circuit line voltages and the speed.
func emfReadings(names []string) []Reading {
	var out []Reading
	for _, pr := range LinePairs(names) {
		a, c := names[pr[0]], names[pr[1]]
		out = append(out, Reading{Key: key(a) + key(c), Label: a + "–" + c, Unit: UnitVolt})
	}
	return append(out, Reading{Key: KeyRPM, Label: "speed", Unit: UnitRPM})
}

// TestNamed returns the plan's test of that name (one of the Test* keys).
func (p *Plan) TestNamed(name string) (Test, bool) {
	if p != nil {
		for _, t := range p.Tests {
			if t.Name == name {
				return t, true
			}
		}
	}
	return Test{}, false
}

// ReadingsFor is the reading schema test t is judged from: its own
// readings, or, for a test worked out from another's (ReadingsFrom), the
// readings of that test: the resistance balance is judged from the U–V,
// V–W, W–U readings and temperature of the resistance test. A nil plan
// gives t's own.
func (p *Plan) ReadingsFor(t Test) []Reading {
	if t.ReadingsFrom != "" && t.ReadingsFrom != t.Name {
		if src, ok := p.TestNamed(t.ReadingsFrom); ok {
			return src.Readings
		}
	}
	return t.Readings
}

// ReadingKeys lists the keys of a test's readings, in order.
func (t Test) ReadingKeys() []string {
	out := make([]string, len(t.Readings))
	for i, r := range t.Readings {
		out[i] = r.Key
	}
	return out
}

// ReadingLabels joins the labels of a test's readings: "U–V, V–W, W–U".
func ReadingLabels(rs []Reading) string {
	s := make([]string, len(rs))
	for i, r := range rs {
		s[i] = r.Label
	}
	return strings.Join(s, ", ")
}
