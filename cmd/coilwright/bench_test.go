package main

import (
	"io"
	"testing"
)

// Target (issue): `pairs` over Q <= 120, 2p <= 120, both layers, under 0.3 s as
// a whole process. This runs the whole command in-process, JSON included; the
// process start adds a few milliseconds.
func BenchmarkPairsCommand120(b *testing.B) {
	args := []string{"pairs", "--max-slots", "120", "--max-poles", "120", "--json"}
	for b.Loop() {
		if code := run(args, io.Discard, io.Discard); code != 0 {
			b.Fatalf("exit %d", code)
		}
	}
}

// The plan of the demo job as text, from the embedded job to the last line.
func BenchmarkPlanDemoCommand(b *testing.B) {
	args := []string{"plan", "--demo"}
	for b.Loop() {
		if code := run(args, io.Discard, io.Discard); code != 0 {
			b.Fatalf("exit %d", code)
		}
	}
}
