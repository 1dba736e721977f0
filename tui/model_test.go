package tui

import (
	"regexp"
	"strconv"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/plan"
)

var coilOfRE = regexp.MustCompile(`coil (\d+) of (\d+)`)

// newTest returns a sized guide on a hand-built 12/10 plan.
func newTest(t *testing.T, w, h int) (*Model, *memRecorder) {
	t.Helper()
	rec := &memRecorder{}
	m := New(Options{Plan: handPlan(t, 12, 10, 2), Recorder: rec, Now: fixedNow})
	drive(t, m, tea.WindowSizeMsg{Width: w, Height: h})
	return m, rec
}

// curStep is the current plan step.
func curStep(m *Model) plan.Step {
	s, _ := m.c.step(m.c.prog.Current())
	return s
}

// toNextCoil confirms check steps with enter until a coil step is current.
func toNextCoil(t *testing.T, m *Model) {
	t.Helper()
	for i := 0; i < 100; i++ {
		s := curStep(m)
		if s.Kind == plan.StepCoil || s.Index == 0 {
			return
		}
		if s.Kind == plan.StepTest {
			t.Fatalf("test step %d before the next coil", s.Index)
		}
		keys(t, m, "enter")
	}
	t.Fatal("no coil step reached")
}

// windCoil counts the planned turns with space and presses enter.
func windCoil(t *testing.T, m *Model) {
	t.Helper()
	toNextCoil(t, m)
	keys(t, m, repeat(" ", curStep(m).Coil.Turns)...)
	keys(t, m, "enter")
}

func TestOpensOnFirstStepAndReachesCoilOne(t *testing.T) {
	m, _ := newTest(t, 80, 24)
	if got := m.c.prog.Current(); got != 0 {
		t.Fatalf("current() = %d; want 0 (the first step)", got)
	}
	v := plain(m)
	if !strings.Contains(v, "deburr the slots") || !strings.Contains(v, "Press enter") {
		t.Errorf("first screen lacks the preparation step:\n%s", v)
	}
	if coilOfRE.MatchString(v) {
		t.Errorf("a check step shows %q; the words belong to coil steps only", coilOfRE.FindString(v))
	}
	keys(t, m, "enter")
	v = plain(m)
	if !strings.Contains(v, "coil 1 of 12") {
		t.Errorf("after confirming the preparation the screen lacks \"coil 1 of 12\":\n%s", v)
	}
	if !strings.Contains(v, "of 12 turns") {
		t.Errorf("coil screen lacks the planned turns:\n%s", v)
	}
}

// TestCoilWordsOnlyOnCoilSteps walks every step and checks that "coil N of
// M" shows exactly on coil steps, with N the coil's order.
func TestCoilWordsOnlyOnCoilSteps(t *testing.T) {
	m, _ := newTest(t, 100, 30)
	for i := 0; i < 200 && m.c.prog.Current() < len(m.c.steps()); i++ {
		s := curStep(m)
		v := plain(m)
		got := coilOfRE.FindAllStringSubmatch(v, -1)
		if s.Kind == plan.StepCoil {
			want := "coil " + strconv.Itoa(s.Coil.Order) + " of " + strconv.Itoa(s.Coil.Of)
			if len(got) != 1 || got[0][0] != want {
				t.Fatalf("step %d (coil) shows %v; want exactly %q", s.Index, got, want)
			}
			keys(t, m, repeat(" ", s.Coil.Turns)...)
			keys(t, m, "enter")
			continue
		}
		if len(got) != 0 {
			t.Fatalf("step %d (%s) shows %v; want no coil words", s.Index, s.Kind, got)
		}
		if s.Kind == plan.StepTest {
			keys(t, m, "enter")
			for range m.guide.fields {
				keys(t, m, "9", "0", "0", "enter")
			}
			keys(t, m, "enter")
			if !m.c.prog.Steps[s.Index-1].Done {
				t.Fatalf("test step %d not done after readings (mode %v, error %q)", s.Index, m.guide.mode, m.guide.inErr)
			}
			continue
		}
		keys(t, m, "enter")
	}
	if c := m.c.prog.Current(); c != len(m.c.steps()) {
		t.Fatalf("walk stopped at step %d of %d", c+1, len(m.c.steps()))
	}
	if v := plain(m); !strings.Contains(v, "all steps done") {
		t.Errorf("the end shows:\n%s", v)
	}
}

