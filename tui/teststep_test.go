package tui

import (
	"bytes"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/job"
	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// demoAt opens the demo guide at 80x24 with every step before the first
// matching one done.
func demoAt(t *testing.T, match func(plan.Step) bool, bell *bytes.Buffer) (*Model, *memRecorder, *plan.Plan) {
	t.Helper()
	p, err := plan.Build(job.Demo())
	if err != nil {
		t.Fatal(err)
	}
	var h []Entry
	for _, e := range doneUpTo(p, match) {
		h = append(h, progress.Stamp(p, e))
	}
	rec := &memRecorder{}
	o := Options{Plan: p, Recorder: rec, History: h, Now: fixedNow}
	if bell != nil {
		o.Bell = bell
	}
	m := New(o)
	drive(t, m, tea.WindowSizeMsg{Width: 80, Height: 24})
	return m, rec, p
}

func TestResistanceFieldsShowWhatTheMeterShows(t *testing.T) {
	m, _, p := demoAt(t, func(s plan.Step) bool { return s.Test == plan.TestResistance }, nil)
	keys(t, m, "enter")
	v := plain(m)
	res, _ := p.TestNamed(plan.TestResistance)
	for i, r := range res.Readings {
		if r.Expected == nil {
			continue
		}
		want := r.Label + "  " // the field, then what it should read beside it
		if !strings.Contains(v, r.Label) || !strings.Contains(v, expectText(res, i, false)) || !strings.Contains(v, "expect "+plan.FormatValue(r.Expected.Value, r.Unit)) {
			t.Errorf("the resistance fields lack %q with %q:\n%s", want, expectText(res, i, false), v)
		}
	}
	if p.Connection.String() == "star" && !strings.Contains(v, "U–V") {
		t.Errorf("no U–V field on a star winding:\n%s", v)
	}
}

func TestBalanceJudgedFromTheResistanceReadings(t *testing.T) {
	m, rec, _ := demoAt(t, func(s plan.Step) bool { return s.Test == plan.TestResistance }, nil)
	keys(t, m, "enter")
	for _, r := range []string{"0.2855", "0.2858", "0.2861"} {
		keys(t, m, strings.Split(r, "")...)
		keys(t, m, "enter")
	}
	keys(t, m, "enter") // the winding temperature: the preset stands
	keys(t, m, "y")
	if s := curStep(m); s.Test != plan.TestBalance {
		t.Fatalf("after the resistance readings the step is %d (%s); want the balance", s.Index, s.Test)
	}
	n := len(rec.all())
	keys(t, m, "enter")
	if m.guide.mode != modeVerdict {
		t.Fatalf("enter on the balance: mode %v; want the verdict of the readings already recorded", m.guide.mode)
	}
	if v := plain(m); !strings.Contains(v, "285.5 mΩ") || !strings.Contains(v, "286.1 mΩ") {
		t.Errorf("the balance does not show the resistance readings:\n%s", v)
	}
	keys(t, m, "y")
	got := rec.all()[n:]
	if len(got) < 1 || got[0].Kind != EntryReading || got[0].Readings["wu"] != 0.2861 {
		t.Errorf("balance recorded %+v; want a reading with wu = 0.2861 from the resistance step", got)
	}
}

func TestOptionalTestSkipped(t *testing.T) {
	m, rec, p := demoAt(t, func(s plan.Step) bool { return s.Test == plan.TestBackEMF }, nil)
	if v := plain(m); !strings.Contains(v, "s to skip") {
		t.Errorf("the optional test does not say it can be skipped:\n%s", v)
	}
	keys(t, m, "s")
	all := rec.all()
	last := all[len(all)-1]
	i := len(p.Steps) - 1
	if last.Kind != EntryDone || !last.Skipped || !m.c.prog.Steps[i].Done || !m.c.prog.Steps[i].Skipped {
		t.Errorf("s on the optional test recorded %+v, state %+v; want done and skipped", last, m.c.prog.Steps[i])
	}
	if m.c.prog.DoneCount() != len(p.Steps) {
		t.Errorf("%d of %d steps done after skipping the last; want all", m.c.prog.DoneCount(), len(p.Steps))
	}
	// A test that is not optional cannot be skipped.
	m, rec, _ = demoAt(t, func(s plan.Step) bool { return s.Test == plan.TestInsulation }, nil)
	n := len(rec.all())
	keys(t, m, "s")
	if len(rec.all()) != n {
		t.Errorf("s on the insulation test recorded %+v", rec.all()[n:])
	}
}

func TestBellWhenTheCountReachesThePlan(t *testing.T) {
	var bell bytes.Buffer
	m, _, _ := demoAt(t, func(s plan.Step) bool { return s.Coil != nil }, &bell)
	want := curStep(m).Coil.Turns
	keys(t, m, repeat(" ", want-1)...)
	if bell.Len() != 0 {
		t.Fatalf("bell rang %q before the count reached the plan", bell.String())
	}
	keys(t, m, " ")
	if bell.String() != "\a" {
		t.Errorf("bell at the planned count = %q; want one BEL", bell.String())
	}
	keys(t, m, " ", "backspace", "b", "backspace", " ")
	if bell.String() != "\a\a" {
		t.Errorf("bell after going over and back = %q; want a second BEL, and none once turned off", bell.String())
	}
}

func TestPastedNoteKeepsEveryWord(t *testing.T) {
	m, _ := newTest(t, 80, 24)
	toNextCoil(t, m)
	keys(t, m, "n")
	note := "liner in slot 4 torn, replaced; two turns rewound"
	drive(t, m, tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune(note), Paste: true})
	keys(t, m, "enter")
	if got := m.c.prog.Steps[m.c.prog.Current()].Note; got != note {
		t.Errorf("pasted note = %q; want %q", got, note)
	}
}
