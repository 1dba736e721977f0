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
	"coilwright/winding/plan"
	"coilwright/winding/progress"
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
			if out != "-" {
				keep := []protected{{"the job file", path}, {"the progress record", rec}, {"the progress record's lock", lockOf(rec)}}
				if path != "" {
					keep = append(keep, protected{"the job's progress record", journal.PathFor(path)}, protected{"the job's progress record's lock", lockOf(journal.PathFor(path))})
				}
				if err := refuseProtected("-o", out, keep...); err != nil {
					return err
				}
			}
			st, err := loadProgress(cmd, p, rec, explicit)
			if err != nil {
				return err
			}
			pk, err := printout.Build(p, printout.Options{Paper: pp, Date: when, Progress: st})
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
			if err := writeOutput("-o", out, buf.Bytes()); err != nil {
				return fmt.Errorf("sheet: %w", err)
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

// lockOf is the lock file of a record, "" for none.
func lockOf(rec string) string {
	if rec == "" {
		return ""
	}
	return journal.LockPathFor(rec)
}

// loadProgress reads the progress record and folds it against the plan. No
// record (a file that does not exist) gives nil; a torn last line is left
// out, as the bench guide does, and said on stderr, with what the fold found
// (a changed job, entries left out).
func loadProgress(cmd *cobra.Command, p *plan.Plan, path string, explicit bool) (*progress.State, error) {
	if path == "" {
		return nil, nil
	}
	data, err := os.ReadFile(path)
	if errors.Is(err, fs.ErrNotExist) {
		if explicit {
			return nil, badInputf("--progress %s: no such record; give the file the bench or check --record wrote", path)
		}
		return nil, nil
	}
	if err != nil {
		return nil, fmt.Errorf("sheet: read progress record: %w", err)
	}
	events, torn, err := journal.Decode(data)
	if err != nil {
		return nil, badInputf("sheet: %w", journal.Damaged(path, data, err))
	}
	if torn != nil {
		fmt.Fprintf(cmd.ErrOrStderr(), "sheet: the last line of %s was cut short (%s) and is left out\n", path, torn)
	}
	st := progress.Fold(p, events)
	for _, line := range st.Summary() {
		fmt.Fprintf(cmd.ErrOrStderr(), "sheet: %s\n", line)
	}
	return st, nil
}
