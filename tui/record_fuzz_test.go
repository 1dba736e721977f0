package tui

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/x/ansi"

	"coilwright/printout"
	"coilwright/winding/journal"
	"coilwright/winding/progress"
)

// FuzzRecordScreens feeds arbitrary progress records (seeded with
// testdata/journal/*.jsonl) through the one model of progress into every
// screen of the guide and into the printed pack: nothing may panic, and no
// control character of a record may reach the terminal.
func FuzzRecordScreens(f *testing.F) {
	seeds, err := filepath.Glob(filepath.Join("..", "testdata", "journal", "*.jsonl"))
	if err != nil || len(seeds) == 0 {
		f.Fatalf("no record seeds under testdata/journal (%v)", err)
	}
	for _, s := range seeds {
		data, err := os.ReadFile(s)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(data)
	}
	p := demoPlan(f)
	f.Fuzz(func(t *testing.T, data []byte) {
		events, _, err := journal.Decode(data)
		if err != nil {
			return
		}
		st := progress.Fold(p, events)
		_ = st.Summary()
		m := New(Options{Plan: p, History: events, Now: fixedNow})
		for _, size := range [][2]int{{80, 24}, {60, 18}, {20, 5}} {
			drive(t, m, tea.WindowSizeMsg{Width: size[0], Height: size[1]})
			for _, k := range []string{"left", "right", "o", "up", "enter", "?", "esc", "esc", " ", "enter"} {
				drive(t, m, press(k))
				if v := ansi.Strip(m.View()); strings.ContainsFunc(v, func(r rune) bool { return r < 0x20 && r != '\n' || r == 0x7f || r >= 0x80 && r < 0xa0 }) {
					t.Fatalf("a control character reaches the terminal after %q at %v", k, size)
				}
			}
		}
		if _, err := printout.Build(p, printout.Options{Progress: st}); err != nil {
			t.Fatalf("printout.Build with the record: %v", err)
		}
	})
}
