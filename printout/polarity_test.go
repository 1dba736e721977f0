package printout

import (
	"strconv"
	"strings"
	"testing"

	"coilwright/winding/journal"
	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// The polarity sheet has one cell per wound tooth with the pole of the plan,
// phase by phase, the cautions, and a tick where the record says the tooth
// showed that pole (the pole seen written in where it did not).
func TestPolaritySheet(t *testing.T) {
	p := demoPlan(t)
	rec := Reading{Values: map[string]float64{plan.PoleKey(1): -1, plan.PoleKey(2): -1}} // tooth 1 S as planned, tooth 2 S where N is planned
	pk, err := Build(p, Options{Readings: map[string]Reading{plan.TestPolarity: rec}})
	if err != nil {
		t.Fatal(err)
	}
	pages := pagesOf(pk, PolarityPage)
	if len(pages) != 1 {
		t.Fatalf("%d polarity sheets; want 1 for 24 teeth", len(pages))
	}
	texts := pages[0].Texts()
	all := strings.Join(texts, "\n")
	for _, want := range []string{"current-limited", "Switch the supply off", "1.3 A", "Phase U: DC into U1 (+), out of U2 (−)", "Phase W: DC into W1 (+), out of W2 (−)", "S!"} {
		if !strings.Contains(all, want) {
			t.Errorf("polarity sheet lacks %q", want)
		}
	}
	// every tooth's number is followed by its pole
	for _, tp := range p.Polarity {
		found := false
		for i, s := range texts {
			if s == "tooth "+strconv.Itoa(tp.Tooth) && i+1 < len(texts) && texts[i+1] == string(tp.Pole) {
				found = true
			}
		}
		if !found {
			t.Errorf("polarity sheet: no cell 'tooth %d' showing %s", tp.Tooth, tp.Pole)
		}
	}
	ticks := 0
	for _, s := range pages[0].Shapes {
		if pl, ok := s.(*Poly); ok && !pl.Closed && len(pl.Points) == 3 {
			ticks++
		}
	}
	if ticks != 1 {
		t.Errorf("polarity sheet: %d ticks; want 1 (tooth 1 read as planned)", ticks)
	}
}

// With a progress record, the sheet ticks the teeth read on every polarity
// step, not only the latest step's.
func TestPolaritySheetFromRecord(t *testing.T) {
	p := demoPlan(t)
	var events []journal.Event
	events = append(events, progress.FingerprintEvent(p))
	for _, s := range p.Steps {
		if s.Test != plan.TestPolarity || len(s.Phases) != 1 || s.Phases[0] == "W" {
			continue
		}
		v := map[string]float64{}
		for _, tp := range p.PolesOf(s.Phases[0]) {
			v[plan.PoleKey(tp.Tooth)] = tp.Pole.Value()
		}
		events = append(events, progress.Stamp(p, journal.Event{Kind: journal.Reading, Step: s.Index, Readings: v, Verdict: "pass"}))
	}
	pk, err := Build(p, Options{Progress: progress.Fold(p, events)})
	if err != nil {
		t.Fatal(err)
	}
	ticks := 0
	for _, s := range pagesOf(pk, PolarityPage)[0].Shapes {
		if pl, ok := s.(*Poly); ok && !pl.Closed && len(pl.Points) == 3 {
			ticks++
		}
	}
	if ticks != 16 {
		t.Errorf("polarity sheet from a record of phases U and V: %d ticks; want 16", ticks)
	}
}