func TestTurnCounter(t *testing.T) {
	m, rec := newTest(t, 80, 24)
	toNextCoil(t, m)
	i := m.c.prog.Current()
	tests := []struct {
		name string
		keys []string
		want int
	}{
		{"space adds one", []string{" ", " ", " "}, 3},
		{"backspace takes one off", []string{"backspace"}, 2},
		{"digits change nothing until enter", []string{"1", "5"}, 2},
		{"enter sets the typed count", []string{"enter"}, 15},
		{"space after the typed count adds one", []string{" "}, 16},
		{"a digit after counting starts a typed count, the count stands", []string{"7"}, 16},
		{"esc drops it", []string{"esc"}, 16},
		{"q, n, u and o wait while a count is typed", []string{"3", "q", "n", "u", "o", "esc"}, 16},
		{"space while typing counts the wound turn", []string{"5", " "}, 17},
		{"backspace edits the typed count", []string{"backspace", "9", "enter"}, 9},
		{"never below zero", append(repeat("backspace", 12), "-"), 0},
		{"a sixth digit is not taken", []string{"1", "2", "3", "4", "5", "6", "enter"}, 12345},
		{"digits arriving in one message", []string{" ", "18", "enter"}, 18},
	}
	for _, tc := range tests {
		keys(t, m, tc.keys...)
		if got := m.c.prog.Steps[i].Turns; got != tc.want {
			t.Errorf("%s: turns = %d; want %d", tc.name, got, tc.want)
		}
	}
	if m.c.prog.Steps[i].Done {
		t.Fatal("the coil is done before enter")
	}
	// Every change went to the record as a turns entry.
	last := rec.all()[len(rec.all())-1]
	if last.Kind != EntryTurns || last.Turns != 18 {
		t.Errorf("last entry = %+v; want turns 18", last)
	}
}

func TestCountDifferentFromPlanAsksAndRecordsActual(t *testing.T) {
	m, rec := newTest(t, 80, 24)
	toNextCoil(t, m)
	s := curStep(m)
	keys(t, m, repeat(" ", s.Coil.Turns+1)...)
	keys(t, m, "enter")
	if m.guide.mode != modeConfirmTurns {
		t.Fatalf("mode = %v after enter with %d of %d turns; want confirm-turns", m.guide.mode, s.Coil.Turns+1, s.Coil.Turns)
	}
	if v := plain(m); !strings.Contains(v, "the plan says 12") {
		t.Errorf("confirmation not shown:\n%s", v)
	}
	keys(t, m, "esc")
	if m.guide.mode != modeWork || m.c.prog.Steps[s.Index-1].Done {
		t.Fatalf("esc: mode %v, done %v; want back to counting", m.guide.mode, m.c.prog.Steps[s.Index-1].Done)
	}
	keys(t, m, "enter", "y")
	if !m.c.prog.Steps[s.Index-1].Done {
		t.Fatal("coil not done after confirming")
	}
	es := rec.all()
	last := es[len(es)-1]
	if last.Kind != EntryDone || last.Turns != s.Coil.Turns+1 || last.Step != s.Index {
		t.Errorf("last entry = %+v; want done step %d with %d turns", last, s.Index, s.Coil.Turns+1)
	}
}

func TestUndoLastStep(t *testing.T) {
	m, _ := newTest(t, 80, 24)
	windCoil(t, m)
	before := m.c.prog.Current()
	keys(t, m, "u")
	if m.guide.mode != modeConfirmUndo {
		t.Fatalf("mode = %v after u; want confirm-undo", m.guide.mode)
	}
	keys(t, m, "n")
	if m.c.prog.Current() != before {
		t.Fatalf("n undid the step")
	}
	keys(t, m, "u", "y")
	s := curStep(m)
	if s.Kind != plan.StepCoil || s.Coil.Order != 1 {
		t.Fatalf("after undo the current step is %d (%s); want coil 1", s.Index, s.Kind)
	}
	if got := m.c.prog.Steps[s.Index-1].Turns; got != s.Coil.Turns {
		t.Errorf("undone coil shows %d turns; want the %d it had", got, s.Coil.Turns)
	}
}

func TestNoteTakesTypedKeys(t *testing.T) {
	m, _ := newTest(t, 80, 24)
	toNextCoil(t, m)
	keys(t, m, "n")
	for _, r := range "q? o loose turn" {
		keys(t, m, string(r))
	}
	if m.quitting || m.screen != screenGuide {
		t.Fatalf("typing a note quit or left the guide (quitting %v, screen %v)", m.quitting, m.screen)
	}
	keys(t, m, "enter")
	i := m.c.prog.Current()
	if got := m.c.prog.Steps[i].Note; got != "q? o loose turn" {
		t.Errorf("note = %q; want %q", got, "q? o loose turn")
	}
	if !strings.Contains(plain(m), "q? o loose turn") {
		t.Error("the note is not shown on the coil")
	}
}

