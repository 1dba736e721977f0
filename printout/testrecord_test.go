package printout

import (
	"slices"
	"strings"
	"testing"
	"time"

	"coilwright/winding/job/jobtest"
	"coilwright/winding/plan"
)

// recordTexts reads back the text runs of the test record sheets.
func recordTexts(t *testing.T, p *plan.Plan, o Options) []string {
	t.Helper()
	return sheetTexts(t, p, o, TestRecordPage)
}

// The test record has one cell per reading of the plan's schema, with the
// value a meter shows between the line terminals worked out here from the
// plan's phase resistances: star, two phases in series (R_U + R_V); delta of
// three, one phase in parallel with the other two in series, R·2R/3R = 2R/3
// for equal phases (series and parallel resistance, any circuits text).
func TestTestRecordLineToLineCells(t *testing.T) {
	for _, tc := range []struct {
		name  string
		delta bool
	}{{"star", false}, {"delta", true}} {
		t.Run(tc.name, func(t *testing.T) {
			p, err := plan.Build(jobtest.DemoVariant(jobtest.Variant{Slots: 24, Poles: 28, Layers: 2, Paths: 1, Phases: 3, Delta: tc.delta, TurnsPerCoil: 18}))
			if err != nil {
				t.Fatal(err)
			}
			texts := recordTexts(t, p, Options{})
			for _, cell := range []string{"U–V", "V–W", "W–U", "winding temperature", "U1–U2", "V1–V2", "W1–W2", "meter (make, model)", "serial"} {
				if !slices.Contains(texts, cell) {
					t.Errorf("test record lacks the cell %q", cell)
				}
			}
			ph := map[string]float64{}
			for _, o := range p.PhaseOhms {
				ph[o.Phase] = o.OhmAmbient
			}
			var want float64
			if tc.delta {
				r, sum := ph["U"], ph["U"]+ph["V"]+ph["W"]
				want = r * (sum - r) / sum
			} else {
				want = ph["U"] + ph["V"]
			}
			if !slices.Contains(texts, plan.FormatValue(want, plan.UnitOhm)) {
				t.Errorf("test record lacks the U–V value the meter shows, %s (%s)", plan.FormatValue(want, plan.UnitOhm), tc.name)
			}
			all := strings.Join(texts, " ")
			how := map[bool]string{false: "star: two phases in series", true: "delta: one phase in parallel with the other 2 in series"}[tc.delta]
			if !strings.Contains(all, how) {
				t.Errorf("test record does not say how a %s reads line to line (%q)", tc.name, how)
			}
			if other := map[bool]string{false: "delta:", true: "star:"}[tc.delta]; strings.Contains(all, other) {
				t.Errorf("%s test record speaks of %q", tc.name, other)
			}
			for _, want := range []string{"test: 570 V AC, 60 s, no breakdown", "test: 500 V DC, read after 1 min"} {
				if !tc.delta && !slices.Contains(texts, want) {
					t.Errorf("test record lacks the conditions %q", want)
				}
			}
		})
	}
}

// Readings filled from a record print each with its own unit, and the
// results the check works out from them: phase values at 20 °C with their
// deviation, the imbalance and the verdict.
func TestTestRecordFilledFromRecord(t *testing.T) {
	p := demoPlan(t)
	res, _ := p.TestNamed(plan.TestResistance)
	if len(res.Readings) < 4 {
		t.Fatalf("demo resistance test has readings %v; want U–V, V–W, W–U and temperature", res.Readings)
	}
	taken := time.Date(2026, 11, 21, 9, 0, 0, 0, time.UTC)
	texts := recordTexts(t, p, Options{Readings: map[string]Reading{
		plan.TestResistance:  {Values: map[string]float64{"uv": 0.2855, "vw": 0.2861, "wu": 0.2858, "temp": 15}, Taken: taken, Verdict: "pass"},
		plan.TestInsulation:  {Values: map[string]float64{"ir1": 200, "ir10": 600, "temp": 15, "volts": 500}, Verdict: "pass"},
		plan.TestHighVoltage: {Values: map[string]float64{"volts": 570, "seconds": 60, "passed": 1}, Verdict: "pass"},
	}})
	all := strings.Join(texts, "\n")
	for _, want := range []string{"285.5 mΩ", "286.1 mΩ", "15 °C", "200 MΩ", "600 MΩ", "500 V", "570 V", "60 s", "held", "imbalance", "verdict: pass", "taken 2026-11-21"} {
		if !strings.Contains(all, want) {
			t.Errorf("test record filled from a record lacks %q", want)
		}
	}
	if !strings.Contains(all, "phases at 20 °C: U ") {
		t.Errorf("test record lacks the phase values at 20 °C")
	}
	for _, bad := range []string{"volts 570", "Mohm", "ohm", "ir1 200"} {
		if strings.Contains(all, bad) {
			t.Errorf("test record prints %q", bad)
		}
	}
}

