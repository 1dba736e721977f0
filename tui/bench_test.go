package tui

import (
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/plan"
)

// benchView times View() at a coil in the middle of a stator.
func benchView(b *testing.B, p *plan.Plan, w, h int, extra ...string) {
	hist := doneUpTo(p, func(s plan.Step) bool { return s.Coil != nil && s.Coil.Order == s.Coil.Of/2 })
	m := New(Options{Plan: p, History: stamped(p, hist), Now: fixedNow})
	m.Update(tea.WindowSizeMsg{Width: w, Height: h})
	m.Update(press(" "))
	for _, k := range extra {
		m.Update(press(k))
	}
	_ = m.View() // fill the ring cache as the first frame would
	b.ReportAllocs()
	b.ResetTimer()
	for b.Loop() {
		_ = m.View()
	}
}

// BenchmarkView120Slots is the guide on a 120-slot stator (a developed strip).
func BenchmarkView120Slots(b *testing.B) { benchView(b, handPlan(b, 120, 112, 2), 120, 40) }

// BenchmarkView120Slots80x24 is the same on the smallest usable terminal.
func BenchmarkView120Slots80x24(b *testing.B) { benchView(b, handPlan(b, 120, 112, 2), 80, 24) }

// BenchmarkViewRing24 is the demo-sized stator drawn as a ring.
func BenchmarkViewRing24(b *testing.B) { benchView(b, handPlan(b, 24, 28, 2), 140, 45) }

// BenchmarkView120SlotsLooking is the 120-slot guide looking back three
// steps (banner, '*' tooth, strip centred on it).
func BenchmarkView120SlotsLooking(b *testing.B) {
	benchView(b, handPlan(b, 120, 112, 2), 120, 40, "left", "left", "left")
}
