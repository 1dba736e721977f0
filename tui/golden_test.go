package tui

import (
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/plan"
)

// doneUpTo is a history with every step before the first of kind/test done.
func doneUpTo(p *plan.Plan, match func(plan.Step) bool) []Entry {
	var h []Entry
	for _, s := range p.Steps {
		if match(s) {
			break
		}
		e := Entry{Kind: EntryDone, Step: s.Index}
		if s.Coil != nil {
			e.Turns = s.Coil.Turns
		}
		h = append(h, e)
	}
	return h
}

func TestGoldenScreens(t *testing.T) {
	// Hand-built plans keep these screens independent of the plan builder's
	// wording; the demo plan is exercised by the flows.
	small := handPlan(t, 12, 10, 2)
	big := handPlan(t, 120, 112, 2)
	firstCoil := func(p *plan.Plan) []Entry {
		return doneUpTo(p, func(s plan.Step) bool { return s.Kind == plan.StepCoil })
	}
	// Coil 1 wound short with a note, coil 2 as planned, coil 3 in hand.
	lookBack := []Entry{
		{Kind: EntryDone, Step: 1},
		{Kind: EntryNote, Step: 2, Note: "last turn loose, pressed down"},
		{Kind: EntryDone, Step: 2, Turns: 11},
		{Kind: EntryDone, Step: 3},
		{Kind: EntryDone, Step: 4, Turns: 12},
		{Kind: EntryDone, Step: 5},
	}
	tests := []struct {
		name    string
		p       *plan.Plan
		history []Entry
		w, h    int
		keys    []string
	}{
		{name: "start_80x24", p: small, w: 80, h: 24},
		{name: "coil_80x24", p: small, w: 80, h: 24, history: firstCoil(small), keys: []string{"1", "7", "enter"}},
		{name: "typing_count_80x24", p: small, w: 80, h: 24, history: firstCoil(small), keys: []string{" ", "1", "7"}},
		{name: "coil_100x30", p: small, w: 100, h: 30, history: firstCoil(small), keys: []string{" ", " ", " ", " ", " "}},
		{name: "coil_60x18", p: small, w: 60, h: 18, history: firstCoil(small), keys: []string{" "}},
		{name: "confirm_turns_80x24", p: small, w: 80, h: 24, history: firstCoil(small), keys: []string{"1", "6", "enter", "enter"}},
		{name: "third_coil_120x40", p: small, w: 120, h: 40, history: doneUpTo(small, func(s plan.Step) bool { return s.Coil != nil && s.Coil.Order == 3 })},
		{name: "jumper_80x24", p: small, w: 80, h: 24, history: doneUpTo(small, func(s plan.Step) bool { return s.Kind == plan.StepJumper })},
		{name: "jumper_60x18", p: small, w: 60, h: 18, history: doneUpTo(small, func(s plan.Step) bool { return s.Kind == plan.StepJumper })},
		{name: "resistance_fields_80x24", p: small, w: 80, h: 24,
			history: doneUpTo(small, func(s plan.Step) bool { return s.Test == plan.TestResistance }), keys: []string{"enter"}},
		{name: "resistance_fields_60x18", p: small, w: 60, h: 18,
			history: doneUpTo(small, func(s plan.Step) bool { return s.Test == plan.TestResistance }), keys: []string{"enter"}},
		{name: "separator_80x24", p: small, w: 80, h: 24, history: doneUpTo(small, func(s plan.Step) bool { return s.Kind == plan.StepSeparator })},
		{name: "hv_test_100x30", p: small, w: 100, h: 30, history: doneUpTo(small, func(s plan.Step) bool { return s.Test == plan.TestHighVoltage })},
		{name: "resistance_verdict_100x30", p: small, w: 100, h: 30,
			history: doneUpTo(small, func(s plan.Step) bool { return s.Test == plan.TestResistance }),
			keys:    []string{"enter", "0", ".", "9", "8", "enter", "0", ".", "9", "8", "enter", "0", ".", "9", "8", "enter", "enter"}},
		{name: "overview_80x24", p: small, w: 80, h: 24, history: firstCoil(small), keys: []string{"o"}},
		{name: "help_80x24", p: small, w: 80, h: 24, keys: []string{"?"}},
		{name: "tiny_24x7", p: small, w: 24, h: 7},
		{name: "all_done_80x24", p: small, w: 80, h: 24, history: doneUpTo(small, func(plan.Step) bool { return false })},
		{name: "look_back_80x24", p: small, w: 80, h: 24, history: lookBack, keys: []string{"left", "left", "[", "["}},
		{name: "look_back_100x30", p: small, w: 100, h: 30, history: lookBack, keys: []string{"left", "left", "[", "["}},
		{name: "look_ahead_100x30", p: small, w: 100, h: 30, history: lookBack, keys: []string{"right", "]"}},
		{name: "overview_pick_80x24", p: small, w: 80, h: 24, history: lookBack, keys: []string{"o", "up", "up"}},
		{name: "q120_look_strip_80x24", p: big, w: 80, h: 24, history: doneUpTo(big, func(s plan.Step) bool { return s.Coil != nil && s.Coil.Order == 60 }), keys: repeat("left", 9)},
		{name: "q120_strip_80x24", p: big, w: 80, h: 24, history: doneUpTo(big, func(s plan.Step) bool { return s.Coil != nil && s.Coil.Order == 60 })},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			m := New(Options{Plan: tc.p, Recorder: &memRecorder{}, History: stamped(tc.p, tc.history), Where: "/home/winder/.local/state/coilwright/demo.progress", Now: fixedNow})
			drive(t, m, tea.WindowSizeMsg{Width: tc.w, Height: tc.h})
			keys(t, m, tc.keys...)
			golden(t, tc.name+".txt", plain(m)+"\n")
		})
	}
}
