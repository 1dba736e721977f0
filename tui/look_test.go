package tui

import (
	"slices"
	"strings"
	"testing"

	"coilwright/winding/plan"
)

// woundTwo is a guide on the 12/10 plan with coil 1 wound with 11 turns
// (plan 12) and a note, coil 2 wound as planned, and coil 3 in hand.
func woundTwo(t *testing.T, w, h int) (*Model, *memRecorder) {
	t.Helper()
	m, rec := newTest(t, w, h)
	toNextCoil(t, m)
	keys(t, m, "n")
	for _, r := range "last turn loose, pressed down" {
		keys(t, m, string(r))
	}
	keys(t, m, "enter", "1", "1", "enter", "enter", "y")
	windCoil(t, m)
	toNextCoil(t, m)
	if s := curStep(m); s.Coil == nil || s.Coil.Order != 3 {
		t.Fatalf("current step %d is not coil 3", s.Index)
	}
	return m, rec
}

// snapshot is the progress as plain values, to compare before and after.
type snapshot struct {
	done  []bool
	turns []int
	notes []string
	cur   int
}

func snap(m *Model) snapshot {
	var sn snapshot
	for _, st := range m.c.prog.Steps {
		sn.done, sn.turns, sn.notes = append(sn.done, st.Done), append(sn.turns, st.Turns), append(sn.notes, st.Note)
	}
	sn.cur = m.c.prog.Current()
	return sn
}

func (a snapshot) equal(b snapshot) bool {
	return slices.Equal(a.done, b.done) && slices.Equal(a.turns, b.turns) && slices.Equal(a.notes, b.notes) && a.cur == b.cur
}

func TestLookBackChangesNothing(t *testing.T) {
	m, rec := woundTwo(t, 80, 24)
	before, entries := snap(m), len(rec.all())
	cur := m.c.prog.Current()
	keys(t, m, "left", "[")
	at, ok := m.guide.lookedAt()
	if !ok || at != cur-2 {
		t.Fatalf("lookedAt() = %d, %v after two steps back from %d; want %d, true", at, ok, cur, cur-2)
	}
	// Every key that would change progress does nothing while looking
	// (but space: see TestSpaceWhileLookingCountsTheTurn).
	keys(t, m, "5", "backspace", "-", "n", "x", "18")
	if got := snap(m); !got.equal(before) {
		t.Errorf("progress changed while looking:\n got  %+v\n want %+v", got, before)
	}
	if got := len(rec.all()); got != entries {
		t.Errorf("entries recorded while looking = %d; want none (%v)", got-entries, rec.all()[entries:])
	}
	if m.guide.mode != modeWork {
		t.Errorf("mode = %v while looking; want work (n opens no note)", m.guide.mode)
	}
	if at2, ok := m.guide.lookedAt(); !ok || at2 != at {
		t.Errorf("lookedAt() = %d, %v after ignored keys; want %d, true", at2, ok, at)
	}
	if v := plain(m); !strings.Contains(v, "only looking at step") {
		t.Errorf("an ignored key does not say why:\n%s", v)
	}
	keys(t, m, "esc")
	if _, ok := m.guide.lookedAt(); ok || m.guide.shown() != cur {
		t.Errorf("esc: still looking (shown %d); want back at step %d", m.guide.shown()+1, cur+1)
	}
	if v := plain(m); strings.Contains(v, "looking at step") {
		t.Errorf("the banner stays after esc:\n%s", v)
	}
	if got := len(rec.all()); got != entries {
		t.Errorf("esc recorded %d entries; want none", got-entries)
	}
}

func TestLookBackKeysReturn(t *testing.T) {
	for _, k := range []string{"esc", "home", "enter"} {
		t.Run(k, func(t *testing.T) {
			m, rec := woundTwo(t, 80, 24)
			before, entries := snap(m), len(rec.all())
			keys(t, m, "left", k)
			if _, ok := m.guide.lookedAt(); ok {
				t.Errorf("%s does not end the look", k)
			}
			if got := snap(m); !got.equal(before) || len(rec.all()) != entries {
				t.Errorf("%s changed progress or recorded %d entries", k, len(rec.all())-entries)
			}
		})
	}
}

