package progress_test

import (
	"strconv"
	"strings"
	"testing"
	"time"

	"coilwright/winding/job"
	"coilwright/winding/journal"
	"coilwright/winding/plan"
	"coilwright/winding/progress"
	"coilwright/winding/verify"
)

func demoPlan(t testing.TB, edit func(*job.Job)) *plan.Plan {
	t.Helper()
	j := job.Demo()
	if edit != nil {
		edit(j)
	}
	p, err := plan.Build(j)
	if err != nil {
		t.Fatal(err)
	}
	return p
}

// firstOf is the 1-based index of the first step of a kind.
func firstOf(p *plan.Plan, k plan.StepKind) int {
	for _, s := range p.Steps {
		if s.Kind == k {
			return s.Index
		}
	}
	return 0
}

// session records a bench session the way the guide does: every event
// stamped with its step, the fingerprint first, line numbers as read back.
func session(p *plan.Plan, evs ...journal.Event) []journal.Event {
	out := []journal.Event{progress.FingerprintEvent(p)}
	for _, e := range evs {
		out = append(out, progress.Stamp(p, e))
	}
	for i := range out {
		out[i].Seq, out[i].Line = i+1, i+1
	}
	return out
}

func TestFoldSession(t *testing.T) {
	p := demoPlan(t, nil)
	coil := firstOf(p, plan.StepCoil)
	want := p.Steps[coil-1].Coil.Turns
	at := time.Date(2025, 3, 8, 9, 0, 0, 0, time.UTC)
	ev := session(p,
		journal.Event{Kind: journal.Done, Step: 1, Time: at},
		journal.Event{Kind: journal.Turns, Step: coil, Turns: 5},
		journal.Event{Kind: journal.Note, Step: coil, Note: "enamel nicked, sleeved"},
		journal.Event{Kind: journal.Done, Step: coil, Turns: want + 1, Time: at.Add(time.Hour)},
		journal.Event{Kind: journal.Done, Step: coil + 1},
		journal.Event{Kind: journal.Undo, Step: coil + 1},
	)
	s := progress.Fold(p, ev)
	if len(s.Dropped) != 0 || len(s.Summary()) != 0 {
		t.Fatalf("Fold(session) dropped %+v, summary %q; want nothing", s.Dropped, s.Summary())
	}
	if !s.Steps[0].Done || !s.Steps[coil-1].Done || s.Steps[coil].Done {
		t.Errorf("done = %v %v %v; want step 1 and the coil done, the step after undone", s.Steps[0].Done, s.Steps[coil-1].Done, s.Steps[coil].Done)
	}
	if got := s.Steps[coil-1].Turns; got != want+1 {
		t.Errorf("coil turns = %d; want %d", got, want+1)
	}
	if s.Steps[coil-1].Note != "enamel nicked, sleeved" || !s.Steps[coil-1].At.Equal(at.Add(time.Hour)) {
		t.Errorf("coil step = %+v; want its note and the time it was done", s.Steps[coil-1])
	}
	if s.DoneCount() != 2 || s.CoilsDone() != 1 || s.LastDone() != coil-1 {
		t.Errorf("DoneCount %d, CoilsDone %d, LastDone %d; want 2, 1, %d", s.DoneCount(), s.CoilsDone(), s.LastDone(), coil-1)
	}
	if s.NeedsFingerprint() {
		t.Errorf("NeedsFingerprint() = true for a record carrying this plan's fingerprint")
	}
	// An undone coil keeps its count, to go on from.
	s.Apply(progress.Stamp(p, journal.Event{Kind: journal.Undo}))
	if s.Steps[coil-1].Done || s.Steps[coil-1].Turns != want+1 || s.Current() != 1 {
		t.Errorf("after undo: coil %+v, current %d; want not done, %d turns, current 1 (step 2 never done)", s.Steps[coil-1], s.Current(), want+1)
	}
}

