package main

import (
	"fmt"

	"github.com/spf13/cobra"
)

func init() { register(newPlanCmd) }

func newPlanCmd() *cobra.Command {
	var demo, asJSON bool
	cmd := &cobra.Command{
		Use:   "plan JOB | --demo",
		Short: "Build plan of a job: turns, wire, fill, lengths, resistance, bench steps, tests",
		Long: `plan reads a job file and prints what is needed to wind it: the layout, the
turns (given or solved from the voltage target), the wire and slot fill, the
mean turn and every length to cut, the expected resistance, the bench steps in
order and the test plan with its limits and sources.`,
		Example: "  coilwright plan --demo\n  coilwright plan stator.toml --json",
		Args:    maxArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			_, p, _, err := loadPlanArg(cmd, args, demo)
			if err != nil {
				return err
			}
			if asJSON {
				return writeJSON(cmd.OutOrStdout(), p)
			}
			_, err = fmt.Fprint(cmd.OutOrStdout(), p.Text())
			return err
		},
	}
	addDemoFlag(cmd, &demo)
	cmd.Flags().BoolVar(&asJSON, "json", false, "write the plan as JSON")
	return cmd
}
