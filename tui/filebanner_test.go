package tui

import (
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"
)

// TestRecordFileBannerStaysWhileCounting: what the store says about the
// record file (removed or replaced under the guide and written again) stays
// above the guide while the winder counts the coil in hand with the space
// bar, and goes when the step in hand changes; the help screen keeps it.
func TestRecordFileBannerStaysWhileCounting(t *testing.T) {
	p := demoPlan(t)
	m := New(Options{Plan: p, Now: fixedNow})
	drive(t, m, tea.WindowSizeMsg{Width: 80, Height: 24})
	keys(t, m, repeat("enter", checksBefore(p, 1))...)
	const said = "the progress record was removed while open; it was written again"
	drive(t, m, savedMsg{notices: []string{said}})
	for i := range 5 {
		keys(t, m, " ")
		if !strings.Contains(plain(m), said) {
			t.Fatalf("after %d turns counted the record file's notice is gone:\n%s", i+1, plain(m))
		}
	}
	keys(t, m, "1", "8", "enter") // type the planned count and apply it
	if !strings.Contains(plain(m), said) {
		t.Fatalf("the notice went before the coil was done:\n%s", plain(m))
	}
	keys(t, m, "enter") // the coil is done: the step in hand changes
	if strings.Contains(plain(m), said) {
		t.Errorf("the notice stays after the step in hand changed:\n%s", plain(m))
	}
	if !strings.Contains(strings.Join(m.c.said, "\n"), said) {
		t.Errorf("what the help screen keeps (%q) lacks the record file's notice", m.c.said)
	}
}
