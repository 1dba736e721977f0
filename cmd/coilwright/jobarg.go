package main

import (
	"errors"

	"github.com/spf13/cobra"

	"coilwright/winding/job"
	"coilwright/winding/plan"
)

// addDemoFlag adds --demo to a command that reads a job.
func addDemoFlag(cmd *cobra.Command, demo *bool) {
	cmd.Flags().BoolVar(demo, "demo", false, "use the built-in demo job (a stream-turbine battery charger) instead of a file")
}

// loadJobArg reads the job a command works on: exactly one of a JOB argument
// or --demo. A missing, unreadable or invalid file is invalid input (exit
// status 2). path is "" for the demo. Use it with Args: maxArgs(1) and
// addDemoFlag; a command that needs the plan too calls loadPlanArg.
func loadJobArg(cmd *cobra.Command, args []string, demo bool) (j *job.Job, path string, err error) {
	switch {
	case demo && len(args) > 0:
		return nil, "", badInputf("give either a job file or --demo, not both")
	case demo:
		return job.Demo(), "", nil
	case len(args) == 0:
		return nil, "", badInputf("no job file given: name one (e.g. %s job.toml) or use --demo; `coilwright new -o job.toml` writes a job file", cmd.CommandPath())
	case len(args) > 1:
		return nil, "", badInputf("give one job file, not %d", len(args))
	}
	j, err = job.Load(args[0])
	if err != nil {
		return nil, "", badInput(err)
	}
	return j, args[0], nil
}

// loadPlanArg reads the job as loadJobArg does and builds its plan; a job the
// plan refuses (no balanced winding, turns that do not fit...) is invalid
// input too.
func loadPlanArg(cmd *cobra.Command, args []string, demo bool) (j *job.Job, p *plan.Plan, path string, err error) {
	j, path, err = loadJobArg(cmd, args, demo)
	if err != nil {
		return nil, nil, "", err
	}
	p, err = plan.Build(j)
	if err != nil {
		var fe *job.FieldError
		if errors.As(err, &fe) {
			return nil, nil, "", badInput(err)
		}
		return nil, nil, "", err
	}
	return j, p, path, nil
}
