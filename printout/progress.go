package printout

import (
	"fmt"
	"time"

	"coilwright/winding/plan"
)

// Progress is what the stator's progress record holds, as plain data: the
// caller reads and replays the record, the printout only draws it. With a
// Progress the checklist ticks the steps done, writes the turns counted and
// the dates, and prints the notes under their rows.
type Progress struct {
	// Steps gives what was recorded for each plan step, by its 1-based
	// index. Steps not in the map (or not Done) print blank, to fill by hand.
	Steps map[int]StepProgress
	// Notes are the notes of the record in the order written.
	Notes []Note
	// Recorded is when the record was last written (its latest entry); zero
	// when unknown.
	Recorded time.Time
}

// StepProgress is what the record holds of one plan step.
type StepProgress struct {
	Done bool
	When time.Time // when it was done; zero when unknown
	// Tooth is the coil's tooth as the record names it, for coil steps (0
	// when not given). A step whose plan coil stands on another tooth (the
	// job was changed since) is left out and counted as not matching.
	Tooth int
	// Turns are the turns actually wound on a done coil; 0 when none were
	// recorded.
	Turns int
}

// Note is a note of the record, attached to a step, to a coil by its
// tooth, or (both zero) to the stator as a whole.
type Note struct {
	Step  int
	Tooth int
	Text  string
	When  time.Time // zero when unknown
}

// recorded is the progress record matched against the plan's steps: entries
// that name a step or tooth the plan does not have there are left out and
// counted.
type recorded struct {
	steps   map[int]StepProgress // done entries that fit the plan
	notes   map[int][]Note       // by step
	general []Note               // notes of no step and no coil
	ignored int                  // entries that do not fit the plan
	done    int                  // steps done
	coils   int                  // coil steps done
	when    time.Time
}

// matchProgress matches the progress to the steps the checklist prints; nil
// when there is no record.
func matchProgress(pr *Progress, steps []plan.Step) *recorded {
	if pr == nil {
		return nil
	}
	byIndex := make(map[int]plan.Step, len(steps))
	toothStep := map[int]int{}
	for _, st := range steps {
		byIndex[st.Index] = st
		if st.Coil != nil {
			if _, ok := toothStep[st.Coil.Tooth]; !ok {
				toothStep[st.Coil.Tooth] = st.Index
			}
		}
	}
	fits := func(step, tooth int) bool {
		st, ok := byIndex[step]
		if !ok {
			return false
		}
		return tooth == 0 || (st.Coil != nil && st.Coil.Tooth == tooth)
	}
	r := &recorded{steps: map[int]StepProgress{}, notes: map[int][]Note{}, when: pr.Recorded}
	for i, sp := range pr.Steps {
		if !sp.Done {
			continue
		}
		if !fits(i, sp.Tooth) {
			r.ignored++
			continue
		}
		if byIndex[i].Coil == nil {
			sp.Turns = 0 // turns belong to coils only
		}
		r.steps[i] = sp
		r.done++
		if byIndex[i].Coil != nil {
			r.coils++
		}
	}
	for _, n := range pr.Notes {
		if n.Text == "" {
			continue
		}
		switch {
		case n.Step > 0 && fits(n.Step, n.Tooth):
			r.notes[n.Step] = append(r.notes[n.Step], n)
		case n.Step > 0:
			r.ignored++
		case n.Tooth > 0:
			if s, ok := toothStep[n.Tooth]; ok {
				r.notes[s] = append(r.notes[s], n)
			} else {
				r.ignored++
			}
		default:
			r.general = append(r.general, n)
		}
	}
	return r
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
	if r.ignored > 0 {
		what := "entries of the record do not match this plan (was the job changed?) and were left out"
		if r.ignored == 1 {
			what = "entry of the record does not match this plan (was the job changed?) and was left out"
		}
		how += fmt.Sprintf(" %d %s.", r.ignored, what)
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
