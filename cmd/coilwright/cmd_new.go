package main

import (
	"errors"
	"fmt"
	"io/fs"
	"os"

	"github.com/spf13/cobra"

	"coilwright/winding/job"
)

func init() { register(newNewCmd) }

func newNewCmd() *cobra.Command {
	var demo, force bool
	var out string
	cmd := &cobra.Command{
		Use:   "new [--demo] -o FILE",
		Short: "Write a commented job file (a blank template, or the demo)",
		Long: `new writes a job file to edit: every field with a comment giving its unit,
its typical range and what it changes. With --demo it writes the built-in demo
job instead, a battery-charging generator for a small stream turbine. It will
not overwrite a file unless --force is given. Use -o - to write to standard output.`,
		Example: "  coilwright new -o stator.toml\n  coilwright new --demo -o demo.toml",
		Args:    exactArgs(0),
		RunE: func(cmd *cobra.Command, _ []string) error {
			if out == "" {
				return badInputf("no output file: give -o FILE (or -o - for standard output)")
			}
			data := job.TemplateTOML()
			if demo {
				data = job.DemoTOML()
			}
			if out == "-" {
				_, err := cmd.OutOrStdout().Write(data)
				return err
			}
			if !force {
				if _, err := os.Lstat(out); err == nil {
					return badInputf("%s already exists; give --force to overwrite it, or another name", out)
				}
			}
			if err := writeOutput("-o", out, data); err != nil {
				var ue *usageError
				if errors.As(err, &ue) {
					return err
				}
				return badInputf("cannot write %s: %v", out, pathErr(err))
			}
			what := "job template"
			if demo {
				what = "demo job"
			}
			fmt.Fprintf(cmd.ErrOrStderr(), "wrote %s to %s; next: coilwright plan %s\n", what, out, out)
			return nil
		},
	}
	cmd.Flags().BoolVar(&demo, "demo", false, "write the built-in demo job instead of the blank template")
	cmd.Flags().BoolVar(&force, "force", false, "overwrite FILE if it exists")
	cmd.Flags().StringVarP(&out, "output", "o", "", "the file to write (- for standard output)")
	return cmd
}

func pathErr(err error) error {
	var pe *fs.PathError
	if errors.As(err, &pe) {
		return pe.Err
	}
	return err
}
