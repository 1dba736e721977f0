package tui

import (
	"bytes"
	"errors"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"sync/atomic"
	"testing"
	"time"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/x/exp/teatest"

	"coilwright/winding/journal"
)

// TestFlowCountingNeverLosesATurn walks the counting rules through the real
// program loop: a typed count is marked and changes nothing until enter, esc
// keeps the old count, a count off the plan needs y (enter does not answer
// yes), space while looking at another step counts the coil in hand, and no
// key acts while the terminal is too small.
func TestFlowCountingNeverLosesATurn(t *testing.T) {
	p := demoPlan(t)
	rec := &memRecorder{}
	m := New(Options{Plan: p, Recorder: rec, Now: fixedNow})
	tm := teatest.NewTestModel(t, m, teatest.WithInitialTermSize(100, 30))
	waitFor(t, tm, "step 1 of")
	typeKeys(tm, repeat("enter", checksBefore(p, 1))...)
	waitFor(t, tm, "of 18 turns")

	typeKeys(tm, " ", " ", " ", " ", " ")
	waitFor(t, tm, "13 to go")
	typeKeys(tm, "1")
	waitFor(t, tm, "NEW COUNT 1_")
	typeKeys(tm, "esc")
	waitFor(t, tm, "typed count dropped; the count stands at 5")
	typeKeys(tm, "1", "8")
	waitFor(t, tm, "NEW COUNT 18_")
	typeKeys(tm, "enter")
	waitFor(t, tm, "count set to 18")
	typeKeys(tm, " ")
	waitFor(t, tm, "1 over")
	typeKeys(tm, "enter")
	waitFor(t, tm, "19 turns counted, the plan says 18")
	typeKeys(tm, "enter") // a double tap: not a yes
	waitFor(t, tm, "y records it")
	typeKeys(tm, "esc", "backspace", "enter") // back to 18 = plan: done
	waitFor(t, tm, "tooth 1 wound: 18 turns")

	// Look back at coil 1 from the next step, then wind a turn.
	typeKeys(tm, repeat("enter", checksBefore(p, 2))...)
	waitFor(t, tm, "coil 2 of 24")
	typeKeys(tm, "left")
	waitFor(t, tm, "looking at step")
	typeKeys(tm, " ")
	waitFor(t, tm, "turn counted, 1")

	// Too small: keys change nothing.
	tm.Send(tea.WindowSizeMsg{Width: 30, Height: 10})
	waitFor(t, tm, "nothing here")
	typeKeys(tm, " ", "enter", "u", "y", "5")
	tm.Send(tea.WindowSizeMsg{Width: 100, Height: 30})
	waitFor(t, tm, "coil 2 of 24")
	typeKeys(tm, "q")
	fm := tm.FinalModel(t, teatest.WithFinalTimeout(5*time.Second)).(*Model)
	cur := fm.c.prog.Current()
	if s, _ := fm.c.step(cur); s.Coil == nil || s.Coil.Order != 2 || fm.c.prog.Steps[cur].Turns != 1 {
		t.Errorf("at the end: step %d with %d turns; want coil 2 with the one turn counted while looking", cur+1, fm.c.prog.Steps[cur].Turns)
	}
	first := 0
	for p.Steps[first].Coil == nil {
		first++
	}
	if st := fm.c.prog.Steps[first]; !st.Done || st.Turns != 18 {
		t.Errorf("coil 1 = %+v; want done with 18", st)
	}
}

// gatedRecorder holds its first write until the test opens the gate, as a
// slow fsync on an SD card or a USB stick holds the writer; each Append call
// is one fsync in the journal store. Holding the write on a gate rather than
// a sleep makes the test independent of how fast the machine delivers keys.
type gatedRecorder struct {
	memRecorder
	syncs atomic.Int32
	gate  chan struct{}
	once  sync.Once
}

func (r *gatedRecorder) Append(es ...Entry) error {
	if r.syncs.Add(1) == 1 {
		<-r.gate
	}
	return r.memRecorder.Append(es...)
}

// TestBurstOfTurnsBatched: 60 turns counted while a write is still in flight
// are written together in one more write (one fsync), every one of them
// recorded, in order; the bound is at most 15 fsyncs for 60 turns.
func TestBurstOfTurnsBatched(t *testing.T) {
	p := handPlan(t, 12, 10, 2) // no slot fill given: no bound below 60 turns
	rec := &gatedRecorder{gate: make(chan struct{})}
	m := New(Options{Plan: p, Recorder: rec, Now: fixedNow, WriteGap: BurstGap})
	tm := teatest.NewTestModel(t, m, teatest.WithInitialTermSize(100, 30))
	waitFor(t, tm, "step 1 of")
	// The confirmations before the first coil go out in the first write,
	// which the gate holds; everything after them queues behind it.
	typeKeys(tm, repeat("enter", checksBefore(p, 1))...)
	waitFor(t, tm, "of 12 turns")
	typeKeys(tm, repeat(" ", 60)...)
	waitFor(t, tm, "48 over") // the model has counted all 60 while the write is held
	rec.once.Do(func() { close(rec.gate) })
	typeKeys(tm, "q")
	fm := tm.FinalModel(t, teatest.WithFinalTimeout(10*time.Second)).(*Model)
	syncs := rec.syncs.Load()
	var turns []int
	for _, e := range rec.all() {
		if e.Kind == EntryTurns {
			turns = append(turns, e.Turns)
		}
	}
	if len(turns) != 60 || turns[59] != 60 || fm.c.prog.Steps[fm.c.prog.Current()].Turns != 60 {
		t.Fatalf("recorded %d turns entries ending %v; want 60 in order", len(turns), turns[max(0, len(turns)-3):])
	}
	for i, n := range turns {
		if n != i+1 {
			t.Fatalf("turns entry %d = %d; want %d (in order)", i, n, i+1)
		}
	}
	// The held write, then one write of everything queued behind it.
	if syncs > 2 {
		t.Errorf("the confirmations and 60 turns cost %d writes (fsyncs); want 2: the held one and one batch", syncs)
	}
	t.Logf("60 turns: %d writes in all", syncs)
}

