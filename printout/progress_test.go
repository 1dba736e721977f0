package printout

import (
	"fmt"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"
	"time"

	"coilwright/winding"
	"coilwright/winding/journal"
	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// benchDay is when the hand-built record was written: the bench's own zone,
// an hour east of UTC, late enough that UTC would still be the day before
// for the first entry.
var benchZone = time.FixedZone("bench", 3600)

const longNote = "Wire kinked at the slot opening on the third layer; straightened it and wound on, the enamel looked unbroken under a loupe. Check this coil first if the insulation test is low."

// progressFixture is a hand-built record for the 12/10 fixture, folded
// against its plan: the first coil done with the planned 36 turns, the
// second with 35 and a note, the first test step done, an entry for the
// third coil's step that names its coil wound the other way, and a note on the stator as a
// whole.
func progressFixture(t testing.TB, p *plan.Plan) (st *progress.State, coilA, coilB, test plan.Step) {
	t.Helper()
	var coils []plan.Step
	for _, st := range p.Steps {
		switch {
		case st.Coil != nil:
			coils = append(coils, st)
		case st.Kind == plan.StepTest && test.Index == 0:
			test = st
		}
	}
	if len(coils) < 3 || test.Index == 0 {
		t.Fatalf("fixture plan has %d coil steps and test step %d; want 3 and one", len(coils), test.Index)
	}
	coilA, coilB = coils[0], coils[1]
	day := time.Date(2025, 3, 21, 0, 30, 0, 0, benchZone)
	stamp := func(e journal.Event) journal.Event { return progress.Stamp(p, e) }
	wrongTooth := stamp(journal.Event{Kind: journal.Done, Step: coils[2].Index, Turns: 36, Time: day})
	// the job was edited since: that tooth's coil was wound the other way
	if strings.Contains(wrongTooth.Key, "+") {
		wrongTooth.Key = strings.Replace(wrongTooth.Key, "+", "-", 1)
	} else {
		wrongTooth.Key = strings.Replace(wrongTooth.Key, "-", "+", 1)
	}
	events := []journal.Event{
		progress.FingerprintEvent(p),
		stamp(journal.Event{Kind: journal.Done, Step: coilA.Index, Turns: coilA.Coil.Turns, Time: day}),
		stamp(journal.Event{Kind: journal.Done, Step: coilB.Index, Turns: coilA.Coil.Turns - 1, Time: day.Add(time.Hour)}),
		stamp(journal.Event{Kind: journal.Note, Step: coilB.Index, Note: longNote, Time: day.Add(time.Hour)}),
		stamp(journal.Event{Kind: journal.Done, Step: test.Index, Time: day.Add(26 * time.Hour)}),
		wrongTooth,
		{Kind: journal.Note, Note: "Stack from the spring batch, lot 7.", Time: day},
	}
	for i := range events {
		events[i].Seq, events[i].Line = i+1, i+1
	}
	return progress.Fold(p, events), coilA, coilB, test
}

func buildWithProgress(t *testing.T, pr *progress.State) (*plan.Plan, *Pack) {
	t.Helper()
	p := fixturePlan(t, winding.Spec{Slots: 12, Poles: 10}, winding.Star)
	if pr == nil {
		pr, _, _, _ = progressFixture(t, p)
	}
	pk, err := Build(p, Options{Progress: pr})
	if err != nil {
		t.Fatal(err)
	}
	return p, pk
}

// ticks returns the tick marks of the pages: open three-point polylines.
func ticks(pages []*Page) []*Poly {
	var out []*Poly
	for _, pg := range pages {
		for _, s := range pg.Shapes {
			if pl, ok := s.(*Poly); ok && !pl.Closed && len(pl.Points) == 3 && pl.Fill == nil {
				out = append(out, pl)
			}
		}
	}
	return out
}

// inside reports whether shape a lies within box b (with a small tolerance).
func inside(a Shape, b *Box) bool {
	x0, y0, x1, y1 := a.bounds()
	const tol = 0.01
	return x0 >= b.X-tol && y0 >= b.Y-tol && x1 <= b.X+b.W+tol && y1 <= b.Y+b.H+tol
}

func TestChecklistProgressTicks(t *testing.T) {
	_, pk := buildWithProgress(t, nil)
	pages := pagesOf(pk, ChecklistPage)
	tk := ticks(pages)
	// coil A, coil B and the test step; the entry of the wrong tooth is left out
	if len(tk) != 3 {
		t.Fatalf("checklist with 3 done steps has %d ticks; want 3", len(tk))
	}
	for _, pl := range tk {
		found := false
		for _, pg := range pages {
			for _, s := range pg.Shapes {
				if b, ok := s.(*Box); ok && b.W == ckBoxS && b.H == ckBoxS && inside(pl, b) {
					found = true
				}
			}
		}
		if !found {
			t.Errorf("tick at %v lies in no tick box", pl.Points)
		}
		if pl.Pen.Width < 0.5 || pl.Pen.Colour != Ink {
			t.Errorf("tick pen = %+v; want a dark stroke of at least 0.5 mm", pl.Pen)
		}
		// a check mark: down to the right, then up further to the right
		a, b, c := pl.Points[0], pl.Points[1], pl.Points[2]
		if !(a.X < b.X && b.X < c.X && b.Y > a.Y && c.Y < a.Y) {
			t.Errorf("tick points %v are not a check mark", pl.Points)
		}
	}
	// without a record nothing is ticked
	plain := buildFixture(t, 0)
	if n := len(ticks(pagesOf(plain, ChecklistPage))); n != 0 {
		t.Errorf("checklist without a record has %d ticks; want 0", n)
	}
}

// cellTexts returns the texts of the pages that start within [x0, x1).
func cellTexts(pages []*Page, x0, x1 float64) []*Text {
	var out []*Text
	for _, pg := range pages {
		for _, s := range pg.Shapes {
			// the footer (sheet number) is no cell
			if tx, ok := s.(*Text); ok && tx.X >= x0 && tx.X < x1 && tx.Y < pg.H-marginMM-footerH {
				out = append(out, tx)
			}
		}
	}
	return out
}

func TestChecklistProgressTexts(t *testing.T) {
	p, pk := buildWithProgress(t, nil)
	pages := pagesOf(pk, ChecklistPage)
	b := &builder{p: p, paper: A4}
	all := strings.Join(textsOf(pages), "\n")
	steps := len(p.Steps)
	for _, want := range []string{
		fmt.Sprintf("3 of %d steps done, 2 of 12 coils, as recorded on 2025-03-22.", steps),
		"1 coil entry left out (line 6)",
		"note 2025-03-21: Stack from the spring batch, lot 7.",
	} {
		if !strings.Contains(all, want) {
			t.Errorf("checklist with a record lacks %q", want)
		}
	}
	// the turns counted column: 36 as planned, 35 against a plan of 36
	var counted []string
	for _, tx := range cellTexts(pages, b.colX(8), b.colX(9)) {
		if tx.Y > b.top() && tx.S != "turns" && tx.S != "counted" { // not the page or column header
			counted = append(counted, tx.S)
		}
	}
	if want := []string{"36", "35", "plan 36"}; !slices.Equal(counted, want) {
		t.Errorf("turns counted cells = %q; want %q", counted, want)
	}
	// the count off the plan is white on a black box
	for _, pg := range pages {
		for i, s := range pg.Shapes {
			tx, ok := s.(*Text)
			if !ok || tx.S != "35" || tx.X < b.colX(8) {
				continue
			}
			if tx.Colour != White {
				t.Errorf("count 35 (plan 36) printed in %v; want white on black", tx.Colour)
			}
			bg, ok := pg.Shapes[i-1].(*Box)
			if !ok || bg.Fill == nil || bg.Fill.Colour != Ink || !inside(tx, bg) {
				t.Errorf("count 35 (plan 36) does not sit on a black box: %#v", pg.Shapes[i-1])
			}
		}
	}
	// dates above the initials line of the three done steps; 00:30 in the
	// bench's zone is still the 21st there
	var dates []string
	for _, tx := range cellTexts(pages, b.colX(10), pk.Paper.W) {
		if tx.S != "initials" {
			dates = append(dates, tx.S)
		}
	}
	if want := []string{"2025-03-21", "2025-03-21", "2025-03-22"}; !slices.Equal(dates, want) {
		t.Errorf("initials column = %q; want the dates %q", dates, want)
	}
	// the note under coil B, whole, in its lines
	var note []string
	for _, tx := range cellTexts(pages, b.colX(1), b.colX(2)) {
		if strings.HasPrefix(tx.S, "note") || len(note) > 0 && len(note) < 4 && tx.Size == ckSmall {
			note = append(note, tx.S)
		}
	}
	if got := strings.Join(note, " "); !strings.Contains(got, "note 2025-03-21: "+longNote) {
		t.Errorf("note lines = %q; want the whole note of coil B", note)
	}
}

// Nothing drawn from the record leaves its cell: every text right of the
// from / to column lies in one column, notes stay left of the tick boxes,
// and every run keeps inside the margins and above the footer.
func TestChecklistProgressStaysInCells(t *testing.T) {
	for _, paper := range PaperSizes {
		t.Run(paper.Name, func(t *testing.T) {
			p := fixturePlan(t, winding.Spec{Slots: 12, Poles: 10}, winding.Star)
			pr, _, _, _ := progressFixture(t, p)
			// counts of three digits, the widest a tooth coil takes by hand
			for i, sp := range pr.Steps {
				if sp.Done && sp.Turns > 0 {
					pr.Steps[i].Turns += 964
				}
			}
			pk, err := Build(p, Options{Paper: paper, Progress: pr})
			if err != nil {
				t.Fatal(err)
			}
			b := &builder{p: p, paper: paper}
			edges := []float64{b.colX(8), b.colX(9), b.colX(10), marginMM + b.width()}
			for _, pg := range pagesOf(pk, ChecklistPage) {
				for _, s := range pg.Shapes {
					tx, ok := s.(*Text)
					if !ok {
						continue
					}
					_, y0, _, y1 := tx.bounds()
					if y0 < b.top() || y1 > b.bottom() {
						if y0 >= b.top() && y1 <= pg.H-marginMM {
							continue // the footer
						}
						if tx.Y < b.top() {
							continue // the header
						}
						t.Errorf("%s: text %q at y %.1f..%.1f leaves the body %.1f..%.1f", pg.Title, tx.S, y0, y1, b.top(), b.bottom())
					}
					if tx.X < marginMM-0.01 || tx.X+tx.Width > pg.W-marginMM+0.01 {
						t.Errorf("%s: text %q at x %.1f..%.1f crosses the margin", pg.Title, tx.S, tx.X, tx.X+tx.Width)
					}
					if strings.HasPrefix(tx.S, "note") && tx.X+tx.Width > b.colX(8) {
						t.Errorf("%s: note line %q runs to x %.1f, into the tick boxes at %.1f", pg.Title, tx.S, tx.X+tx.Width, b.colX(8))
					}
					if tx.X < edges[0]-0.01 || tx.Y < b.top()+12 {
						continue
					}
					for k := 0; k < len(edges)-1; k++ {
						if tx.X >= edges[k]-0.01 && tx.X < edges[k+1] && tx.X+tx.Width > edges[k+1]+0.01 {
							t.Errorf("%s: text %q at x %.1f..%.1f crosses the column edge at %.1f", pg.Title, tx.S, tx.X, tx.X+tx.Width, edges[k+1])
						}
					}
				}
			}
		})
	}
}

// A note longer than a page flows on under repeated headers, every line
// kept, none below the body.
func TestChecklistLongNoteFlows(t *testing.T) {
	p := fixturePlan(t, winding.Spec{Slots: 12, Poles: 10}, winding.Star)
	pr, _, coilB, _ := progressFixture(t, p)
	var words []string
	for i := range 3000 {
		words = append(words, fmt.Sprintf("w%d", i))
	}
	pr.Steps[coilB.Index-1].Note = strings.Join(words, " ")
	pk, err := Build(p, Options{Progress: pr})
	if err != nil {
		t.Fatal(err)
	}
	pages := pagesOf(pk, ChecklistPage)
	plain := pagesOf(buildFixture(t, 0), ChecklistPage)
	if len(pages) <= len(plain)+1 {
		t.Errorf("checklist with a note of 3000 words = %d pages; want it to flow past the %d without", len(pages), len(plain))
	}
	all := strings.Join(textsOf(pages), " ")
	for _, w := range []string{"w0", "w1500", "w2999"} {
		if !strings.Contains(all, " "+w+" ") {
			t.Errorf("the long note lost %q", w)
		}
	}
	b := &builder{p: p, paper: A4}
	for _, pg := range pages {
		if !slices.Contains(pg.Texts(), "turns") {
			t.Errorf("%s: no column header", pg.Title)
		}
		for _, s := range pg.Shapes {
			if tx, ok := s.(*Text); ok && tx.Y > b.bottom() && tx.Y < pg.H-marginMM-footerH {
				t.Errorf("%s: %q below the body", pg.Title, tx.S)
			}
		}
	}
}

// A record with nothing that fits the plan still says so at the top.
func TestChecklistEmptyRecord(t *testing.T) {
	p, pk := buildWithProgress(t, progress.New(fixturePlan(t, winding.Spec{Slots: 12, Poles: 10}, winding.Star)))
	all := strings.Join(textsOf(pagesOf(pk, ChecklistPage)), "\n")
	want := fmt.Sprintf("0 of %d steps done, 0 of 12 coils, as recorded.", len(p.Steps))
	if !strings.Contains(all, want) {
		t.Errorf("checklist of an empty record lacks %q", want)
	}
}

// TestGoldenProgress keeps the checklist text of the 12/10 pack printed
// from the hand-built record. Run with -update to rewrite.
func TestGoldenProgress(t *testing.T) {
	_, pk := buildWithProgress(t, nil)
	var b strings.Builder
	for k, p := range pk.Pages {
		if p.Kind != ChecklistPage {
			continue
		}
		fmt.Fprintf(&b, "== sheet %d: %s (%s, %d shapes)\n", k+1, p.Title, p.Kind, len(p.Shapes))
		for _, s := range p.Texts() {
			b.WriteString(s)
			b.WriteByte('\n')
		}
	}
	path := filepath.Join("..", "testdata", "golden", "printout", "12-10-progress.txt")
	if *update {
		if err := os.WriteFile(path, []byte(b.String()), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test ./printout -update)", err)
	}
	if got := b.String(); got != string(want) {
		t.Errorf("checklist text printed from a record differs from %s (run with -update after checking the change)", path)
	}
}
