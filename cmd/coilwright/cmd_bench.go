package main

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"

	"github.com/spf13/cobra"

	"coilwright/tui"
	"coilwright/winding/journal"
)

func init() { register(newBenchCmd) }

func newBenchCmd() *cobra.Command {
	var demo bool
	var progress string
	var noBell bool
	cmd := &cobra.Command{
		Use:   "bench JOB | --demo",
		Short: "Guide at the winding bench, coil by coil, resuming saved progress",
		Long: `bench opens a full-screen guide that leads through every step of the job:
preparation, each coil with its turns and winding direction, jumpers, phase
separators, terminals, joints and tests. Count turns with space (backspace
takes one off; digits type a new count that enter sets and esc drops; the
terminal bell rings when the count reaches the plan), enter completes a step
(a count off the plan is recorded only with y), ? shows every key, q quits.
SIGTERM or SIGHUP saves and exits with status 1.

Every turn counted and every step done is written at once to the progress
record, so the guide opens where the work stopped, even after a crash:
  bench JOB      keeps it beside the job file, in JOB.progress
  bench --demo   keeps it in $XDG_STATE_HOME/coilwright/demo.progress
                 (~/.local/state/coilwright/demo.progress when XDG_STATE_HOME
                 is not set)
  --progress F   keeps it in F instead
Only one guide at a time may use a record (however its path is written); a
second is refused with the name of the holder. If the job was edited since
(other turns, another winding), the guide says what changed and which
entries no longer fit. Delete the record to start the job again.`,
		Example: "  coilwright bench --demo\n  coilwright bench stator.toml\n  coilwright bench --demo --progress /tmp/try.progress",
		Args:    maxArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			_, p, path, err := loadPlanArg(cmd, args, demo)
			if err != nil {
				return err
			}
			rec := progress
			switch {
			case rec != "":
			case path != "":
				rec = journal.PathFor(path)
			default:
				rec, err = demoProgressPath()
				if err != nil {
					return err
				}
			}
			err = tui.Run(p, tui.RunOptions{RecordPath: rec, AltScreen: true, NoBell: noBell})
			var le *journal.LockedError
			var de *journal.DamagedError
			switch {
			case errors.As(err, &le):
				return fmt.Errorf("bench: another guide has this job open: %w", err)
			case errors.As(err, &de):
				return badInputf("bench: %w", err)
			case errors.Is(err, tui.ErrStopped):
				return fmt.Errorf("bench: stopped by a signal; everything counted is saved in %s", rec)
			}
			return err
		},
	}
	addDemoFlag(cmd, &demo)
	cmd.Flags().StringVar(&progress, "progress", "", "keep the progress record in this file instead of the default")
	cmd.Flags().BoolVar(&noBell, "no-bell", false, "do not ring the terminal bell when a count reaches the plan (b turns it off and on in the guide)")
	return cmd
}

// demoProgressPath is where the demo job's progress is kept: the user's
// state directory (XDG Base Directory specification), created if needed.
func demoProgressPath() (string, error) {
	dir := os.Getenv("XDG_STATE_HOME")
	if dir == "" || !filepath.IsAbs(dir) {
		home, err := os.UserHomeDir()
		if err != nil {
			return "", fmt.Errorf("bench: no home directory for the demo's progress (%v); give --progress FILE", err)
		}
		dir = filepath.Join(home, ".local", "state")
	}
	dir = filepath.Join(dir, "coilwright")
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return "", fmt.Errorf("bench: cannot make %s for the demo's progress (%v); give --progress FILE", dir, err)
	}
	return filepath.Join(dir, "demo.progress"), nil
}
