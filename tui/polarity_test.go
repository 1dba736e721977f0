package tui

import (
	"math"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/job"
	"coilwright/winding/plan"
)

// demoAtPolarity is the demo's guide with every step before phase U's
// polarity step done.
func demoAtPolarity(t *testing.T, w, h int) (*Model, *memRecorder, plan.Step) {
	t.Helper()
	p, err := plan.Build(job.Demo())
	if err != nil {
		t.Fatal(err)
	}
	rec := &memRecorder{}
	hist := stamped(p, doneUpTo(p, isPolarity))
	m := New(Options{Plan: p, Recorder: rec, History: hist, Now: fixedNow})
	drive(t, m, tea.WindowSizeMsg{Width: w, Height: h})
	s := curStep(m)
	if !isPolarity(s) || len(s.Phases) != 1 || s.Phases[0] != "U" {
		t.Fatalf("current step %d %q; want the polarity step of phase U", s.Index, s.Title)
	}
	return m, rec, s
}

// poleKeys are the keys that read the plan's poles of the given teeth, with
// the teeth in flip read the other way.
func poleKeys(teeth []plan.ToothPole, flip ...int) []string {
	f := map[int]bool{}
	for _, t := range flip {
		f[t] = true
	}
	out := make([]string, len(teeth))
	for i, tp := range teeth {
		pole := tp.Pole
		if f[tp.Tooth] {
			pole = pole.Opposite()
		}
		out[i] = strings.ToLower(string(pole))
	}
	return out
}

func TestPolarityWalkAllRight(t *testing.T) {
	m, rec, s := demoAtPolarity(t, 100, 30)
	teeth := polarityTeeth(m.c.plan, s)
	if len(teeth) != 8 || m.c.currentTooth() != teeth[0].Tooth {
		t.Fatalf("polarity step walks %d teeth, tooth in hand %d; want 8 starting at tooth %d", len(teeth), m.c.currentTooth(), teeth[0].Tooth)
	}
	v := plain(m)
	for _, want := range []string{"tooth 1  phase U  expect S (south)", "north end points AT the face", "1.3 A into U1 (+), out of U2 (-)", "current-limited", "n north", "s south", "x unsure"} {
		if !strings.Contains(v, want) {
			t.Errorf("polarity step view lacks %q:\n%s", want, v)
		}
	}
	keys(t, m, poleKeys(teeth)...)
	rec.flush()
	var readings []Entry
	for _, e := range rec.all() {
		if e.Kind == EntryReading {
			readings = append(readings, e)
		}
	}
	if len(readings) != 8 {
		t.Fatalf("%d reading entries after 8 keys; want one saved per key", len(readings))
	}
	last := readings[len(readings)-1]
	if last.Verdict != "pass" || last.Readings["tooth_1"] != -1 || last.Readings["tooth_2"] != 1 || len(last.Readings) != 8 || last.Test != plan.TestPolarity {
		t.Errorf("last reading %+v; want pass with tooth 1 S (-1), tooth 2 N (+1), all 8 teeth", last)
	}
	if first := readings[0]; first.Verdict != "warn" || len(first.Readings) != 1 {
		t.Errorf("first reading %+v; want warn with one tooth read", first)
	}
	if v := plain(m); !strings.Contains(v, "verdict: PASS") {
		t.Errorf("after every tooth the view lacks the verdict:\n%s", v)
	}
	if v := plain(m); !strings.Contains(v, "n note") {
		t.Errorf("every tooth read: the help line does not offer a note:\n%s", v)
	}
	keys(t, m, "n", "c", "l", "e", "a", "r", "enter")
	if got := m.c.prog.Steps[s.Index-1].Note; got != "clear" {
		t.Errorf("note on the polarity step = %q; want \"clear\"", got)
	}
	keys(t, m, "enter")
	if m.c.prog.Current() != s.Index {
		t.Errorf("enter after every tooth: current step %d; want the step after the polarity step (%d)", m.c.prog.Current()+1, s.Index+1)
	}
}

