package tui

import (
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/job"
	"coilwright/winding/job/jobtest"
	"coilwright/winding/plan"
)

// FuzzGuideScreens carries arbitrary job files (seeded with testdata/job/)
// through the plan into the guide: every screen, at a range of terminal sizes
// and after a few keys, must render without a panic.
func FuzzGuideScreens(f *testing.F) {
	for i, data := range jobtest.Seeds(f) {
		f.Add(data, uint8(20+10*i), uint8(5+5*i))
	}
	f.Fuzz(func(t *testing.T, data []byte, w, h uint8) {
		if len(data) > 4096 {
			return
		}
		j, err := job.Parse(data, "fuzz.toml")
		if err != nil || j.Winding.Slots > 240 {
			return
		}
		p, err := plan.Build(j)
		if err != nil {
			return
		}
		m := New(Options{Plan: p, Now: fixedNow})
		_ = m.View() // before the first size message
		for _, size := range [][2]int{{int(w), int(h)}, {80, 24}, {0, 0}, {int(h), int(w)}} {
			drive(t, m, tea.WindowSizeMsg{Width: size[0], Height: size[1]})
			for _, k := range []string{"enter", " ", "1", "o", "?", "esc", "tab", "enter"} {
				drive(t, m, press(k))
				_ = m.View()
			}
		}
	})
}

// FuzzDemoVariants varies the demo job's pair, layers, paths, phases,
// connection and rotor side and renders every screen of each accepted plan.
func FuzzDemoVariants(f *testing.F) {
	f.Add(24, 28, 2, 1, 3, false, false, uint8(80), uint8(24))
	f.Add(12, 10, 1, 2, 3, true, true, uint8(24), uint8(7))
	f.Add(120, 112, 2, 4, 3, false, true, uint8(200), uint8(60))
	f.Add(20, 18, 2, 2, 5, true, false, uint8(100), uint8(30))
	f.Fuzz(func(t *testing.T, slots, poles, layers, paths, phases int, delta, inner bool, w, h uint8) {
		if slots > 240 || poles > 240 {
			return
		}
		j := jobtest.DemoVariant(jobtest.Variant{Slots: slots, Poles: poles, Layers: layers, Paths: paths,
			Phases: phases, Delta: delta, InnerRotor: inner, TurnsPerCoil: 10})
		p, err := plan.Build(j)
		if err != nil {
			return
		}
		m := New(Options{Plan: p, Now: fixedNow})
		drive(t, m, tea.WindowSizeMsg{Width: int(w), Height: int(h)})
		for _, k := range []string{"enter", "enter", "enter", "1", "0", "enter", "left", "[", " ", "o", "up", "enter", "right", "]", "?", "esc"} {
			drive(t, m, press(k))
			_ = m.View()
		}
	})
}
