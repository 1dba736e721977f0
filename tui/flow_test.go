package tui

import (
	"bytes"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"
	"time"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/x/exp/teatest"

	"coilwright/winding/job"
	"coilwright/winding/journal"
	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

func demoPlan(tb testing.TB) *plan.Plan {
	tb.Helper()
	p, err := plan.Build(job.Demo())
	if err != nil {
		tb.Fatalf("plan.Build(job.Demo()) = %v", err)
	}
	return p
}

// openGuide opens the record at path and returns a guide resumed from it.
func openGuide(t *testing.T, p *plan.Plan, path string) (*Model, *journal.Store) {
	t.Helper()
	st, events, torn, err := journal.Open(path, "bench")
	if err != nil {
		t.Fatalf("journal.Open(%s) = %v", path, err)
	}
	rec := &JournalRecorder{Store: st}
	if progress.Fold(p, events).NeedsFingerprint() {
		rec.Head = []journal.Event{progress.FingerprintEvent(p)}
	}
	m := New(Options{Plan: p, Recorder: rec, History: events, Notice: TornNotice(torn), Where: path})
	return m, st
}

func waitFor(t *testing.T, tm *teatest.TestModel, what string) {
	t.Helper()
	teatest.WaitFor(t, tm.Output(), func(b []byte) bool { return bytes.Contains(b, []byte(what)) },
		teatest.WithDuration(5*time.Second), teatest.WithCheckInterval(5*time.Millisecond))
}

func typeKeys(tm *teatest.TestModel, ks ...string) {
	for _, k := range ks {
		tm.Send(press(k))
	}
}

// TestFlowWindTwoCoilsQuitResume is the first session at the bench and the
// next: confirm the preparation, wind two coils, quit; start again and find
// coil 3 waiting.
func TestFlowWindTwoCoilsQuitResume(t *testing.T) {
	p := demoPlan(t)
	path := filepath.Join(t.TempDir(), "demo.progress")

	m, st := openGuide(t, p, path)
	tm := teatest.NewTestModel(t, m, teatest.WithInitialTermSize(100, 30))
	waitFor(t, tm, fmt.Sprintf("step 1 of %d", len(p.Steps)))
	for n := 1; n <= 2; n++ {
		// Confirm the check steps before coil n, then count its turns.
		typeKeys(tm, repeat("enter", checksBefore(p, n))...)
		c := coilStep(t, p, n)
		waitFor(t, tm, fmt.Sprintf("coil %d of %d", n, c.Of))
		typeKeys(tm, repeat(" ", c.Turns)...)
		typeKeys(tm, "enter")
	}
	typeKeys(tm, repeat("enter", checksBefore(p, 3))...)
	waitFor(t, tm, fmt.Sprintf("coil 3 of %d", coilStep(t, p, 3).Of))
	typeKeys(tm, "q")
	tm.WaitFinished(t, teatest.WithFinalTimeout(5*time.Second))
	if err := st.Close(); err != nil {
		t.Fatalf("Close() = %v", err)
	}

	m2, st2 := openGuide(t, p, path)
	defer st2.Close()
	tm2 := teatest.NewTestModel(t, m2, teatest.WithInitialTermSize(100, 30))
	waitFor(t, tm2, fmt.Sprintf("coil 3 of %d", coilStep(t, p, 3).Of))
	typeKeys(tm2, " ", " ", " ", "q")
	fm := tm2.FinalModel(t, teatest.WithFinalTimeout(5*time.Second)).(*Model)
	if got := fm.c.prog.Steps[fm.c.prog.Current()].Turns; got != 3 {
		t.Errorf("turns on coil 3 = %d; want 3", got)
	}
	if s, _ := fm.c.step(fm.c.prog.Current()); s.Coil == nil || s.Coil.Order != 3 {
		t.Errorf("current step %+v; want coil 3", s)
	}
}

// TestFlowResizeTinyAndBack shrinks the terminal to 24x7 and back.
func TestFlowResizeTinyAndBack(t *testing.T) {
	m := New(Options{Plan: demoPlan(t), Recorder: &memRecorder{}, Now: fixedNow})
	tm := teatest.NewTestModel(t, m, teatest.WithInitialTermSize(80, 24))
	waitFor(t, tm, "step 1 of")
	tm.Send(tea.WindowSizeMsg{Width: 24, Height: 7})
	waitFor(t, tm, "Enlarge it")
	tm.Send(tea.WindowSizeMsg{Width: 0, Height: 0})
	tm.Send(tea.WindowSizeMsg{Width: 1, Height: 1})
	tm.Send(tea.WindowSizeMsg{Width: 100, Height: 30})
	waitFor(t, tm, "step 1 of")
	typeKeys(tm, "q")
	tm.WaitFinished(t, teatest.WithFinalTimeout(5*time.Second))
}

// TestRecordTruncatedAtEveryOffset cuts a real record at every byte and
// reloads it: never an error or a panic, progress never ahead of the whole
// record, and a cut inside a line reported as torn.
func TestRecordTruncatedAtEveryOffset(t *testing.T) {
	p := demoPlan(t)
	path := filepath.Join(t.TempDir(), "r.progress")
	m, st := openGuide(t, p, path)
	drive(t, m, tea.WindowSizeMsg{Width: 80, Height: 24})
	toCoil(t, m)
	keys(t, m, repeat(" ", curStep(m).Coil.Turns)...)
	keys(t, m, "enter", "enter", "n", "x", "enter", " ", " ")
	want := m.c.prog.Current()
	if err := st.Close(); err != nil {
		t.Fatal(err)
	}
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	prev := 0
	for off := 0; off <= len(data); off++ {
		events, torn, err := journal.Decode(data[:off])
		if err != nil {
			t.Fatalf("Decode(first %d bytes) = %v", off, err)
		}
		cut := off > 0 && data[off-1] != '\n'
		if cut && torn == nil && !bytes.HasSuffix(data[:off], []byte("}")) {
			t.Errorf("Decode(first %d bytes): a cut line is not reported", off)
		}
		g := New(Options{Plan: p, History: events, Notice: TornNotice(torn)})
		if off%97 == 0 || off == len(data) {
			g.Update(tea.WindowSizeMsg{Width: 80, Height: 24})
			_ = g.View()
		}
		cur := g.c.prog.Current()
		if cur < prev || cur > want {
			t.Fatalf("after %d bytes the guide is at step %d; want between %d and %d", off, cur+1, prev+1, want+1)
		}
		prev = cur
	}
	if prev != want {
		t.Errorf("the whole record resumes at step %d; want %d", prev+1, want+1)
	}
	// Reopen a torn record through the store: reported, cut, appended after.
	if err := os.WriteFile(path, data[:len(data)-7], 0o644); err != nil {
		t.Fatal(err)
	}
	g, st2 := openGuide(t, p, path)
	drive(t, g, tea.WindowSizeMsg{Width: 80, Height: 24})
	if v := plain(g); !strings.Contains(v, "cut short") {
		t.Errorf("torn record not reported:\n%s", v)
	}
	keys(t, g, " ")
	st2.Close()
	if _, torn, err := journal.Decode(mustRead(t, path)); err != nil || torn != nil {
		t.Errorf("after appending to a torn record: torn %v, err %v; want a clean record", torn, err)
	}
}

// stepsDone is the number of steps before coil n.
func stepsDone(p *plan.Plan, n int) int {
	for i, s := range p.Steps {
		if s.Coil != nil && s.Coil.Order == n {
			return i
		}
	}
	return len(p.Steps)
}

// checksBefore counts the steps between coil n-1 (or the start) and coil n.
func checksBefore(p *plan.Plan, n int) int {
	from := 0
	if n > 1 {
		from = stepsDone(p, n-1) + 1
	}
	return max(0, stepsDone(p, n)-from)
}

// coilStep is coil n of the plan.
func coilStep(t *testing.T, p *plan.Plan, n int) *plan.CoilStep {
	t.Helper()
	i := stepsDone(p, n)
	if i >= len(p.Steps) {
		t.Fatalf("the plan has no coil %d", n)
	}
	return p.Steps[i].Coil
}

// toCoil confirms check steps until a coil step is current.
func toCoil(t *testing.T, m *Model) {
	t.Helper()
	toNextCoil(t, m)
}

func mustRead(t *testing.T, path string) []byte {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// TestSecondGuideRefused: a record held by one guide is refused to a second,
// with the holder named.
func TestSecondGuideRefused(t *testing.T) {
	p := demoPlan(t)
	path := filepath.Join(t.TempDir(), "r.progress")
	st, _, _, err := journal.Open(path, "bench")
	if err != nil {
		t.Fatal(err)
	}
	defer st.Close()
	err = Run(p, RunOptions{RecordPath: path, In: strings.NewReader(""), Out: &bytes.Buffer{}})
	if !errors.Is(err, journal.ErrLocked) || !strings.Contains(err.Error(), `"bench"`) {
		t.Errorf("Run on a held record = %v; want a lock error naming the holder", err)
	}
}

// TestResumeAgreesWithLive folds what the guide recorded and finds the
// state the guide shows: one model, live and on resume.
func TestResumeAgreesWithLive(t *testing.T) {
	p := demoPlan(t)
	rec := &memRecorder{}
	m := New(Options{Plan: p, Recorder: rec, Now: fixedNow})
	drive(t, m, tea.WindowSizeMsg{Width: 80, Height: 24})
	toCoil(t, m)
	keys(t, m, repeat(" ", curStep(m).Coil.Turns-1)...)
	keys(t, m, "enter", "y", "enter")
	keys(t, m, "u", "y", "u", "y", "enter", " ", " ")
	events := rec.all()
	for i := range events {
		events[i].Seq = i + 1
	}
	folded := progress.Fold(p, events)
	if len(folded.Dropped) != 0 {
		t.Errorf("Fold(the guide's own entries) dropped %+v", folded.Dropped)
	}
	if !reflect.DeepEqual(folded.Steps, m.c.prog.Steps) || folded.Current() != m.c.prog.Current() || folded.DoneCount() != m.c.prog.DoneCount() {
		t.Errorf("Fold(record) = current %d, %d done; the guide shows current %d, %d done", folded.Current(), folded.DoneCount(), m.c.prog.Current(), m.c.prog.DoneCount())
	}
}