// A five-phase pack follows the job's phase count: it never says "three",
// and its cells name five line pairs.
func TestFivePhasePackNeverSaysThree(t *testing.T) {
	p, err := plan.Build(jobtest.DemoVariant(jobtest.Variant{Slots: 20, Poles: 18, Layers: 2, Paths: 1, Phases: 5, TurnsPerCoil: 18}))
	if err != nil {
		t.Fatal(err)
	}
	all := sheetTexts(t, p, Options{})
	for _, s := range all {
		if strings.Contains(strings.ToLower(s), "three") {
			t.Errorf("five-phase pack says %q", s)
		}
	}
	names := p.Layout.PhaseNames
	for i := range names {
		pair := names[i] + "–" + names[(i+1)%len(names)]
		if !slices.Contains(all, pair) {
			t.Errorf("five-phase test record lacks the cell %q", pair)
		}
	}
}

// A test with more readings than a sheet holds (the polarity of every tooth
// of a large stator) flows on over sheets: every reading keeps its cell,
// nothing leaves the body, no words overlap.
func TestTestRecordLongTestFlows(t *testing.T) {
	j := jobtest.DemoVariant(jobtest.Variant{Slots: 72, Poles: 66, Layers: 2, Paths: 1, Phases: 3, TurnsPerCoil: 6})
	j.Stator.DiameterMM = 450 // room for 72 teeth of the demo's width
	p, err := plan.Build(j)
	if err != nil {
		t.Fatal(err)
	}
	most := 0
	for _, tt := range p.Tests {
		most = max(most, len(tt.Readings))
	}
	if most < 60 {
		t.Fatalf("72/66 plan: the longest test has %d readings; want one per tooth", most)
	}
	pk, err := Build(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	b := &builder{p: p, paper: A4}
	var texts []string
	for _, pg := range pagesOf(pk, TestRecordPage) {
		texts = append(texts, pg.Texts()...)
		if o := overlappingTexts(pg); len(o) > 0 {
			t.Errorf("%q: %d words overlap, first %s", pg.Title, len(o), o[0])
		}
		for _, s := range pg.Shapes {
			_, y0, _, y1 := s.bounds()
			if tx, ok := s.(*Text); ok && (tx.Y < b.top() || y1 > pg.H-marginMM-footerH) {
				continue // header and footer
			}
			if l, ok := s.(*Line); ok && l.From.Y == l.To.Y && (l.From.Y < b.top() || l.From.Y > b.bottom()) && l.To.X-l.From.X > pg.W-2*marginMM-1 {
				continue // the rules of the header and footer
			}
			if y0 < b.top()-0.01 || y1 > b.bottom()+0.01 {
				t.Errorf("%q: %T at y %.1f..%.1f leaves the body %.1f..%.1f", pg.Title, s, y0, y1, b.top(), b.bottom())
			}
		}
	}
	for _, tt := range p.Tests {
		for _, r := range tt.Readings {
			if !slices.Contains(texts, r.Label) {
				t.Errorf("test %s lacks the cell %q", tt.Name, r.Label)
			}
		}
	}
}