func TestQuitWaitsForTheRecord(t *testing.T) {
	m, rec := newTest(t, 80, 24)
	toNextCoil(t, m)
	rec.setFail(errDiskFull)
	keys(t, m, " ", " ")
	if got := m.c.prog.Steps[m.c.prog.Current()].Turns; got != 2 {
		t.Fatalf("turns = %d; want 2 kept in memory", got)
	}
	v := plain(m)
	if !strings.Contains(v, "NOT SAVED") || !strings.Contains(v, "no space left") {
		t.Errorf("write error not shown:\n%s", v)
	}
	_, cmd := m.Update(press("q"))
	if cmd != nil {
		if _, ok := cmd().(tea.QuitMsg); ok {
			t.Fatal("q quit with unsaved progress")
		}
	}
	rec.setFail(nil)
	drive(t, m, retryMsg{})
	if m.c.out.err != nil || m.c.out.pending() != 0 {
		t.Fatalf("after the retry: err %v, pending %d; want saved", m.c.out.err, m.c.out.pending())
	}
	es := rec.all()
	var turns []int
	for _, e := range es {
		if e.Kind == EntryTurns {
			turns = append(turns, e.Turns)
		}
	}
	if len(turns) != 2 || turns[0] != 1 || turns[1] != 2 {
		t.Errorf("turn entries = %v; want [1 2] once each, in order", turns)
	}
}

func TestResumeFromHistory(t *testing.T) {
	m, rec := newTest(t, 80, 24)
	windCoil(t, m)
	windCoil(t, m)
	toNextCoil(t, m)
	keys(t, m, " ", " ", " ", " ", " ")
	m2 := New(Options{Plan: m.c.plan, Recorder: &memRecorder{}, History: rec.all(), Now: fixedNow})
	drive(t, m2, tea.WindowSizeMsg{Width: 80, Height: 24})
	if a, b := m.c.prog.Current(), m2.c.prog.Current(); a != b {
		t.Fatalf("resumed at step %d; want %d", b+1, a+1)
	}
	v := plain(m2)
	if !strings.Contains(v, "coil 3 of 12") || !strings.Contains(v, "7 to go") {
		t.Errorf("resumed screen lacks coil 3 with 5 turns counted:\n%s", v)
	}
}

func TestGlobalKeys(t *testing.T) {
	m, _ := newTest(t, 80, 24)
	keys(t, m, "?")
	if m.screen != screenHelp || !strings.Contains(plain(m), "keys") {
		t.Fatalf("? shows %v; want help", m.screen)
	}
	keys(t, m, "esc", "o")
	if m.screen != screenOverview {
		t.Fatalf("o shows %v; want overview", m.screen)
	}
	v := plain(m)
	for _, want := range []string{"[>]", "connection order", "phase U path 1: U1 > 1+U > 2-U", "join U2+V2+W2"} {
		if !strings.Contains(v+m.overview.content(), want) {
			t.Errorf("overview lacks %q", want)
		}
	}
	keys(t, m, "esc")
	if m.screen != screenGuide {
		t.Fatalf("esc shows %v; want guide", m.screen)
	}
	_, cmd := m.Update(press("q"))
	m.Update(nil)
	if !m.quitting {
		t.Fatal("q did not quit")
	}
	_ = cmd
}

func TestTestStepReadings(t *testing.T) {
	m, rec := newTest(t, 100, 30)
	for m.c.prog.Current() < len(m.c.steps()) && curStep(m).Test != plan.TestInsulation {
		switch s := curStep(m); {
		case s.Kind == plan.StepCoil:
			windCoil(t, m)
		case s.Kind == plan.StepTest:
			m.c.record(Entry{Kind: EntryDone, Step: s.Index})
		default:
			keys(t, m, "enter")
		}
	}
	s := curStep(m)
	if v := plain(m); !strings.Contains(v, "CAUTION") {
		t.Errorf("the 500 V test shows no caution:\n%s", v)
	}
	keys(t, m, "enter", "a", "b", "c", "enter", "enter", "enter", "enter")
	if m.guide.inErr == "" || m.guide.mode != modeReadings || m.guide.focus != 0 {
		t.Fatalf("a non-number gave mode %v, error %q, focus %d; want an error on field 0", m.guide.mode, m.guide.inErr, m.guide.focus)
	}
	// IR after 1 min, test voltage and temperature (preset), IR after 10 min
	// (optional, left empty).
	keys(t, m, "backspace", "backspace", "backspace", "2", ".", "5", "enter", "enter", "enter", "enter")
	if m.guide.mode != modeVerdict || m.guide.verdict.Level != "fail" {
		t.Fatalf("2.5 Mohm against min 5: mode %v verdict %+v; want a fail verdict", m.guide.mode, m.guide.verdict)
	}
	if !strings.Contains(plain(m), "verdict: FAIL") {
		t.Errorf("verdict not on screen:\n%s", plain(m))
	}
	keys(t, m, "enter") // a failed test is recorded only with y
	if m.c.prog.Steps[s.Index-1].Done || m.guide.mode != modeVerdict || !strings.Contains(m.guide.flash, "y records it as failed") {
		t.Fatalf("enter on a FAIL verdict: done %v, mode %v, flash %q; want the verdict still shown and y asked for",
			m.c.prog.Steps[s.Index-1].Done, m.guide.mode, m.guide.flash)
	}
	keys(t, m, "y")
	if !m.c.prog.Steps[s.Index-1].Done {
		t.Fatal("the test step is not done after recording")
	}
	es := rec.all()
	r := es[len(es)-2]
	if r.Kind != EntryReading || r.Verdict != "fail" || len(r.Readings) != 4 || r.Readings[plan.KeyIR1] != 2.5 || r.Readings[plan.KeyVolts] != 500 || r.Readings[plan.KeyIR10] != 0 {
		t.Errorf("reading entry = %+v; want 2.5 MΩ at 500 V, IR10 not taken (0), fail", r)
	}
}

