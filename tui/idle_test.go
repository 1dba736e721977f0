package tui

import (
	"errors"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/journal"
)

// TestNothingRunsWhileIdle: no command at start, none after a resize, and a
// key only starts the write of what it changed.
func TestNothingRunsWhileIdle(t *testing.T) {
	m := New(Options{Plan: handPlan(t, 12, 10, 2), Now: fixedNow})
	if cmd := m.Init(); cmd != nil {
		t.Error("Init() returned a command; want none")
	}
	if _, cmd := m.Update(tea.WindowSizeMsg{Width: 80, Height: 24}); cmd != nil {
		t.Error("a resize returned a command; want none")
	}
	if _, cmd := m.Update(press("?")); cmd != nil {
		t.Error("opening help returned a command; want none")
	}
	m2, _ := newTest(t, 80, 24)
	if _, cmd := m2.Update(press("enter")); cmd == nil {
		t.Error("confirming a step started no write")
	}
}

// TestJournalWriteErrorCountsHeld: the store's count of kept events reaches
// the guide through JournalRecorder's error.
func TestJournalWriteErrorCountsHeld(t *testing.T) {
	err := wrapHeld(&journal.WriteError{Path: "x.progress", Pending: 3, Err: errors.New("read-only file system")})
	if got := heldAfter(err, 9); got != 3 {
		t.Errorf("heldAfter(WriteError{Pending: 3}) = %d; want 3", got)
	}
	var we *journal.WriteError
	if !errors.As(err, &we) {
		t.Error("the wrapped error no longer unwraps to *journal.WriteError")
	}
	if got := heldAfter(errors.New("other"), 4); got != 4 {
		t.Errorf("heldAfter(other error, 4) = %d; want 4", got)
	}
	if got := heldAfter(nil, 4); got != 0 {
		t.Errorf("heldAfter(nil, 4) = %d; want 0", got)
	}
}