func TestLookAtDoneCoilShowsItsRecord(t *testing.T) {
	m, _ := woundTwo(t, 100, 30) // wide enough for the banner on one line
	first := 0
	for i, s := range m.c.steps() {
		if s.Coil != nil && s.Coil.Order == 1 {
			first = i
			break
		}
	}
	for m.guide.shown() > first {
		keys(t, m, "left")
	}
	v := plain(m)
	for _, want := range []string{
		"looking at step 2 of 34 (done, 11 turns counted, plan 12)",
		"back to step 6 in hand",
		"coil 1 of 12",
		"wound 1 short",
		"last turn loose, pressed down",
		"*1+U", // the tooth looked at
		"@7-U", // the tooth in hand still shows
		"* looking",
	} {
		if !strings.Contains(v, want) {
			t.Errorf("looking at coil 1 the screen lacks %q:\n%s", want, v)
		}
	}
	if strings.Contains(v, "to go") || strings.Contains(v, "= plan, enter") {
		t.Errorf("a finished coil is shown as if in hand:\n%s", v)
	}
	// Stepping forward onto the current step ends the look; one more looks
	// ahead.
	for range m.c.prog.Current() - first {
		keys(t, m, "right")
	}
	if _, ok := m.guide.lookedAt(); ok {
		t.Errorf("still looking after stepping forward onto the current step")
	}
	keys(t, m, "right")
	if at, ok := m.guide.lookedAt(); !ok || at != m.c.prog.Current()+1 {
		t.Errorf("lookedAt() = %d, %v one step past the current; want %d, true", at, ok, m.c.prog.Current()+1)
	}
}

func TestLookAheadShowsTheStep(t *testing.T) {
	m, rec := newTest(t, 80, 24)
	toNextCoil(t, m) // coil 1 at step 2
	entries := len(rec.all())
	keys(t, m, "right")
	v := plain(m)
	for _, want := range []string{"looking at step 3 of 34 (to do)", "carry the wire from tooth 1 to tooth 2", "back to step 2 in hand"} {
		if !strings.Contains(v, want) {
			t.Errorf("looking ahead one step the screen lacks %q:\n%s", want, v)
		}
	}
	if strings.Contains(v, "Press enter when this is done") {
		t.Errorf("a step looked at asks for enter:\n%s", v)
	}
	keys(t, m, "]")
	v = plain(m)
	for _, want := range []string{"coil 2 of 12", "not wound yet", "done    @  *"} { // the strip: tooth 1 in hand, tooth 2 looked at
		if !strings.Contains(v, want) {
			t.Errorf("looking ahead at coil 2 the screen lacks %q:\n%s", want, v)
		}
	}
	keys(t, m, "enter")
	if s := curStep(m); s.Index != 2 || m.c.prog.Steps[1].Done || len(rec.all()) != entries {
		t.Errorf("enter while looking ahead: current %d, coil 1 done %v, %d entries; want step 2, not done, none", s.Index, m.c.prog.Steps[1].Done, len(rec.all())-entries)
	}
}

func TestUndoWhileLookingReturns(t *testing.T) {
	m, _ := woundTwo(t, 80, 24)
	cur := m.c.prog.Current()
	keys(t, m, "left", "left", "left")
	keys(t, m, "u")
	if _, ok := m.guide.lookedAt(); ok || m.guide.mode != modeConfirmUndo {
		t.Fatalf("u while looking: looking %v, mode %v; want the look ended and the undo question", ok, m.guide.mode)
	}
	keys(t, m, "y")
	if got := m.c.prog.Current(); got >= cur {
		t.Fatalf("current() = %d after undo; want before %d", got, cur)
	}
	if m.guide.shown() != m.c.prog.Current() {
		t.Errorf("shown() = %d after undo; want the current step %d", m.guide.shown(), m.c.prog.Current())
	}
}

func TestAnyProgressChangeEndsTheLook(t *testing.T) {
	m, _ := woundTwo(t, 80, 24)
	keys(t, m, "left")
	// A change that did not come through the look (as a resumed record or
	// another screen would make) ends it too.
	m.c.record(Entry{Kind: EntryTurns, Step: m.c.prog.Current() + 1, Turns: 3})
	if _, ok := m.guide.lookedAt(); ok {
		t.Error("still looking after a change of progress")
	}
	// A resumed guide starts on the step in hand.
	m2 := New(Options{Plan: m.c.plan, History: m.c.out.rec.(*memRecorder).all(), Now: fixedNow})
	if _, ok := m2.guide.lookedAt(); ok || m2.guide.shown() != m2.c.prog.Current() {
		t.Error("a resumed guide starts looking at another step")
	}
}

