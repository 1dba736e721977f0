package tui

import (
	"testing"
	"time"

	tea "github.com/charmbracelet/bubbletea"
)

// TestWriterGathersFastKeys drives the writer on a simulated clock: turns
// counted at key-repeat speed (30 a second) and all at once (keys sent in one
// burst) cost at most 15 writes (fsyncs) for 60 turns with the bench's gap,
// every turn written in order; a turn a second is written at once, one write
// each (nothing waits when the winder counts by hand).
func TestWriterGathersFastKeys(t *testing.T) {
	saved := gatherTick
	defer func() { gatherTick = saved }()
	// The timer is stood in for by the simulation below: the command only
	// names its message.
	gatherTick = func(_ time.Duration, fn func(time.Time) tea.Msg) tea.Cmd {
		return func() tea.Msg { return fn(time.Time{}) }
	}
	cases := []struct {
		name      string
		every     time.Duration // between keys
		keys      int
		maxWrites int
		minWrites int
	}{
		{"burst", 0, 60, 15, 2},
		{"key repeat 30 a second", time.Second / 30, 60, 15, 2},
		{"key repeat 50 a second", time.Second / 50, 60, 15, 2},
		{"a turn a second", time.Second, 10, 10, 10},
		{"a turn every 200 ms", 200 * time.Millisecond, 20, 20, 20},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			rec := &memRecorder{}
			now := time.Date(2026, 12, 1, 12, 0, 0, 0, time.UTC)
			w := &writer{rec: rec, gap: BurstGap, clock: func() time.Time { return now }}
			var due time.Time // when the pending gather timer fires; zero if none
			var handle func(tea.Cmd)
			handle = func(cmd tea.Cmd) {
				if cmd == nil {
					return
				}
				switch msg := cmd().(type) {
				case savedMsg:
					handle(w.saved(msg))
				case gatherMsg:
					due = w.lastStart.Add(w.gap)
				case nil:
				default:
					t.Fatalf("unexpected message %T", msg)
				}
			}
			fire := func() {
				if !due.IsZero() && !now.Before(due) {
					due = time.Time{}
					handle(w.gather())
				}
			}
			for i := range tc.keys {
				fire()
				w.push(Entry{Kind: EntryTurns, Step: 5, Turns: i + 1})
				handle(w.kick())
				now = now.Add(tc.every)
			}
			for !due.IsZero() { // the last gathered keys
				now = due
				fire()
			}
			if !w.settled() {
				t.Fatalf("writer not settled after the last key: %d pending", w.pending())
			}
			if rec.appends > tc.maxWrites || rec.appends < tc.minWrites {
				t.Errorf("%d turns cost %d writes; want %d..%d", tc.keys, rec.appends, tc.minWrites, tc.maxWrites)
			}
			got := rec.all()
			if len(got) != tc.keys {
				t.Fatalf("recorded %d entries; want %d", len(got), tc.keys)
			}
			for i, e := range got {
				if e.Turns != i+1 {
					t.Fatalf("entry %d has %d turns; want %d (in order)", i, e.Turns, i+1)
				}
			}
		})
	}
}
