package progress

import (
	"fmt"
	"strconv"
	"strings"

	"coilwright/winding/journal"
	"coilwright/winding/plan"
)

// Fold replays a record's events, in order, against the plan. It accepts any
// events: entries that do not fit the plan are left out and listed in
// Dropped with their line and why, never guessed at; kinds it does not know
// (a newer coilwright wrote them) are skipped.
func Fold(p *plan.Plan, events []journal.Event) *State {
	s := New(p)
	now := Fingerprint(p)
	var last map[string]string
	for _, e := range events {
		s.LastSeq = max(s.LastSeq, e.Seq)
		if e.Kind != journal.Plan && e.Time.After(s.Recorded) {
			s.Recorded = e.Time // work, not the plan's fingerprint
		}
		if e.Kind == journal.Plan {
			last = e.Plan
			s.fingerprint, s.same = e.Plan, Same(e.Plan, now)
			continue
		}
		i, reason := s.locate(e)
		if reason == "" {
			var changed bool
			changed, reason = s.apply(i, e)
			if changed && i >= 0 && e.Step > 0 && e.Step != i+1 {
				s.Moved++
			}
			if changed {
				s.kept[e.Kind]++
			}
		}
		if reason != "" {
			s.Dropped = append(s.Dropped, Dropped{Line: e.Line, Kind: e.Kind, Key: e.Key, Tooth: e.Tooth, Reason: reason})
		}
	}
	if last != nil {
		s.Changes = Changes(last, now)
	}
	return s
}

// locate is the one rule for whether an entry fits the plan: it returns the
// step (0-based) the entry belongs to, -1 for an entry of no step, or why it
// fits none.
func (s *State) locate(e journal.Event) (int, string) {
	if e.Key != "" {
		if i, ok := s.index[e.Key]; ok {
			return i, ""
		}
		if e.Tooth > 0 {
			if i := s.coilOnTooth(e.Tooth); i >= 0 {
				return 0, fmt.Sprintf("it was recorded for %s; that tooth now carries %s", e.Key, s.keys[i])
			}
			return 0, fmt.Sprintf("it was recorded for %s; tooth %d carries no coil in this plan", e.Key, e.Tooth)
		}
		return 0, fmt.Sprintf("it was recorded for %q, which this plan no longer has", e.Key)
	}
	// Entries written before steps carried their key.
	if e.Tooth > 0 {
		if i := s.coilOnTooth(e.Tooth); i >= 0 {
			return i, ""
		}
		return 0, fmt.Sprintf("tooth %d carries no coil in this plan", e.Tooth)
	}
	if e.Kind == journal.Reading && e.Test != "" {
		for i, k := range s.keys {
			if k == "test "+e.Test {
				return i, ""
			}
		}
		if e.Step == 0 {
			return -1, ""
		}
		return 0, fmt.Sprintf("this plan has no test %q", e.Test)
	}
	if e.Step == 0 {
		return -1, ""
	}
	if s.same && e.Step <= len(s.Steps) {
		return e.Step - 1, "" // the plan is the one it was written against
	}
	return 0, "it names step " + strconv.Itoa(e.Step) + " only by its number, and the plan may have changed since"
}

// coilOnTooth is the coil step on a tooth, or -1.
func (s *State) coilOnTooth(tooth int) int {
	for i := range s.Steps {
		if c := s.coil(i); c != nil && c.Tooth == tooth {
			return i
		}
	}
	return -1
}

// NeedsFingerprint reports whether a record folded into this state lacks
// the plan's fingerprint as its latest (a new record, or one written against
// another plan): a writer then records the fingerprint before its first entry.
func (s *State) NeedsFingerprint() bool {
	return s.fingerprint == nil || !s.same
}

// FingerprintEvent is the plan event a writer records.
func FingerprintEvent(p *plan.Plan) journal.Event {
	return journal.Event{Kind: journal.Plan, Plan: Fingerprint(p)}
}

// Summary says in words what the resume found: what changed in the plan and
// what was done with each kind of entry. It is empty when the record fits
// the plan as it is. The bench guide and the printed pack show these lines.
func (s *State) Summary() []string {
	var out []string
	if len(s.Changes) > 0 {
		out = append(out, "The job changed since this progress was recorded: "+strings.Join(s.Changes, "; ")+".")
		if off := s.doneOffPlan(); off > 0 {
			out = append(out, fmt.Sprintf("%d wound %s the turns recorded; the plan now asks %d per coil.",
				off, plural(off, "coil keeps", "coils keep"), s.plan.TurnsPerCoil))
		}
	}
	if len(s.Changes) > 0 || len(s.Dropped) > 0 {
		out = append(out, "Entries that still fit their steps were kept: "+s.keptWords()+".")
	}
	if s.Moved > 0 {
		out = append(out, fmt.Sprintf("%d %s matched to their steps by what they are (coil by tooth, phase and sense), now under other step numbers.",
			s.Moved, plural(s.Moved, "entry was", "entries were")))
	}
	// One line per kind of entry and reason, in the order first met.
	type group struct {
		coil   bool
		reason string
	}
	var order []group
	by := map[group][]Dropped{}
	for _, d := range s.Dropped {
		g := group{d.Tooth > 0, d.Reason}
		if by[g] == nil {
			order = append(order, g)
		}
		by[g] = append(by[g], d)
	}
	for _, g := range order {
		ds, kind := by[g], "other"
		if g.coil {
			kind = "coil"
		}
		out = append(out, fmt.Sprintf("%d %s %s left out (%s): %s.", len(ds), kind, plural(len(ds), "entry", "entries"), lines(ds), g.reason))
	}
	if len(s.Dropped) > 0 {
		out = append(out, "What was left out stays in the record file as it is (nothing is deleted); those steps show as still to do.")
	}
	return out
}

// keptWords says how many entries of each kind were kept.
func (s *State) keptWords() string {
	var parts []string
	for _, k := range []struct {
		kind      journal.Kind
		one, many string
	}{
		{journal.Done, "step done", "steps done"},
		{journal.Undo, "undo", "undos"},
		{journal.Turns, "turn count", "turn counts"},
		{journal.Note, "note", "notes"},
		{journal.Reading, "reading", "readings"},
	} {
		if n := s.kept[k.kind]; n > 0 {
			parts = append(parts, fmt.Sprintf("%d %s", n, plural(n, k.one, k.many)))
		}
	}
	if len(parts) == 0 {
		return "none"
	}
	return strings.Join(parts, ", ")
}

// doneOffPlan counts the wound coils whose turns differ from the plan's.
func (s *State) doneOffPlan() int {
	n := 0
	for i, st := range s.Steps {
		if c := s.coil(i); c != nil && st.Done && st.Turns != c.Turns {
			n++
		}
	}
	return n
}

// lines names the record lines of dropped entries, the first few.
func lines(ds []Dropped) string {
	var ls []string
	for _, d := range ds {
		if d.Line > 0 {
			ls = append(ls, strconv.Itoa(d.Line))
		}
	}
	switch {
	case len(ls) == 0:
		return "not from the record"
	case len(ls) > 4:
		ls = append(ls[:4], "...")
	}
	w := "line "
	if len(ls) > 1 {
		w = "lines "
	}
	return w + strings.Join(ls, ", ")
}

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}

func itoa(n int) string { return strconv.Itoa(n) }