// Changing volts in the job changes the turns per coil: the resume says so
// in words, and coils wound before keep their recorded turns.
func TestFoldAfterVoltsChanged(t *testing.T) {
	was := demoPlan(t, nil)
	is := demoPlan(t, func(j *job.Job) { j.Turns.Volts = 40 })
	if was.TurnsPerCoil == is.TurnsPerCoil {
		t.Fatalf("turns per coil %d at 26 V and at 40 V; the test needs a change", was.TurnsPerCoil)
	}
	coil := firstOf(was, plan.StepCoil)
	ev := session(was,
		journal.Event{Kind: journal.Done, Step: 1},
		journal.Event{Kind: journal.Done, Step: coil, Turns: was.TurnsPerCoil},
	)
	s := progress.Fold(is, ev)
	sum := strings.Join(s.Summary(), " ")
	wantWords := "turns per coil changed from " + itoa(was.TurnsPerCoil) + " to " + itoa(is.TurnsPerCoil)
	if !strings.Contains(sum, wantWords) || !strings.Contains(sum, "1 wound coil keeps") {
		t.Errorf("Summary() = %q; want %q and the wound coil named", sum, wantWords)
	}
	if !s.Steps[coil-1].Done || s.Steps[coil-1].Turns != was.TurnsPerCoil || !s.Steps[0].Done {
		t.Errorf("after the change: step 1 %v, coil %+v; want both kept (same identity)", s.Steps[0].Done, s.Steps[coil-1])
	}
	if !s.NeedsFingerprint() {
		t.Errorf("NeedsFingerprint() = false after the plan changed")
	}
}

// After the winding changed, entries are matched by what they are: a coil
// by tooth, phase and sense, a jumper by its teeth; entries of no key are
// never placed by their number alone; and the two counts agree with what
// the summary says.
func TestFoldAfterWindingChanged(t *testing.T) {
	was := demoPlan(t, nil)
	is := demoPlan(t, func(j *job.Job) { j.Winding.Layers = 1 })
	var evs []journal.Event
	for _, st := range was.Steps {
		if st.Kind == plan.StepTest {
			break
		}
		e := journal.Event{Kind: journal.Done, Step: st.Index}
		if st.Coil != nil {
			e.Turns = st.Coil.Turns
		}
		evs = append(evs, e)
	}
	ev := session(was, evs...)
	// An entry of an older coilwright: no key, no tooth, a bare number.
	ev = append(ev, journal.Event{Seq: 999, Line: 999, Kind: journal.Note, Step: 3, Note: "old"})
	s := progress.Fold(is, ev)
	keys := progress.Keys(is)
	for i, st := range s.Steps {
		if !st.Done {
			continue
		}
		found := false
		for _, e := range ev {
			if e.Kind == journal.Done && e.Key == keys[i] {
				found = true
			}
		}
		if !found {
			t.Errorf("step %d (%s) shown done with no entry of its own", i+1, keys[i])
		}
	}
	if len(s.Dropped) == 0 {
		t.Fatalf("Fold(2-layer record, 1-layer plan) dropped nothing")
	}
	last := s.Dropped[len(s.Dropped)-1]
	if last.Line != 999 || !strings.Contains(last.Reason, "only by its number") {
		t.Errorf("last dropped = %+v; want line 999 refused for naming a step only by number", last)
	}
	sum := strings.Join(s.Summary(), " ")
	if !strings.Contains(sum, "layers changed from 2 to 1") || !strings.Contains(sum, "left out") {
		t.Errorf("Summary() = %q; want the layer change and the entries left out", sum)
	}
}

// A turn count beyond what the slot holds is left out with its line, and
// the same rule stops a live count.
func TestFoldBoundsTurns(t *testing.T) {
	p := demoPlan(t, nil)
	coil := firstOf(p, plan.StepCoil)
	s0 := progress.New(p)
	most := s0.MaxTurns(coil - 1)
	if most < p.TurnsPerCoil || most > journal.MaxTurns {
		t.Fatalf("MaxTurns = %d; want between the plan's %d and %d", most, p.TurnsPerCoil, journal.MaxTurns)
	}
	// The plan's fill is copper over usable area: planned turns / fill fills
	// the slot with copper to the last corner.
	if want := int(float64(p.TurnsPerCoil)/p.SlotFill + 0.999999); most != want {
		t.Errorf("MaxTurns = %d; want ceil(%d / %.3f) = %d", most, p.TurnsPerCoil, p.SlotFill, want)
	}
	ev := session(p, journal.Event{Kind: journal.Done, Step: coil, Turns: most + 1})
	s := progress.Fold(p, ev)
	if s.Steps[coil-1].Done || len(s.Dropped) != 1 || s.Dropped[0].Line != 2 || !strings.Contains(s.Dropped[0].Reason, "than the slot can hold") {
		t.Errorf("Fold(%d turns) = done %v, dropped %+v; want left out on line 2", most+1, s.Steps[coil-1].Done, s.Dropped)
	}
	if s0.Apply(progress.Stamp(p, journal.Event{Kind: journal.Turns, Step: coil, Turns: most + 1})) {
		t.Errorf("Apply(%d turns) = true; want refused", most+1)
	}
}

