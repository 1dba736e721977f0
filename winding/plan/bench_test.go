package plan

import (
	"strings"
	"testing"

	"coilwright/winding/job"
)

// bench120 is a 120-slot, 112-pole outer-rotor stator (a large direct-drive
// generator) with 4 parallel paths: 40 coils per phase.
var bench120 = strings.NewReplacer(
	"slots = 12", "slots = 120", "poles = 10", "poles = 112\npaths = 4",
	`rotor = "inner"`, `rotor = "outer"`, "diameter_mm = 60", "diameter_mm = 600",
).Replace(handJob)

func BenchmarkBuild120Slots(b *testing.B) {
	j := mustJob(b, bench120)
	if p := mustPlan(b, j); len(p.Coils) != 120 {
		b.Fatalf("%d coils; want 120", len(p.Coils))
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Build(j); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkBuild12Slots(b *testing.B) {
	j := mustJob(b, handJob)
	for b.Loop() {
		if _, err := Build(j); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkBuildDemo is the whole demo plan, machine figures and charging
// curve included; the target is under 1 ms.
func BenchmarkBuildDemo(b *testing.B) {
	j := job.Demo()
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Build(j); err != nil {
			b.Fatal(err)
		}
	}
}
