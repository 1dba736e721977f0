package printout

import (
	"fmt"
	"time"

	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// StepProgress is what the record holds of one plan step, as the checklist
// prints it.
type StepProgress struct {
	Done  bool
	When  time.Time // when it was done; zero when unknown
	Turns int       // turns wound on a done coil; 0 for other steps
	// Skipped: an optional test done by leaving it out; its box is not
	// ticked, the row says "skipped".
	Skipped bool
}

// Note is a note of the record as the checklist prints it.
type Note struct {
	Text string
	When time.Time // zero when unknown
}

// recorded is the progress record as the checklist prints it, read from the
// one model of progress (which alone decides what fits the plan).
type recorded struct {
	steps   map[int]StepProgress // done steps by 1-based index
	notes   map[int][]Note       // by 1-based step index
	general []Note               // notes of no step
	summary []string             // what changed and what was left out, in words
	done    int                  // steps done
	coils   int                  // coil steps done
	when    time.Time
}

// matchProgress reads the progress for the steps the checklist prints; nil
// when there is no record.
func matchProgress(st *progress.State, steps []plan.Step) *recorded {
	if st == nil {
		return nil
	}
	r := &recorded{steps: map[int]StepProgress{}, notes: map[int][]Note{}, when: st.Recorded, summary: st.Summary()}
	for i, s := range steps {
		if i >= len(st.Steps) {
			break
		}
		sp := st.Steps[i]
		if sp.Done {
			p := StepProgress{Done: true, When: sp.At, Skipped: sp.Skipped}
			if s.Coil != nil {
				p.Turns = sp.Turns
				r.coils++
			}
			r.steps[s.Index] = p
			r.done++
		}
		if sp.Note != "" {
			r.notes[s.Index] = append(r.notes[s.Index], Note{Text: sp.Note, When: sp.NoteAt})
		}
	}
	for _, n := range st.General {
		r.general = append(r.general, Note{Text: n.Text, When: n.At})
	}
	return r
}

// readingsOf are the latest readings of each test in the record, as the test
// record prints them; an optional test whose step stands skipped is marked
// so, whatever was read on it before.
func readingsOf(st *progress.State, steps []plan.Step) map[string]Reading {
	if st == nil {
		return nil
	}
	out := make(map[string]Reading, len(st.Tests))
	for name, r := range st.Tests {
		out[name] = Reading{Values: r.Values, Taken: r.At, Verdict: r.Verdict}
	}
	for i, s := range steps {
		if i < len(st.Steps) && s.Kind == plan.StepTest && st.Steps[i].Done && st.Steps[i].Skipped {
			out[s.Test] = Reading{Skipped: true, Taken: st.Steps[i].At}
		}
	}
	return out
}

// dateOf prints a recorded time as a date, in the zone it was recorded in
// (the bench's own calendar day).
func dateOf(t time.Time) string { return t.Format("2006-01-02") }

// noteText is how a note prints under its row.
func noteText(n Note) string {
	s := "note"
	if !n.When.IsZero() {
		s += " " + dateOf(n.When)
	}
	return s + ": " + n.Text
}

// summaryText is the line at the top of a checklist printed from a record.
func (r *recorded) summaryText(steps []plan.Step) string {
	coils := 0
	for _, st := range steps {
		if st.Coil != nil {
			coils++
		}
	}
	s := fmt.Sprintf("%d of %d steps done, %d of %d coils, as recorded", r.done, len(steps), r.coils, coils)
	if !r.when.IsZero() {
		s += " on " + dateOf(r.when)
	}
	return s + "."
}

// step is the record of a step, nil when it is not done or there is no
// record.
func (r *recorded) step(i int) *StepProgress {
	if r == nil {
		return nil
	}
	if sp, ok := r.steps[i]; ok {
		return &sp
	}
	return nil
}

func (r *recorded) notesFor(i int) []Note {
	if r == nil {
		return nil
	}
	return r.notes[i]
}

// notesPad is the space under the last note line of a row, mm.
const notesPad = 1.2

// notesWidth is the width of a note line under a checklist row: from the
// coil column to the turns counted boxes.
func (b *builder) notesWidth() float64 { return b.colX(8) - b.colX(1) - 3 }

// noteLines wraps the notes of a step to the note width.
func (b *builder) noteLines(notes []Note) []string {
	var out []string
	for _, n := range notes {
		out = append(out, wrap(clean(Regular, noteText(n)), b.notesWidth(), ckSmall, Regular)...)
	}
	return out
}

// notesHeight is the height n note lines add under a row.
func notesHeight(n int) float64 {
	if n == 0 {
		return 0
	}
	return 0.3 + float64(n)*lineStep(ckSmall) + notesPad
}

// progressSummary prints what the record holds at the top of the
// checklist: steps and coils done and when, the entries left out, and the
// notes of no step.
func (b *builder) progressSummary(f *flow, r *recorded, steps []plan.Step) {
	w := b.width()
	x0 := float64(marginMM)
	tw := w - 6
	how := "From the progress record: ticked boxes, written counts and dates are recorded work; blank rows are still to do and filled in by hand. " +
		"A count printed white on black differs from the plan, whose count stands under it."
	for _, line := range r.summary {
		how += " " + line
	}
	var general []string
	for _, n := range r.general {
		general = append(general, wrap(clean(Regular, noteText(n)), tw, sizeSmall, Regular)...)
	}
	h := 3 + sizeBody*ptMM + 1.5 + paraHeight(tw, sizeSmall, Regular, how) + float64(len(general))*lineStep(sizeSmall) + 0.8
	f.need(h)
	f.c.box(x0, f.y, w, h, Pen{Width: 0.35, Colour: Ink}, &Fill{Panel})
	f.c.box(x0, f.y, 1.6, h, Pen{}, &Fill{Ink})
	y := f.y + 3 + 0.75*sizeBody*ptMM
	f.c.text(x0+4, y, sizeBody, Bold, Ink, left, fit(r.summaryText(steps), tw, sizeBody, Bold))
	y = f.c.para(x0+4, y+1.5+sizeSmall*ptMM, tw, sizeSmall, Regular, Ink, how)
	for _, l := range general {
		f.c.text(x0+4, y, sizeSmall, Regular, Ink, left, l)
		y += lineStep(sizeSmall)
	}
	f.y += h + 1.5
}
