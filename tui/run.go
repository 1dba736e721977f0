package tui

import (
	"errors"
	"fmt"
	"io"
	"os"
	"os/signal"
	"strings"
	"sync"
	"syscall"
	"time"

	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/journal"
	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// RunOptions say where the guide keeps progress and which terminal it uses.
type RunOptions struct {
	RecordPath string    // the progress record (created on the first event)
	In         io.Reader // keys; nil for the process's terminal
	Out        io.Writer // screen; nil for the process's terminal
	AltScreen  bool      // use the terminal's alternate screen
	NoBell     bool      // never ring the terminal bell
}

// ErrStopped is returned by Run when a signal (SIGTERM, SIGINT, SIGHUP)
// stopped the guide: what was counted is saved, but the work was cut short.
var ErrStopped = errors.New("tui: stopped by a signal")

// PanicError is returned by Run when the guide stopped on an internal error.
// The terminal is restored, and everything written before it is in the record.
type PanicError struct {
	Record string // the progress record
	Err    error
}

func (e *PanicError) Error() string {
	return fmt.Sprintf("tui: the guide stopped on an internal error (%v); the terminal was restored and the work saved up to the last entry in %s. Start the guide again to go on, and please report the error with the lines printed above", e.Err, e.Record)
}

func (e *PanicError) Unwrap() error { return e.Err }

// Run opens the progress record (locking it), folds it against the plan,
// runs the guide until the user quits, then writes what is pending and
// releases the lock. A record held by another guide is refused with a
// *journal.LockedError naming the holder. A signal saves and returns
// ErrStopped; a panic inside the guide restores the terminal and returns a
// *PanicError.
func Run(p *plan.Plan, o RunOptions) error {
	store, events, torn, err := journal.Open(o.RecordPath, "bench")
	if err != nil {
		return err
	}
	rec := &lockedRecorder{JournalRecorder: JournalRecorder{Store: store}}
	if progress.Fold(p, events).NeedsFingerprint() {
		rec.Head = []journal.Event{progress.FingerprintEvent(p)}
	}
	var bell io.Writer = os.Stdout
	if o.Out != nil {
		bell = o.Out
	}
	if o.NoBell {
		bell = nil
	}
	m := New(Options{
		Bell:     bell,
		Plan:     p,
		Recorder: rec,
		History:  events,
		Notice:   strings.TrimSpace(strings.Join(append(store.Notices(), TornNotice(torn)), " ")),
		Where:    o.RecordPath,
		WriteGap: BurstGap,
	})
	popts := []tea.ProgramOption{tea.WithoutSignalHandler()}
	if o.In != nil {
		popts = append(popts, tea.WithInput(o.In))
	}
	if o.Out != nil {
		popts = append(popts, tea.WithOutput(o.Out))
	}
	if o.AltScreen {
		popts = append(popts, tea.WithAltScreen())
	}
	prog := tea.NewProgram(m, popts...)
	sig := make(chan os.Signal, 1)
	signal.Notify(sig, syscall.SIGTERM, syscall.SIGINT, syscall.SIGHUP)
	stopSignals := make(chan struct{})
	go func() {
		for {
			select {
			case <-sig:
				prog.Send(stopMsg{})
			case <-stopSignals:
				return
			}
		}
	}()
	final, runErr := prog.Run()
	signal.Stop(sig)
	close(stopSignals)

	// Whatever the guide had not yet handed over is written now, after any
	// write still running.
	fm, _ := final.(*Model)
	if fm == nil {
		fm = m
	}
	rec.wait(fm.c.out.sent, 5*time.Second)
	var flushErr error
	if q := fm.c.out.queue; len(q) > 0 {
		flushErr = rec.Append(q...)
	}
	closeErr := store.Close()
	for _, n := range store.Notices() { // a record gone since the last write, written again
		fmt.Fprintln(os.Stderr, "bench: "+n)
	}
	return runResult(runErr, closeErr, flushErr, fm.stopped, store.Path())
}

// runResult is what Run returns after the program ended: a panic first (it
// must never look like a clean exit), then any failure to save, then a stop
// by a signal.
func runResult(runErr, closeErr, flushErr error, stopped bool, record string) error {
	switch {
	case errors.Is(runErr, tea.ErrProgramPanic):
		return &PanicError{Record: record, Err: runErr}
	case runErr != nil && !errors.Is(runErr, tea.ErrProgramKilled):
		return fmt.Errorf("tui: %w", runErr)
	case closeErr != nil:
		return fmt.Errorf("tui: progress not fully saved: %w", closeErr)
	case flushErr != nil:
		return fmt.Errorf("tui: progress not fully saved: %w", flushErr)
	case stopped:
		return ErrStopped
	}
	return nil
}

// stopMsg asks the guide to save and stop (a signal arrived).
type stopMsg struct{}

// lockedRecorder lets Run write what is left after the program ended while
// a write the program started may still run, and counts the writes done.
type lockedRecorder struct {
	mu    sync.Mutex
	calls int
	JournalRecorder
}

func (r *lockedRecorder) Append(es ...Entry) error {
	r.mu.Lock()
	defer r.mu.Unlock()
	r.calls++
	return r.JournalRecorder.Append(es...)
}

func (r *lockedRecorder) Retry() error {
	r.mu.Lock()
	defer r.mu.Unlock()
	r.calls++
	return r.JournalRecorder.Retry()
}

func (r *lockedRecorder) Notices() []string {
	r.mu.Lock()
	defer r.mu.Unlock()
	return r.JournalRecorder.Notices()
}

// wait returns once the recorder has done n writes, or after d.
func (r *lockedRecorder) wait(n int, d time.Duration) {
	for end := time.Now().Add(d); time.Now().Before(end); time.Sleep(5 * time.Millisecond) {
		r.mu.Lock()
		done := r.calls >= n
		r.mu.Unlock()
		if done {
			return
		}
	}
}