func TestPolarityWalkMismatch(t *testing.T) {
	m, _, s := demoAtPolarity(t, 80, 24)
	teeth := polarityTeeth(m.c.plan, s)
	// Tooth 7 (coil 3) read the wrong way; tooth 8 unsure.
	ks := poleKeys(teeth, 7)
	ks[3] = "x"
	keys(t, m, ks[:4]...)
	v := plain(m)
	for _, want := range []string{"tooth 7 shows S, plan N: coil 3 (step 9)", "Rewind", "7N!S", "8S?"} {
		if !strings.Contains(v, want) {
			t.Errorf("view after a mismatch lacks %q:\n%s", want, v)
		}
	}
	// bksp takes back tooth 8, which is read again.
	keys(t, m, "backspace")
	if got := m.c.currentTooth(); got != 8 {
		t.Errorf("after bksp the tooth in hand is %d; want 8", got)
	}
	keys(t, m, "s")
	keys(t, m, ks[4:]...)
	if v := plain(m); !strings.Contains(v, "verdict: FAIL") {
		t.Errorf("every tooth read with tooth 7 reversed: view lacks FAIL:\n%s", v)
	}
	if r := m.c.prog.Steps[s.Index-1].Reading; r == nil || r.Verdict != "fail" {
		t.Errorf("recorded verdict %+v; want fail", r)
	}
}

// A resumed guide reads the poles back from the record: the teeth read so
// far and the tooth in hand.
func TestPolarityResume(t *testing.T) {
	m, rec, s := demoAtPolarity(t, 80, 24)
	keys(t, m, "s", "n", "x")
	rec.flush()
	hist := append(stamped(m.c.plan, doneUpTo(m.c.plan, isPolarity)), rec.all()...)
	again := New(Options{Plan: m.c.plan, Recorder: &memRecorder{}, History: hist, Now: fixedNow})
	drive(t, again, tea.WindowSizeMsg{Width: 80, Height: 24})
	v := again.c.polarityValues(s)
	if v[0] != -1 || v[1] != 1 || v[2] != 0 || !math.IsNaN(v[3]) || again.c.currentTooth() != 8 {
		t.Errorf("resumed poles %v, tooth in hand %d; want S, N, unsure, not read, tooth 8", v, again.c.currentTooth())
	}
}

func TestPolarityStepSizes(t *testing.T) {
	for _, sz := range [][2]int{{60, 18}, {80, 24}, {120, 40}} {
		m, _, _ := demoAtPolarity(t, sz[0], sz[1])
		v := plain(m)
		if !strings.Contains(v, "expect S") || !strings.Contains(v, "tooth 1") {
			t.Errorf("%dx%d: polarity step hides the tooth in hand or its pole:\n%s", sz[0], sz[1], v)
		}
		for i, ln := range strings.Split(v, "\n") {
			if w := len([]rune(ln)); w > sz[0] {
				t.Errorf("%dx%d: line %d is %d wide", sz[0], sz[1], i, w)
			}
		}
	}
}

func TestGoldenPolarity(t *testing.T) {
	m, _, s := demoAtPolarity(t, 100, 30)
	keys(t, m, poleKeys(polarityTeeth(m.c.plan, s), 7)[:4]...)
	golden(t, "polarity_100x30.txt", plain(m)+"\n")
}

// The whole-stator step before the star point walks every phase in turn and
// says when to move the clips; the help line keeps the pole keys and enter at
// 80 columns.
func TestPolarityWholeStator(t *testing.T) {
	p, err := plan.Build(job.Demo())
	if err != nil {
		t.Fatal(err)
	}
	whole := func(s plan.Step) bool { return isPolarity(s) && len(s.Phases) > 1 }
	m := New(Options{Plan: p, Recorder: &memRecorder{}, History: stamped(p, doneUpTo(p, whole)), Now: fixedNow})
	drive(t, m, tea.WindowSizeMsg{Width: 80, Height: 24})
	s := curStep(m)
	if !whole(s) {
		t.Fatalf("current step %q; want the polarity test of every phase", s.Title)
	}
	teeth := polarityTeeth(p, s)
	if len(teeth) != 24 {
		t.Fatalf("whole-stator step walks %d teeth; want 24", len(teeth))
	}
	v := plain(m)
	for _, want := range []string{"clips on U1 (+) and U2 (-)", "n north", "enter step done"} {
		if !strings.Contains(v, want) {
			t.Errorf("whole-stator step lacks %q:\n%s", want, v)
		}
	}
	keys(t, m, poleKeys(teeth[:8])...)
	if v := plain(m); !strings.Contains(v, "clips on V1 (+) and V2 (-)") || !strings.Contains(v, "phase V") {
		t.Errorf("after phase U the step does not move the clips to V:\n%s", v)
	}
	keys(t, m, poleKeys(teeth[8:])...)
	keys(t, m, "enter")
	if r := m.c.prog.Steps[s.Index-1]; !r.Done || r.Reading == nil || r.Reading.Verdict != "pass" || len(r.Reading.Values) != 24 {
		t.Errorf("whole-stator step after 24 right poles: %+v; want done, pass, 24 values", r)
	}
}
