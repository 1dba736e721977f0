// Package jobtest gives tests the job files kept under testdata/job/ (the
// seed corpus of the fuzz tests that start from a job file), wherever in the
// tree the test lives. It is for tests only.
package jobtest

import (
	"os"
	"path/filepath"
	"runtime"
	"sort"
	"testing"

	"coilwright/winding/job"
)

// Dir is testdata/job/ of the repository, found from this file's own place.
func Dir(tb testing.TB) string {
	tb.Helper()
	_, file, _, ok := runtime.Caller(0)
	if !ok {
		tb.Fatal("jobtest: cannot tell where the source tree is")
	}
	// file is .../winding/job/jobtest/jobtest.go
	return filepath.Join(filepath.Dir(file), "..", "..", "..", "testdata", "job")
}

// Seeds returns the contents of every testdata/job/*.toml, in name order; it
// fails the test when there are none.
func Seeds(tb testing.TB) [][]byte {
	tb.Helper()
	names, err := filepath.Glob(filepath.Join(Dir(tb), "*.toml"))
	if err != nil || len(names) == 0 {
		tb.Fatalf("jobtest: no job files under %s (%v)", Dir(tb), err)
	}
	sort.Strings(names)
	out := make([][]byte, 0, len(names))
	for _, n := range names {
		data, err := os.ReadFile(n)
		if err != nil {
			tb.Fatal(err)
		}
		out = append(out, data)
	}
	return out
}

// Variant is a change to the demo job's winding, for tests that walk many
// stators through the plan.
type Variant struct {
	Slots, Poles, Layers, Paths, Phases int
	Delta, InnerRotor                   bool
	TurnsPerCoil                        int // replaces the demo's target
}

// DemoVariant is the demo job with the variant's winding, connection, rotor
// side and turns; the job may not validate (that is for the test to see).
func DemoVariant(v Variant) *job.Job {
	j := job.Demo()
	j.Winding.Slots, j.Winding.Poles, j.Winding.Layers = v.Slots, v.Poles, v.Layers
	j.Winding.Paths, j.Winding.Phases = v.Paths, v.Phases
	if v.Delta {
		j.Winding.Connection = "delta"
	}
	if v.InnerRotor {
		j.Stator.Rotor = "inner"
	}
	j.Turns = job.Turns{PerCoil: v.TurnsPerCoil}
	return j
}
