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
	var out, paper, date string
	cmd := &cobra.Command{
		Use:   "sheet JOB | --demo -o FILE.pdf",
		Short: "Shop pack as PDF: slot map, developed layout, connections, cut list, checklist, test record",
		Long: `sheet prints the shop pack of a job for the bench and the stator's file: the
slot map with a title block, the developed layout, the connection sheet with
terminal marks and joints, the cut list and materials, the winding checklist
(one row per coil in winding order) and the test record with its cautions.
Readings already saved in the job's progress record fill the test record.
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
			readings, err := recordedReadings(path)
			if err != nil {
				return err
			}
			pk, err := printout.Build(p, printout.Options{Paper: pp, Date: when, Readings: readings})
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
	cmd.Flags().StringVar(&date, "date", "", "date printed on the pack and in the PDF, YYYY-MM-DD (default: the job's date)")
	return cmd
}

// recordedReadings reads the test readings saved in the job's progress
// record, latest per test. A job without a record has none; the demo has none.
func recordedReadings(jobPath string) (map[string]printout.Reading, error) {
	if jobPath == "" {
		return nil, nil
	}
	data, err := os.ReadFile(journal.PathFor(jobPath))
	if errors.Is(err, fs.ErrNotExist) {
		return nil, nil
	}
	if err != nil {
		return nil, fmt.Errorf("sheet: read progress record: %w", err)
	}
	events, _, err := journal.Decode(data)
	if err != nil {
		return nil, badInput(err)
	}
	st := journal.Replay(events)
	out := make(map[string]printout.Reading, len(st.Readings))
	for name, e := range st.Readings {
		out[name] = printout.Reading{Values: e.Readings, Taken: e.Time, Verdict: e.Verdict}
	}
	return out, nil
}
