package tui

import (
	"errors"
	"flag"
	"os"
	"path/filepath"
	"sync"
	"testing"
	"time"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"
	"github.com/charmbracelet/x/ansi"
	"github.com/muesli/termenv"

	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// updating reports the -update flag, which rewrites the golden screens under
// testdata/golden/tui. The flag itself is registered by teatest's golden
// package, which this test binary links.
func updating() bool {
	f := flag.Lookup("update")
	if f == nil {
		return false
	}
	g, ok := f.Value.(flag.Getter)
	if !ok {
		return false
	}
	b, _ := g.Get().(bool)
	return b
}

func TestMain(m *testing.M) {
	lipgloss.SetColorProfile(termenv.Ascii)
	lipgloss.SetHasDarkBackground(true)
	// Timers never fire in these tests: a test sends retryMsg itself.
	retryTick = func(time.Duration, func(time.Time) tea.Msg) tea.Cmd { return nil }
	os.Exit(m.Run())
}

// memRecorder keeps entries in memory the way the journal store keeps
// events: an entry it cannot write waits and goes first next time.
type memRecorder struct {
	mu      sync.Mutex
	entries []Entry
	waiting []Entry
	fail    error
	appends int // Append calls: one sync each in the journal store
}

type heldErr struct {
	err  error
	held int
}

func (e heldErr) Error() string    { return e.err.Error() }
func (e heldErr) HeldEntries() int { return e.held }

func (r *memRecorder) Append(es ...Entry) error {
	r.mu.Lock()
	defer r.mu.Unlock()
	r.appends++
	r.waiting = append(r.waiting, es...)
	return r.flush()
}

func (r *memRecorder) Retry() error {
	r.mu.Lock()
	defer r.mu.Unlock()
	return r.flush()
}

func (r *memRecorder) flush() error {
	if r.fail != nil {
		return heldErr{r.fail, len(r.waiting)}
	}
	r.entries = append(r.entries, r.waiting...)
	r.waiting = nil
	return nil
}

func (r *memRecorder) setFail(err error) {
	r.mu.Lock()
	defer r.mu.Unlock()
	r.fail = err
}

func (r *memRecorder) all() []Entry {
	r.mu.Lock()
	defer r.mu.Unlock()
	return append([]Entry(nil), r.entries...)
}

var errDiskFull = errors.New("write progress: no space left on device")

var fixedNow = func() time.Time { return time.Date(2025, 3, 1, 9, 0, 0, 0, time.UTC) }

// press builds the key message for a key name as bubbletea names it.
func press(k string) tea.KeyMsg {
	switch k {
	case "enter":
		return tea.KeyMsg{Type: tea.KeyEnter}
	case "space", " ":
		return tea.KeyMsg{Type: tea.KeySpace, Runes: []rune{' '}}
	case "backspace":
		return tea.KeyMsg{Type: tea.KeyBackspace}
	case "esc":
		return tea.KeyMsg{Type: tea.KeyEsc}
	case "tab":
		return tea.KeyMsg{Type: tea.KeyTab}
	case "ctrl+c":
		return tea.KeyMsg{Type: tea.KeyCtrlC}
	case "left":
		return tea.KeyMsg{Type: tea.KeyLeft}
	case "right":
		return tea.KeyMsg{Type: tea.KeyRight}
	case "up":
		return tea.KeyMsg{Type: tea.KeyUp}
	case "down":
		return tea.KeyMsg{Type: tea.KeyDown}
	case "home":
		return tea.KeyMsg{Type: tea.KeyHome}
	}
	return tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune(k)}
}

// drive sends messages to the model and runs the commands they return,
// synchronously and in order, the way the program loop would; the retry
// timer is switched off in TestMain.
func drive(tb testing.TB, m *Model, msgs ...tea.Msg) {
	tb.Helper()
	for _, msg := range msgs {
		run(m, msg, 0)
	}
}

func run(m *Model, msg tea.Msg, depth int) {
	if depth > 50 {
		return
	}
	_, cmd := m.Update(msg)
	runCmd(m, cmd, depth)
}

func runCmd(m *Model, cmd tea.Cmd, depth int) {
	if cmd == nil {
		return
	}
	switch out := cmd().(type) {
	case nil:
	case tea.BatchMsg:
		for _, c := range out {
			runCmd(m, c, depth+1)
		}
	case tea.QuitMsg:
	default:
		run(m, out, depth+1)
	}
}

// keys sends each key in turn.
func keys(tb testing.TB, m *Model, ks ...string) {
	tb.Helper()
	for _, k := range ks {
		drive(tb, m, press(k))
	}
}

// repeat returns k n times.
func repeat(k string, n int) []string {
	out := make([]string, n)
	for i := range out {
		out[i] = k
	}
	return out
}

// plain is the View with escape codes removed.
func plain(m *Model) string { return ansi.Strip(m.View()) }

// golden compares a screen with testdata/golden/tui/name, or rewrites it.
func golden(t *testing.T, name, got string) {
	t.Helper()
	path := filepath.Join("..", "testdata", "golden", "tui", name)
	if updating() {
		if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(path, []byte(got), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("golden %s: %v (run go test ./tui -update)", name, err)
	}
	if string(want) != got {
		t.Errorf("screen %s differs from the golden file:\n--- got\n%s\n--- want\n%s", name, got, want)
	}
}

func ansiStrip(s string) string { return ansi.Strip(s) }

// stamped is a hand-made history as the guide records it: each entry
// stamped with what its step is.
func stamped(p *plan.Plan, es []Entry) []Entry {
	out := make([]Entry, len(es))
	for i, e := range es {
		out[i] = progress.Stamp(p, e)
	}
	return out
}