func TestOverviewEnterLooksAtTheLine(t *testing.T) {
	m, rec := woundTwo(t, 80, 24)
	cur, entries := m.c.prog.Current(), len(rec.all())
	keys(t, m, "o")
	if m.overview.sel != cur {
		t.Fatalf("overview highlights step %d; want the current %d", m.overview.sel+1, cur+1)
	}
	keys(t, m, "up", "up", "up")
	if !strings.Contains(plain(m), "->[x]") {
		t.Errorf("the highlighted line has no mark:\n%s", plain(m))
	}
	keys(t, m, "enter")
	if m.screen != screenGuide {
		t.Fatalf("screen = %v after enter on the overview; want guide", m.screen)
	}
	if at, ok := m.guide.lookedAt(); !ok || at != cur-3 {
		t.Errorf("lookedAt() = %d, %v; want %d, true", at, ok, cur-3)
	}
	// The overview opens on the step looked at.
	keys(t, m, "o")
	if m.overview.sel != cur-3 {
		t.Errorf("overview opened while looking highlights %d; want %d", m.overview.sel+1, cur-2)
	}
	// Enter on the current step's line just goes back to it.
	for range 3 {
		keys(t, m, "down")
	}
	keys(t, m, "enter")
	if _, ok := m.guide.lookedAt(); ok || len(rec.all()) != entries {
		t.Errorf("enter on the current line: looking %v, %d entries; want no look, none", ok, len(rec.all())-entries)
	}
	// Down past the last step scrolls on to the connection order.
	keys(t, m, "o")
	for range len(m.c.steps()) + 40 {
		keys(t, m, "down")
	}
	if m.overview.sel != len(m.c.steps())-1 || !strings.Contains(plain(m), "phase W path") {
		t.Errorf("overview at the end: sel %d; screen:\n%s", m.overview.sel, plain(m))
	}
}

func TestLookKeysGoIntoTypedFields(t *testing.T) {
	m, rec := woundTwo(t, 80, 24)
	keys(t, m, "n", "[", "]", "left", "x", "esc")
	if _, ok := m.guide.lookedAt(); ok {
		t.Error("[ ] or left in a note moved the look")
	}
	keys(t, m, "n", "[", "]", "home", "x", "enter")
	i := m.c.prog.Current()
	if got := m.c.prog.Steps[i].Note; got != "x[]" {
		t.Errorf("note = %q; want %q (home moves the cursor in the field)", got, "x[]")
	}
	// In the readings of a test step too.
	for curStep(m).Kind != plan.StepTest {
		if curStep(m).Kind == plan.StepCoil {
			windCoil(t, m)
		} else {
			keys(t, m, "enter")
		}
	}
	n := len(rec.all())
	keys(t, m, "enter", "[", "left", "]")
	if _, ok := m.guide.lookedAt(); ok || m.guide.mode != modeReadings {
		t.Errorf("keys in a reading field: looking %v, mode %v; want no look, readings", ok, m.guide.mode)
	}
	if len(rec.all()) != n {
		t.Errorf("typing in a reading field recorded entries")
	}
}

// A turn wound while looking at another step is a turn of the coil in hand:
// space ends the look and counts it.
func TestSpaceWhileLookingCountsTheTurn(t *testing.T) {
	m, rec := woundTwo(t, 80, 24)
	cur := m.c.prog.Current()
	n := m.c.prog.Steps[cur].Turns
	keys(t, m, "left", "left")
	if _, ok := m.guide.lookedAt(); !ok {
		t.Fatal("not looking after left, left")
	}
	entries := len(rec.all())
	keys(t, m, " ")
	if _, ok := m.guide.lookedAt(); ok || m.guide.shown() != cur {
		t.Errorf("space while looking: still looking (shown %d); want back at step %d", m.guide.shown()+1, cur+1)
	}
	if got := m.c.prog.Steps[cur].Turns; got != n+1 || len(rec.all()) != entries+1 {
		t.Errorf("space while looking: turns %d, %d entries; want %d and one turns entry", got, len(rec.all())-entries, n+1)
	}
	if v := plain(m); !strings.Contains(v, "turn counted") {
		t.Errorf("space while looking does not say it counted:\n%s", v)
	}
}