// A coil whose sense or phase changed is not the coil its entries were for.
func TestFoldCoilMatchedBySense(t *testing.T) {
	p := demoPlan(t, nil)
	coil := firstOf(p, plan.StepCoil)
	e := progress.Stamp(p, journal.Event{Kind: journal.Done, Step: coil, Turns: 3, Line: 7})
	flipped := strings.Replace(strings.Replace(e.Key, "+", "?", 1), "-", "+", 1)
	flipped = strings.Replace(flipped, "?", "-", 1)
	e.Key = flipped
	s := progress.Fold(p, []journal.Event{e})
	if s.Steps[coil-1].Done || len(s.Dropped) != 1 || !strings.Contains(s.Dropped[0].Reason, "that tooth now carries") {
		t.Errorf("Fold(coil of the other sense) = done %v, dropped %+v; want left out", s.Steps[coil-1].Done, s.Dropped)
	}
}

func TestCheckEventsStamped(t *testing.T) {
	p := demoPlan(t, nil)
	r := verify.Readings{UV: 0.5, VW: 0.5, WU: 0.5, TempC: 20}
	rep, err := verify.Check(p, r)
	if err != nil {
		t.Fatal(err)
	}
	evs := progress.CheckEvents(p, r, rep)
	if len(evs) == 0 {
		t.Fatal("CheckEvents gave no events")
	}
	s := progress.Fold(p, evs)
	if len(s.Dropped) != 0 {
		t.Errorf("check events dropped: %+v", s.Dropped)
	}
	for _, e := range evs {
		if e.Key != "test "+e.Test || e.Readings["uv"] != 0.5 {
			t.Errorf("event %+v; want stamped with its test's key and the readings", e)
		}
		if got, ok := s.Tests[e.Test]; !ok || got.Verdict != e.Verdict {
			t.Errorf("Tests[%s] = %+v; want the verdict %s", e.Test, got, e.Verdict)
		}
	}
}

func itoa(n int) string { return strconv.Itoa(n) }

// Poles seen with check --polarity go on the polarity step of their phase.
func TestCheckEventsPolarity(t *testing.T) {
	p := demoPlan(t, nil)
	var r verify.Readings
	for _, tp := range p.Polarity {
		if tp.Phase == "U" {
			r.Polarity = append(r.Polarity, verify.PoleReading{Phase: tp.Phase, Tooth: tp.Tooth, Pole: tp.Pole})
		}
	}
	rep, err := verify.Check(p, r)
	if err != nil {
		t.Fatal(err)
	}
	evs := progress.CheckEvents(p, r, rep)
	if len(evs) != 1 || evs[0].Key != "test polarity U" || evs[0].Verdict != "pass" || len(evs[0].Readings) != len(r.Polarity) {
		t.Fatalf("CheckEvents(poles of U as planned) = %+v; want one pass on the polarity step of U with every pole", evs)
	}
	if s := progress.Fold(p, evs); len(s.Dropped) != 0 || s.Steps[evs[0].Step-1].Reading == nil {
		t.Errorf("Fold(polarity event) dropped %+v; want it on its step", s.Dropped)
	}
}

// Entries left out for different reasons are said one reason at a time, and
// the summary says the record keeps them as they are.
func TestSummaryLeftOutByReason(t *testing.T) {
	p := demoPlan(t, nil)
	coil := firstOf(p, plan.StepCoil)
	most := progress.New(p).MaxTurns(coil - 1)
	tooBig := progress.Stamp(p, journal.Event{Kind: journal.Done, Step: coil, Turns: most + 1})
	flipped := progress.Stamp(p, journal.Event{Kind: journal.Done, Step: coil, Turns: 3})
	flipped.Key = strings.NewReplacer("+", "-", "-", "+").Replace(flipped.Key)
	ev := session(p)
	ev = append(ev, tooBig, flipped)
	for i := range ev {
		ev[i].Seq, ev[i].Line = i+1, i+1
	}
	sum := strings.Join(progress.Fold(p, ev).Summary(), " ")
	for _, want := range []string{"left out (line 2): more turns", "left out (line 3): it was recorded for", "stays in the record file as it is"} {
		if !strings.Contains(sum, want) {
			t.Errorf("Summary() = %q\nlacks %q (each reason said on its own)", sum, want)
		}
	}
}
