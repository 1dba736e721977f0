package progress_test

import (
	"fmt"

	"coilwright/winding/job"
	"coilwright/winding/journal"
	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// A record written against the demo job, read back after the job's target
// voltage was raised: the coil wound before keeps its turns, and the change
// is said in words.
func ExampleFold() {
	was, _ := plan.Build(job.Demo())
	coil := 0
	for coil < len(was.Steps) && was.Steps[coil].Coil == nil {
		coil++
	}
	record := []journal.Event{
		progress.FingerprintEvent(was),
		progress.Stamp(was, journal.Event{Kind: journal.Done, Step: coil + 1, Turns: was.TurnsPerCoil}),
	}
	j := job.Demo()
	j.Turns.Volts = 40
	is, _ := plan.Build(j)
	st := progress.Fold(is, record)
	fmt.Println("coil 1 done:", st.Steps[coil].Done, "with", st.Steps[coil].Turns, "turns")
	for _, line := range st.Summary() {
		fmt.Println(line)
	}
	// Output:
	// coil 1 done: true with 18 turns
	// The job changed since this progress was recorded: turns per coil changed from 18 to 26.
	// 1 wound coil keeps the turns recorded; the plan now asks 26 per coil.
	// Entries that still fit their steps were kept: 1 step done.
}
