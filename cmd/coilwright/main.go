// Command coilwright lays out, plans, guides and proves hand-wound tooth-coil
// stators. It only wires flags to the packages; see the package docs for the
// domain.
package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"strings"

	"github.com/spf13/cobra"
)

// version is set at build time with -ldflags "-X main.version=...".
var version = "0.1.0-dev"

func main() {
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

// run executes the command line and returns the exit status: 0 on success, 2
// for invalid input (one message on stderr), 1 for any other failure.
func run(args []string, stdout, stderr io.Writer) int {
	root := newRoot()
	root.SetArgs(args)
	root.SetOut(stdout)
	root.SetErr(stderr)
	err := root.Execute()
	if err == nil {
		return 0
	}
	fmt.Fprintf(stderr, "coilwright: %s\n", oneLine(err.Error()))
	var ue *usageError
	// cobra reports a mistyped command name with a plain error
	if errors.As(err, &ue) || strings.HasPrefix(err.Error(), "unknown command") {
		return 2
	}
	return 1
}

// oneLine folds a multi-line message (cobra's "Did you mean this?" list)
// into one line, so every refusal is a single line on stderr.
func oneLine(msg string) string {
	msg = strings.TrimSpace(msg)
	if !strings.Contains(msg, "\n") {
		return msg
	}
	msg = strings.Replace(msg, "\n\nDid you mean this?\n", "; did you mean: ", 1)
	return strings.Join(strings.Fields(msg), " ")
}

// usageError marks an error caused by what the user gave (exit status 2).
type usageError struct{ err error }

func (e *usageError) Error() string { return e.err.Error() }
func (e *usageError) Unwrap() error { return e.err }

// badInput wraps err as invalid input (exit 2).
func badInput(err error) error {
	if err == nil {
		return nil
	}
	return &usageError{err}
}

// badInputf formats an invalid-input error (exit 2).
func badInputf(format string, a ...any) error { return &usageError{fmt.Errorf(format, a...)} }

// subcommands is filled by each command file's init, so each command lives in
// a file of its own.
var subcommands []func() *cobra.Command

func register(f func() *cobra.Command) { subcommands = append(subcommands, f) }

func newRoot() *cobra.Command {
	root := &cobra.Command{
		Use:   "coilwright",
		Short: "Lay out, plan, wind and prove hand-wound tooth-coil stators",
		Long: `coilwright turns a stator of Q slots and a rotor of 2p poles into a balanced
tooth-coil winding, a build plan (turns, wire, fill, lengths, resistance), a
coil-by-coil bench guide, checks of the finished winding, and a printed shop pack.`,
		Version:       version,
		SilenceUsage:  true,
		SilenceErrors: true,
	}
	root.SetFlagErrorFunc(func(_ *cobra.Command, err error) error { return badInput(err) })
	for _, f := range subcommands {
		c := f()
		c.SetFlagErrorFunc(func(_ *cobra.Command, err error) error { return badInput(err) })
		root.AddCommand(c)
	}
	return root
}

// exactArgs is cobra.ExactArgs with the exit status of invalid input.
func exactArgs(n int) cobra.PositionalArgs {
	return func(cmd *cobra.Command, args []string) error {
		return badInput(cobra.ExactArgs(n)(cmd, args))
	}
}

// maxArgs is cobra.MaximumNArgs with the exit status of invalid input.
func maxArgs(n int) cobra.PositionalArgs {
	return func(cmd *cobra.Command, args []string) error {
		return badInput(cobra.MaximumNArgs(n)(cmd, args))
	}
}
