package tui

import (
	"errors"
	"fmt"
	"io"

	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/journal"
	"coilwright/winding/plan"
)

// RunOptions say where the guide keeps progress and which terminal it uses.
type RunOptions struct {
	RecordPath string    // the progress record (created on the first event)
	In         io.Reader // keys; nil for the process's terminal
	Out        io.Writer // screen; nil for the process's terminal
	AltScreen  bool      // use the terminal's alternate screen
}

// Run opens the progress record (locking it), replays it, runs the guide
// until the user quits, then writes what is pending and releases the lock. A
// record held by another guide is refused with a *journal.LockedError naming
// the holder.
func Run(p *plan.Plan, o RunOptions) error {
	store, events, torn, err := journal.Open(o.RecordPath, "bench")
	if err != nil {
		return err
	}
	m := New(Options{
		Plan:     p,
		Recorder: JournalRecorder{Store: store, Plan: p},
		History:  EntriesOf(p, events),
		Notice:   TornNotice(torn),
		Where:    o.RecordPath,
	})
	var popts []tea.ProgramOption
	if o.In != nil {
		popts = append(popts, tea.WithInput(o.In))
	}
	if o.Out != nil {
		popts = append(popts, tea.WithOutput(o.Out))
	}
	if o.AltScreen {
		popts = append(popts, tea.WithAltScreen())
	}
	_, runErr := tea.NewProgram(m, popts...).Run()
	closeErr := store.Close()
	if runErr != nil && !errors.Is(runErr, tea.ErrProgramKilled) {
		return fmt.Errorf("tui: %w", runErr)
	}
	if closeErr != nil {
		return fmt.Errorf("tui: progress not fully saved: %w", closeErr)
	}
	return nil
}
