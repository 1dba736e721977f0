package tui

import (
	"testing"

	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// Readings recorded by check (under the plan's reading keys) show on the
// bench by name and unit, not as bare numbers.
func TestReadingTextBySchema(t *testing.T) {
	p := handPlan(t, 12, 10, 2)
	c := &shared{plan: p, tests: map[string]plan.Test{}}
	for _, tt := range p.Tests {
		c.tests[tt.Name] = tt
	}
	s := plan.Step{Kind: plan.StepTest, Test: plan.TestResistance}
	got := c.readingText(s, &progress.Reading{Values: map[string]float64{"uv": 0.9812, "vw": 0.98, "wu": 0.9801, plan.KeyTemp: 22.5}})
	want := "U–V 981.2 mΩ, V–W 980 mΩ, W–U 980.1 mΩ, temp 22.5 °C"
	if got != want {
		t.Errorf("readingText = %q; want %q", got, want)
	}
}
