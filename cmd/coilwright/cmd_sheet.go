package main

import (
	"bytes"
	"errors"
	"fmt"
	"io/fs"
	"os"
	"time"

	"github.com/spf13/cobra"

	"coilwright/printout"
	"coilwright/winding/journal"
)

func init() { register(newSheetCmd) }

func newSheetCmd() *cobra.Command {
	var demo bool
	var out, paper, date, progress string
	cmd := &cobra.Command{
		Use:   "sheet JOB | --demo -o FILE.pdf",
		Short: "Shop pack as PDF: slot map, developed layout, connections, cut list, checklist, test record",
		Long: `sheet prints the shop pack of a job for the bench and the stator's file: the
slot map with a title block, the developed layout, the connection sheet with
terminal marks and joints, the cut list and materials, the winding checklist
(one row per coil in winding order) and the test record with its cautions.
What the job's progress record holds is printed in: steps done are ticked
and dated, done coils show the turns counted (a count that differs from the
plan stands out white on black), notes print under their rows, and the test
record carries the readings with their dates. Steps not done stay blank to
fill in by hand. The record is read from
  sheet JOB      JOB.progress, beside the job file
  sheet --demo   the bench's demo record ($XDG_STATE_HOME/coilwright/demo.progress)
  --progress F   F instead
Phase colours are those of IEC 60445 (brown, black, grey), each doubled by its
letter and a line pattern so the pack reads on a monochrome printer.`,
		Example: "  coilwright sheet --demo -o pack.pdf\n  coilwright sheet stator.toml -o pack.pdf --paper letter --date 2025-06-01",
		Args:    maxArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			if out == "" {
				return badInputf("no output file: give -o FILE.pdf")
			}
			pp, err := printout.ParsePaper(paper)
			if err != nil {
				return badInput(err)
			}
			var when time.Time
			if date != "" {
				when, err = time.Parse("2006-01-02", date)
				if err != nil {
					return badInputf("--date %q: not a date; write it as YYYY-MM-DD, e.g. 2025-06-01", date)
				}
			}
			_, p, path, err := loadPlanArg(cmd, args, demo)
			if err != nil {
				return err
			}
			rec, explicit := recordPath(progress, path)
			readings, pr, err := loadProgress(cmd, rec, explicit)
			if err != nil {
				return err
			}
			pk, err := printout.Build(p, printout.Options{Paper: pp, Date: when, Readings: readings, Progress: pr})
			if err != nil {
				return err
			}
			var buf bytes.Buffer
			if err := printout.Render(pk, &buf); err != nil {
				return err
			}
			if out == "-" {
				_, err = cmd.OutOrStdout().Write(buf.Bytes())
				return err
			}
			if err := os.WriteFile(out, buf.Bytes(), 0o644); err != nil {
				return fmt.Errorf("sheet: write %s: %w", out, err)
			}
			fmt.Fprintf(cmd.ErrOrStderr(), "wrote %s: %d sheets, %d KiB\n", out, len(pk.Pages), (buf.Len()+1023)/1024)
			return nil
		},
	}
	addDemoFlag(cmd, &demo)
	cmd.Flags().StringVarP(&out, "output", "o", "", "PDF file to write (- for standard output)")
	cmd.Flags().StringVar(&paper, "paper", "a4", "paper size: a4 or letter")
	cmd.Flags().StringVar(&progress, "progress", "", "print the progress record in this file instead of the default")
	cmd.Flags().StringVar(&date, "date", "", "date printed on the pack and in the PDF, YYYY-MM-DD (default: the job's date)")
	return cmd
}

// recordPath is the progress record a sheet prints from: --progress when
// given (it must exist), else the job's JOB.progress, else for the demo the
// bench's demo record. explicit says the user named it.
func recordPath(flag, jobPath string) (path string, explicit bool) {
	switch {
	case flag != "":
		return flag, true
	case jobPath != "":
		return journal.PathFor(jobPath), false
	}
	// without a home for the demo's record there is no record to print
	path, err := demoProgressPath()
	if err != nil {
		return "", false
	}
	return path, false
}

// loadProgress reads and replays the progress record: the readings, latest
// per test, and the steps done with their dates, turns and notes. No record
// (a file that does not exist) gives nil for both; a torn last line is left
// out, as the bench guide does, and said on stderr.
func loadProgress(cmd *cobra.Command, path string, explicit bool) (map[string]printout.Reading, *printout.Progress, error) {
	if path == "" {
		return nil, nil, nil
	}
	data, err := os.ReadFile(path)
	if errors.Is(err, fs.ErrNotExist) {
		if explicit {
			return nil, nil, badInputf("--progress %s: no such record; give the file the bench or check --record wrote", path)
		}
		return nil, nil, nil
	}
	if err != nil {
		return nil, nil, fmt.Errorf("sheet: read progress record: %w", err)
	}
	events, torn, err := journal.Decode(data)
	if err != nil {
		return nil, nil, badInput(err)
	}
	if torn != nil {
		fmt.Fprintf(cmd.ErrOrStderr(), "sheet: the last line of %s was cut short (%s) and is left out\n", path, torn)
	}
	st := journal.Replay(events)
	readings := make(map[string]printout.Reading, len(st.Readings))
	for name, e := range st.Readings {
		readings[name] = printout.Reading{Values: e.Readings, Taken: e.Time, Verdict: e.Verdict}
	}
	return readings, progressOf(events, st), nil
}

// progressOf puts a replayed record as the printout's plain data: each done
// step with the time of the done event that stands and, for a coil, its
// tooth and actual turns; the notes in order; the time of the latest entry.
func progressOf(events []journal.Event, st journal.State) *printout.Progress {
	pr := &printout.Progress{Steps: make(map[int]printout.StepProgress, len(st.Done))}
	standing := map[int]journal.Event{} // the latest done event of each step
	for _, e := range events {
		if e.Time.After(pr.Recorded) {
			pr.Recorded = e.Time
		}
		if e.Kind == journal.Done {
			standing[e.Step] = e
		}
	}
	for _, step := range st.Done {
		e := standing[step]
		sp := printout.StepProgress{Done: true, When: e.Time, Tooth: e.Tooth}
		if e.Tooth > 0 {
			sp.Turns = st.CoilTurns[e.Tooth]
		}
		pr.Steps[step] = sp
	}
	for _, n := range st.Notes {
		pr.Notes = append(pr.Notes, printout.Note{Step: n.Step, Tooth: n.Tooth, Text: n.Note, When: n.Time})
	}
	return pr
}