func TestSizes(t *testing.T) {
	m := New(Options{Plan: handPlan(t, 12, 10, 2), Now: fixedNow})
	if v := m.View(); !strings.Contains(v, "waiting for the terminal size") {
		t.Errorf("before the first size: %q", v)
	}
	keys(t, m, "enter") // keys before the size must not panic
	for _, sz := range [][2]int{{0, 0}, {1, 1}, {24, 7}, {59, 17}, {60, 18}, {80, 24}, {200, 60}, {24, 7}, {100, 30}} {
		drive(t, m, tea.WindowSizeMsg{Width: sz[0], Height: sz[1]})
		v := m.View()
		lines := strings.Split(v, "\n")
		if sz[1] > 0 && len(lines) > sz[1] {
			t.Errorf("%dx%d: %d lines", sz[0], sz[1], len(lines))
		}
		for _, l := range lines {
			if w := lipglossWidth(l); w > sz[0] {
				t.Errorf("%dx%d: line %q is %d wide", sz[0], sz[1], l, w)
			}
		}
		small := sz[0] < minWidth || sz[1] < minHeight
		if small && sz[0] >= 24 && !strings.Contains(v, "Enlarge") {
			t.Errorf("%dx%d: no enlarge message:\n%s", sz[0], sz[1], v)
		}
		if !small && !strings.Contains(ansiStrip(v), "coil") {
			t.Errorf("%dx%d: the guide is not shown:\n%s", sz[0], sz[1], v)
		}
	}
}

func TestAllSizesAllScreensNoPanic(t *testing.T) {
	m, _ := newTest(t, 80, 24)
	windCoil(t, m)
	for _, scr := range []string{"", "o", "?"} {
		if scr != "" {
			keys(t, m, scr)
		}
		for w := 0; w <= 130; w += 7 {
			for h := 0; h <= 40; h += 5 {
				drive(t, m, tea.WindowSizeMsg{Width: w, Height: h})
				_ = m.View()
			}
		}
		keys(t, m, "esc")
	}
}

// A record made for one plan, replayed on a plan whose steps changed (the
// job was edited: other teeth now stand at those steps), leaves out the coil
// entries that no longer fit and says so, instead of marking the wrong coils
// wound.
func TestRecordOfAChangedJob(t *testing.T) {
	m, rec := newTest(t, 80, 24)
	windCoil(t, m)
	windCoil(t, m)
	events := rec.all()
	// 9/6 winds U on teeth 1, 4, 7: the first coil still fits, the second
	// (tooth 2 in the record) does not.
	other := handPlan(t, 9, 6, 2)
	m2 := New(Options{Plan: other, History: events, Now: fixedNow})
	drive(t, m2, tea.WindowSizeMsg{Width: 80, Height: 24})
	if got := m2.c.prog.CoilsDone(); got != 1 {
		t.Errorf("coils done on the changed plan = %d; want 1", got)
	}
	if m2.ignored == 0 || !strings.Contains(plain(m2), "left out") {
		t.Errorf("ignored %d; screen lacks the notice:\n%s", m2.ignored, plain(m2))
	}
	// The same record on its own plan still resumes.
	m3 := New(Options{Plan: m.c.plan, History: events, Now: fixedNow})
	if got := m3.c.prog.CoilsDone(); got != 2 || m3.ignored != 0 {
		t.Errorf("own plan: coils done %d, ignored %d; want 2, 0", got, m3.ignored)
	}
}
