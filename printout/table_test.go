package printout

import (
	"fmt"
	"strings"
	"testing"

	"coilwright/winding"
	"coilwright/winding/plan"
)

// words is s with its white space collapsed, as wrapped lines join back.
func words(s string) string { return strings.Join(strings.Fields(s), " ") }

// overlappingTexts lists pairs of text runs on a page whose boxes overlap
// (beyond a hair), the sign of text laid over text.
func overlappingTexts(p *Page) []string {
	var runs []*Text
	for _, s := range p.Shapes {
		if t, ok := s.(*Text); ok {
			runs = append(runs, t)
		}
	}
	const hair = 0.05
	var out []string
	for i, a := range runs {
		ax0, ay0, ax1, ay1 := a.bounds()
		for _, b := range runs[i+1:] {
			bx0, by0, bx1, by1 := b.bounds()
			if ax0 < bx1-hair && bx0 < ax1-hair && ay0 < by1-hair && by0 < ay1-hair {
				out = append(out, fmt.Sprintf("%q at (%.1f,%.1f) over %q at (%.1f,%.1f)", a.S, a.X, a.Y, b.S, b.X, b.Y))
			}
		}
	}
	return out
}

func TestTableWrapsAndFlows(t *testing.T) {
	long := "one in every slot that holds two phases: slide it in between the two coil sides after the first coil is wound, so the second coil presses it against the first"
	huge := strings.Repeat("a cell far longer than a whole page of the table, ", 160)
	cols := []column{
		{"item", 40, left, Bold}, {"count", 14, right, Regular}, {"length of the piece to cut", 20, right, Mono}, {"note", 112, left, Regular},
	}
	var rows [][]string
	for i := range 40 {
		rows = append(rows, []string{fmt.Sprintf("joint sleeve (heat-shrink) number %d", i), fmt.Sprint(i), "36 mm", long})
	}
	rows = append(rows, []string{"long", "1", "2 mm", huge}, []string{"after", "2", "3 mm", "the row after the long one"})
	b := &builder{p: fixturePlan(t, winding.Spec{Slots: 12, Poles: 10}, winding.Star), paper: A4}
	f := b.startFlow(CutListPage, "Table")
	f.table(cols, rows, 6)

	if len(b.pages) < 4 {
		t.Errorf("table of %d long rows = %d pages; want it to flow onto at least 4", len(rows), len(b.pages))
	}
	// body runs of each column, in drawing order across the pages
	got := make([][]string, len(cols))
	for _, pg := range b.pages {
		x := float64(marginMM)
		for j, col := range cols {
			for _, s := range pg.Shapes {
				tx, ok := s.(*Text)
				if !ok || tx.X < x-0.01 || tx.X >= x+col.w {
					continue
				}
				if tx.X < x+cellPadX-0.01 || tx.X+tx.Width > x+col.w-cellPadX+0.01 {
					t.Errorf("page %q: run %q at x %.2f..%.2f leaves column %q (%.2f..%.2f)", pg.Title, tx.S, tx.X, tx.X+tx.Width, col.head, x, x+col.w)
				}
				_, y0, _, y1 := tx.bounds()
				if y0 < b.top() || y1 > b.bottom() {
					t.Errorf("page %q: run %q at y %.1f..%.1f leaves the page body %.1f..%.1f", pg.Title, tx.S, y0, y1, b.top(), b.bottom())
				}
				if tx.Size == sizeBody {
					got[j] = append(got[j], tx.S)
				}
			}
			x += col.w
		}
		if o := overlappingTexts(pg); len(o) > 0 {
			t.Errorf("page %q: %d text runs overlap, first %s", pg.Title, len(o), o[0])
		}
	}
	for j, col := range cols {
		var want []string
		for _, r := range rows {
			want = append(want, r[j])
		}
		if g, w := strings.Join(got[j], " "), words(strings.Join(want, " ")); g != w {
			t.Errorf("table column %q joined = %.80q…; want %.80q…", col.head, g, w)
		}
	}
	// the numeric columns keep one line per row
	for j := 1; j <= 2; j++ {
		if len(got[j]) != len(rows) {
			t.Errorf("table column %q = %d runs; want one per row (%d)", cols[j].head, len(got[j]), len(rows))
		}
	}
}

// TestDemoCellsWhole checks that the long cells of the demo pack (materials,
// checklist steps, acceptance) print in full, joined across their lines, and
// that no text runs over another or out of the margins on any page.
func TestDemoCellsWhole(t *testing.T) {
	p := demoPlan(t)
	for _, paper := range PaperSizes {
		pk, err := Build(p, Options{Paper: paper})
		if err != nil {
			t.Fatal(err)
		}
		joined := func(kind PageKind) string { return words(strings.Join(textsOf(pagesOf(pk, kind)), " ")) }
		cut := joined(CutListPage)
		for _, m := range p.Materials {
			for _, s := range []string{m.Item, m.SizeText, m.Note} {
				if !strings.Contains(cut, words(s)) {
					t.Errorf("%s cut list lacks the whole of %q", paper.Name, s)
				}
			}
		}
		check := joined(ChecklistPage)
		for _, st := range p.Steps {
			want := []string{st.Title}
			if st.Coil != nil {
				want = []string{st.Coil.From + " → " + st.Coil.To}
			}
			for _, s := range want {
				if !strings.Contains(check, words(s)) {
					t.Errorf("%s checklist lacks the whole of %q", paper.Name, s)
				}
			}
		}
		rec := joined(TestRecordPage)
		for _, ts := range p.Tests {
			if s := clean(Bold, plan.LimitText(ts)); !strings.Contains(rec, words(s)) {
				t.Errorf("%s test record lacks the whole of %q", paper.Name, s)
			}
		}
		for _, pg := range pk.Pages {
			if strings.Contains(strings.Join(pg.Texts(), ""), "…") && pg.Kind != SlotMapPage {
				t.Errorf("%s page %q still shortens a text with an ellipsis", paper.Name, pg.Title)
			}
			for _, s := range pg.Shapes {
				if tx, ok := s.(*Text); ok && (tx.X < marginMM-0.01 || tx.X+tx.Width > pg.W-marginMM+0.01) {
					t.Errorf("%s page %q: %q at x %.1f..%.1f crosses the margin", paper.Name, pg.Title, tx.S, tx.X, tx.X+tx.Width)
				}
			}
			if o := overlappingTexts(pg); len(o) > 0 {
				t.Errorf("%s page %q: %d text runs overlap, first %s", paper.Name, pg.Title, len(o), o[0])
			}
		}
	}
}

// TestFixtureTextsApart checks every page of every fixture pack, on both
// paper sizes, for text laid over text.
func TestFixtureTextsApart(t *testing.T) {
	for _, fx := range fixtures {
		for _, paper := range PaperSizes {
			pk, err := Build(fixturePlan(t, fx.spec, fx.conn), Options{Paper: paper})
			if err != nil {
				t.Fatal(err)
			}
			for _, pg := range pk.Pages {
				if o := overlappingTexts(pg); len(o) > 0 {
					t.Errorf("%s %s page %q: %d text runs overlap, first %s", fx.name, paper.Name, pg.Title, len(o), o[0])
				}
			}
		}
	}
}