// A note carrying a terminal control sequence (typed into the record by
// hand) is shown without it.
func TestNoteControlSequenceNeverReachesTheTerminal(t *testing.T) {
	p := demoPlan(t)
	events, _, err := journal.Decode([]byte(`{"seq":1,"kind":"note","step":4,"tooth":1,"key":"coil 1 +U","note":"sleeved\u001b]0;owned\u0007\u001b[2J here"}` + "\n"))
	if err != nil {
		t.Fatal(err)
	}
	m := New(Options{Plan: p, History: events, Now: fixedNow})
	drive(t, m, tea.WindowSizeMsg{Width: 100, Height: 30})
	keys(t, m, repeat("enter", checksBefore(p, 1))...)
	for _, k := range []string{"", "o", "esc"} {
		if k != "" {
			keys(t, m, k)
		}
		v := m.View() // the colour profile is pinned to ASCII: no escape at all is expected
		if strings.ContainsAny(v, "\x1b\x07") {
			t.Fatalf("screen after %q holds a control character: %q", k, v)
		}
		if !strings.Contains(v, "sleeved]0;owned[2J here") {
			t.Errorf("screen after %q lacks the cleaned note:\n%s", k, v)
		}
	}
}

// A record holding an absurd turn count is refused with its line, not a
// panic, and the guide does not start (a non-zero exit for the command).
func TestRunRefusesAbsurdTurns(t *testing.T) {
	path := filepath.Join(t.TempDir(), "r.progress")
	os.WriteFile(path, []byte(`{"seq":1,"kind":"done","step":1}`+"\n"+`{"seq":2,"kind":"done","step":4,"tooth":1,"turns":9e18}`+"\n"), 0o644)
	err := Run(demoPlan(t), RunOptions{RecordPath: path, In: strings.NewReader(""), Out: &bytes.Buffer{}})
	var de *journal.DecodeError
	if !errors.As(err, &de) || de.Line != 2 {
		t.Errorf("Run on a record with 9e18 turns = %v; want a DecodeError on line 2", err)
	}
}

// A signal asks the guide to save and stop: it quits once the record has
// everything, and says it was stopped.
func TestStopSavesAndSaysSo(t *testing.T) {
	m, rec := newTest(t, 80, 24)
	toNextCoil(t, m)
	keys(t, m, " ", " ")
	drive(t, m, stopMsg{})
	if !m.stopped || !m.quitting || m.c.out.pending() != 0 {
		t.Errorf("after a stop: stopped %v, quitting %v, %d pending; want stopped with nothing pending", m.stopped, m.quitting, m.c.out.pending())
	}
	if n := len(rec.all()); n == 0 || rec.all()[n-1].Turns != 2 {
		t.Errorf("record after a stop = %+v; want the two turns", rec.all())
	}
}

// panicky is a model that panics on its first key, as a bug in a screen
// would.
type panicky struct{}

func (panicky) Init() tea.Cmd { return nil }
func (panicky) Update(msg tea.Msg) (tea.Model, tea.Cmd) {
	if _, ok := msg.(tea.KeyMsg); ok {
		panic("a bug in a screen")
	}
	return panicky{}, nil
}
func (panicky) View() string { return "" }

// A panic inside the program loop comes back as an error (the terminal is
// restored by bubbletea), and Run turns it into a *PanicError, never a clean
// exit; a signal stop is not a clean exit either.
func TestPanicIsNotACleanExit(t *testing.T) {
	prog := tea.NewProgram(panicky{}, tea.WithInput(strings.NewReader("x")), tea.WithOutput(&bytes.Buffer{}), tea.WithoutSignalHandler())
	_, runErr := prog.Run()
	if !errors.Is(runErr, tea.ErrProgramPanic) {
		t.Fatalf("Run of a panicking model = %v; want ErrProgramPanic", runErr)
	}
	err := runResult(runErr, nil, nil, false, "r.progress")
	var pe *PanicError
	if !errors.As(err, &pe) || !strings.Contains(err.Error(), "r.progress") || !strings.Contains(err.Error(), "a bug in a screen") && !strings.Contains(err.Error(), "panic") {
		t.Errorf("runResult(panic) = %v; want a PanicError naming the record", err)
	}
	if err := runResult(nil, nil, nil, true, "r.progress"); !errors.Is(err, ErrStopped) {
		t.Errorf("runResult(stopped) = %v; want ErrStopped", err)
	}
	if err := runResult(nil, nil, nil, false, "r.progress"); err != nil {
		t.Errorf("runResult(quit) = %v; want nil", err)
	}
}
