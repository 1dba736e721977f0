package printout

import (
	"bytes"
	"flag"
	"fmt"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"sync"
	"testing"
	"time"

	"coilwright/printout/pdftext"
	"coilwright/winding"
	"coilwright/winding/plan"
)

var update = flag.Bool("update", false, "rewrite the golden files under testdata/golden/printout")

var fixtures = []struct {
	name string
	spec winding.Spec
	conn winding.Connection
}{
	{"12-10", winding.Spec{Slots: 12, Poles: 10}, winding.Star},
	{"12-10-single-layer", winding.Spec{Slots: 12, Poles: 10, Layers: 1}, winding.Star},
	{"120-112-two-paths", winding.Spec{Slots: 120, Poles: 112, Paths: 2}, winding.Star},
	{"20-18-five-phase-delta", winding.Spec{Slots: 20, Poles: 18, Phases: 5}, winding.Delta},
	{"9-8-delta", winding.Spec{Slots: 9, Poles: 8}, winding.Delta},
}

func buildFixture(t testing.TB, i int) *Pack {
	t.Helper()
	fx := fixtures[i]
	pk, err := Build(fixturePlan(t, fx.spec, fx.conn), Options{})
	if err != nil {
		t.Fatalf("Build(%s) = %v", fx.name, err)
	}
	return pk
}

func pagesOf(pk *Pack, kind PageKind) []*Page {
	var out []*Page
	for _, p := range pk.Pages {
		if p.Kind == kind {
			out = append(out, p)
		}
	}
	return out
}

func textsOf(pages []*Page) []string {
	var out []string
	for _, p := range pages {
		out = append(out, p.Texts()...)
	}
	return out
}

func TestBuildPageOrderAndBounds(t *testing.T) {
	order := []PageKind{SlotMapPage, DevelopedPage, ConnectionPage, FiguresPage, CutListPage, ChecklistPage, PolarityPage, TestRecordPage}
	for i, fx := range fixtures {
		t.Run(fx.name, func(t *testing.T) {
			pk := buildFixture(t, i)
			var kinds []PageKind
			for _, p := range pk.Pages {
				if len(kinds) == 0 || kinds[len(kinds)-1] != p.Kind {
					kinds = append(kinds, p.Kind)
				}
				for _, s := range p.Shapes {
					x0, y0, x1, y1 := s.bounds()
					const tol = 0.01
					if x0 < -tol || y0 < -tol || x1 > p.W+tol || y1 > p.H+tol {
						t.Errorf("page %q: shape %T at (%.1f,%.1f)-(%.1f,%.1f) leaves the %gx%g mm sheet", p.Title, s, x0, y0, x1, y1, p.W, p.H)
					}
					if tx, ok := s.(*Text); ok && (tx.X < marginMM-0.6 || tx.X+tx.Width > p.W-marginMM+0.6) {
						t.Errorf("page %q: text %q at x %.1f..%.1f crosses the %d mm margin", p.Title, tx.S, tx.X, tx.X+tx.Width, marginMM)
					}
				}
			}
			if !slices.Equal(kinds, order) {
				t.Errorf("Build(%s) page kinds = %v; want %v", fx.name, kinds, order)
			}
			if len(pk.Pages) < 6 {
				t.Errorf("Build(%s) = %d pages; want at least 6", fx.name, len(pk.Pages))
			}
		})
	}
}

func TestSlotMapNumbersEveryTooth(t *testing.T) {
	for i, fx := range fixtures {
		t.Run(fx.name, func(t *testing.T) {
			pk := buildFixture(t, i)
			texts := textsOf(pagesOf(pk, SlotMapPage))
			for k := 1; k <= fx.spec.Slots; k++ {
				if !slices.Contains(texts, fmt.Sprint(k)) {
					t.Errorf("slot map of %s lacks tooth number %d", fx.name, k)
				}
			}
			// every wound tooth carries its phase letter
			l, _ := winding.Design(fx.spec)
			letters := map[string]int{}
			for _, s := range texts {
				letters[s]++
			}
			for ph, name := range l.PhaseNames {
				want := 0
				for _, c := range l.Coils {
					if c.Phase == ph {
						want++
					}
				}
				// + one in the legend
				if letters[name] < want+1 {
					t.Errorf("slot map of %s: phase letter %s printed %d times; want at least %d", fx.name, name, letters[name], want+1)
				}
			}
		})
	}
}

func TestConnectionSheetMarksAndJoints(t *testing.T) {
	for i, fx := range fixtures {
		t.Run(fx.name, func(t *testing.T) {
			pk := buildFixture(t, i)
			texts := textsOf(pagesOf(pk, ConnectionPage))
			l, _ := winding.Design(fx.spec)
			for _, n := range l.PhaseNames {
				for _, m := range []string{n + "1", n + "2"} {
					if !slices.Contains(texts, m) {
						t.Errorf("connection sheet of %s lacks terminal mark %s", fx.name, m)
					}
				}
			}
			for _, c := range l.Coils {
				if !slices.Contains(texts, fmt.Sprintf("T%d", c.Tooth)) {
					t.Errorf("connection sheet of %s lacks coil T%d", fx.name, c.Tooth)
				}
			}
			all := strings.Join(texts, " ")
			for _, j := range winding.Joints(fx.conn, l.PhaseNames) {
				if !strings.Contains(all, j.What[:20]) {
					t.Errorf("connection sheet of %s lacks joint %q", fx.name, j.What)
				}
			}
		})
	}
}

func TestChecklistOneRowPerCoil(t *testing.T) {
	for i, fx := range fixtures {
		t.Run(fx.name, func(t *testing.T) {
			pk := buildFixture(t, i)
			pages := pagesOf(pk, ChecklistPage)
			texts := textsOf(pages)
			l, _ := winding.Design(fx.spec)
			n := len(l.Coils)
			for k := 1; k <= n; k++ {
				if !slices.Contains(texts, fmt.Sprintf("%d of %d", k, n)) {
					t.Errorf("checklist of %s lacks the row of coil %d of %d", fx.name, k, n)
				}
			}
			boxes := 0
			for _, p := range pages {
				for _, s := range p.Shapes {
					if b, ok := s.(*Box); ok && b.W == ckBoxS && b.H == ckBoxS {
						boxes++
					}
				}
			}
			// two per coil, one per other step
			steps := len(fixturePlan(t, fx.spec, fx.conn).Steps)
			if want := n*2 + (steps - n); boxes != want {
				t.Errorf("checklist of %s has %d tick boxes; want %d", fx.name, boxes, want)
			}
			if fx.spec.Slots >= 120 && len(pages) < 2 {
				t.Errorf("checklist of %s fits %d rows on %d page(s); want it to flow onto more", fx.name, steps, len(pages))
			}
		})
	}
}

func TestTestRecordReadingsAndCautions(t *testing.T) {
	p := fixturePlan(t, winding.Spec{Slots: 12, Poles: 10}, winding.Star)
	taken := time.Date(2025, 3, 20, 10, 0, 0, 0, time.UTC)
	pk, err := Build(p, Options{Readings: map[string]Reading{
		"insulation-resistance": {Values: map[string]float64{"U": 1200, "V": 1150}, Taken: taken, Verdict: "pass"},
	}})
	if err != nil {
		t.Fatal(err)
	}
	texts := textsOf(pagesOf(pk, TestRecordPage))
	all := strings.Join(texts, "\n")
	for _, want := range []string{"Caution", "read: U 1.2 GΩ, V 1.15 GΩ", "taken 2025-03-20", "at least 5 MΩ", "within ±2 % of expected", "at most 1 mA", "local codes and licensed practice"} {
		if !strings.Contains(all, want) {
			t.Errorf("test record lacks %q", want)
		}
	}
	// the two tests without readings keep their blank: unit printed at the line end
	if n := strings.Count(all, "\nmA\n") + strings.Count(all, "\n%\n"); n != 2 {
		t.Errorf("test record has %d blank reading lines for unrecorded tests; want 2", n)
	}
}

func TestSideIntoStack(t *testing.T) {
	tests := []struct {
		name   string
		d      winding.Direction
		r      plan.Rotor
		before bool
		want   bool
	}{
		{"inner cw, slot before", winding.CW, plan.InnerRotor, true, true},
		{"inner cw, slot after", winding.CW, plan.InnerRotor, false, false},
		{"inner ccw, slot before", winding.CCW, plan.InnerRotor, true, false},
		{"outer cw, slot before", winding.CW, plan.OuterRotor, true, false},
		{"outer ccw, slot after", winding.CCW, plan.OuterRotor, false, false},
		{"outer cw, slot after", winding.CW, plan.OuterRotor, false, true},
	}
	for _, tt := range tests {
		if got := sideIntoStack(tt.d, tt.r, tt.before); got != tt.want {
			t.Errorf("sideIntoStack(%v, %s, before=%v) = %v; want %v (%s)", tt.d, tt.r, tt.before, got, tt.want, tt.name)
		}
	}
}

func TestSeparatorSlots(t *testing.T) {
	tests := []struct {
		name string
		spec winding.Spec
		want []int
	}{
		// 12/10 double layer: U U V V W W U U V V W W by tooth, so every even
		// slot holds two phases.
		{"12/10 double layer", winding.Spec{Slots: 12, Poles: 10}, []int{2, 4, 6, 8, 10, 12}},
		// 9/8: runs of three teeth, U U U V V V W W W.
		{"9/8 double layer", winding.Spec{Slots: 9, Poles: 8}, []int{3, 6, 9}},
		{"12/10 single layer", winding.Spec{Slots: 12, Poles: 10, Layers: 1}, nil},
	}
	for _, tt := range tests {
		l, err := winding.Design(tt.spec)
		if err != nil {
			t.Fatal(err)
		}
		if got := separatorSlots(l); !slices.Equal(got, tt.want) {
			t.Errorf("separatorSlots(%s) = %v; want %v (sequence %s)", tt.name, got, tt.want, l.Sequence())
		}
	}
}

func TestStyleOf(t *testing.T) {
	// IEC 60445: L1 brown, L2 black, L3 grey; patterns are this project's.
	want := []struct {
		colour  string
		pattern string
	}{{"brown", "solid"}, {"black", "dashed"}, {"grey", "dotted"}, {"orange", "dash-dot"}, {"violet", "dash-dot-dot"}}
	for i, w := range want {
		st := StyleOf(i, "X")
		if colourName(i) != w.colour || st.Pattern != w.pattern {
			t.Errorf("StyleOf(%d) = %s %s; want %s %s", i, colourName(i), st.Pattern, w.colour, w.pattern)
		}
	}
	if StyleOf(1, "V").Colour != Black {
		t.Errorf("StyleOf(1).Colour = %v; want black", StyleOf(1, "V").Colour)
	}
	seen := map[string]int{}
	for i := 0; i < winding.MaxPhases; i++ {
		st := StyleOf(i, "")
		k := fmt.Sprint(st.Colour, st.Pattern)
		if j, dup := seen[k]; dup {
			t.Errorf("StyleOf(%d) = StyleOf(%d) = %s: phases must differ in colour or pattern", i, j, k)
		}
		seen[k] = i
	}
}

func TestWrapAndFit(t *testing.T) {
	tests := []struct {
		name string
		s    string
		w    float64
	}{
		{"short", "star point", 100},
		{"long sentence", "High voltage: insulation and withstand tests use lethal voltages; keep clear of the stator.", 40},
		{"one long word", strings.Repeat("x", 80), 20},
		{"empty", "", 10},
	}
	for _, tt := range tests {
		for _, l := range wrap(tt.s, tt.w, sizeBody, Regular) {
			if w := textWidth(Regular, sizeBody, l); w > tt.w+1e-9 {
				t.Errorf("wrap(%s) line %q = %.2f mm wide; want at most %g", tt.name, l, w, tt.w)
			}
		}
		if f := fit(tt.s, tt.w, sizeBody, Regular); textWidth(Regular, sizeBody, f) > tt.w+1e-9 {
			t.Errorf("fit(%s) = %q, %.2f mm; want at most %g", tt.name, f, textWidth(Regular, sizeBody, f), tt.w)
		}
	}
	if got := clean(Regular, "(highest \u2212 lowest) / mean"); got != "(highest \u2212 lowest) / mean" {
		t.Errorf("clean(Regular, minus sign) = %q; want the minus sign kept (the Go fonts have it)", got)
	}
	if got := clean(Regular, "a\u2011b"); got != "a-b" {
		t.Errorf("clean(Regular, non-breaking hyphen) = %q; want a hyphen", got)
	}
	if got := clean(Regular, "U1 ⚡ 日本"); got != "U1 ? ??" {
		t.Errorf("clean(Regular, %q) = %q; want %q", "U1 ⚡ 日本", got, "U1 ? ??")
	}
}

func TestBuildRefuses(t *testing.T) {
	if _, err := Build(nil, Options{}); err != ErrNoPlan {
		t.Errorf("Build(nil) = %v; want ErrNoPlan", err)
	}
	if _, err := Build(&plan.Plan{}, Options{}); err != ErrNoPlan {
		t.Errorf("Build(empty plan) = %v; want ErrNoPlan", err)
	}
	p := fixturePlan(t, winding.Spec{Slots: 12, Poles: 10}, winding.Star)
	if _, err := Build(p, Options{Paper: Paper{"card", 100, 150}}); err == nil {
		t.Errorf("Build(paper 100x150) = nil error; want a refusal")
	}
	if _, err := ParsePaper("a3"); err == nil || !strings.Contains(err.Error(), "a4 or letter") {
		t.Errorf("ParsePaper(a3) = %v; want an error naming a4 or letter", err)
	}
	if p, err := ParsePaper(" Letter "); err != nil || p != Letter {
		t.Errorf("ParsePaper(Letter) = %v, %v; want Letter", p, err)
	}
}

func TestLetterPaper(t *testing.T) {
	p := fixturePlan(t, winding.Spec{Slots: 12, Poles: 10}, winding.Star)
	pk, err := Build(p, Options{Paper: Letter})
	if err != nil {
		t.Fatal(err)
	}
	for _, pg := range pk.Pages {
		if pg.W != Letter.W || pg.H != Letter.H {
			t.Errorf("page %q = %gx%g mm; want letter %gx%g", pg.Title, pg.W, pg.H, Letter.W, Letter.H)
		}
	}
}

// render renders a pack and fails the test on error.
func render(t testing.TB, pk *Pack) []byte {
	t.Helper()
	var buf bytes.Buffer
	if err := Render(pk, &buf); err != nil {
		t.Fatalf("Render = %v", err)
	}
	return buf.Bytes()
}

// sheetTexts builds the pack of p, renders it and reads back the text runs
// of the sheets of the given kinds, in page order; no kinds reads every sheet.
func sheetTexts(t testing.TB, p *plan.Plan, o Options, kinds ...PageKind) []string {
	t.Helper()
	pk, err := Build(p, o)
	if err != nil {
		t.Fatal(err)
	}
	pages, err := pdftext.Pages(render(t, pk))
	if err != nil {
		t.Fatal(err)
	}
	var out []string
	for k, pg := range pk.Pages {
		if len(kinds) == 0 || slices.Contains(kinds, pg.Kind) {
			out = append(out, pages[k]...)
		}
	}
	return out
}

func TestRenderTextReadsBack(t *testing.T) {
	for i, fx := range fixtures {
		t.Run(fx.name, func(t *testing.T) {
			pk := buildFixture(t, i)
			pdf := render(t, pk)
			if len(pdf) > 1<<20 {
				t.Errorf("Render(%s) = %d bytes; want under 1 MB", fx.name, len(pdf))
			}
			pages, err := pdfPageTexts(pdf)
			if err != nil {
				t.Fatalf("pdfPageTexts(%s) = %v", fx.name, err)
			}
			if len(pages) != len(pk.Pages) {
				t.Fatalf("pdfPageTexts(%s) = %d pages; want %d", fx.name, len(pages), len(pk.Pages))
			}
			for k, runs := range pages {
				if want := pk.Pages[k].Texts(); !slices.Equal(runs, want) {
					t.Errorf("page %d (%s) reads back %d runs; want the %d of the model (first difference near %q)", k+1, pk.Pages[k].Title, len(runs), len(want), firstDiff(runs, want))
				}
			}
			var slot []string
			for k, pg := range pk.Pages {
				if pg.Kind == SlotMapPage {
					slot = append(slot, pages[k]...)
				}
			}
			for k := 1; k <= fx.spec.Slots; k++ {
				if !slices.Contains(slot, fmt.Sprint(k)) {
					t.Errorf("PDF slot map of %s lacks tooth number %d", fx.name, k)
				}
			}
			var all []string
			for _, p := range pages {
				all = append(all, p...)
			}
			l, _ := winding.Design(fx.spec)
			for _, n := range l.PhaseNames {
				for _, m := range []string{n + "1", n + "2"} {
					if !slices.Contains(all, m) {
						t.Errorf("PDF of %s lacks terminal mark %s", fx.name, m)
					}
				}
			}
			joined := strings.Join(all, "\n")
			for _, want := range []string{"36 turns per coil", "Winding checklist", "Caution", "turns"} {
				if !strings.Contains(joined, want) {
					t.Errorf("PDF of %s lacks %q", fx.name, want)
				}
			}
		})
	}
}

func firstDiff(a, b []string) string {
	for i := range min(len(a), len(b)) {
		if a[i] != b[i] {
			return a[i] + " / " + b[i]
		}
	}
	return "the end"
}

func TestRenderDeterministic(t *testing.T) {
	goregularBefore := bytes.Clone(faceFonts[Regular])
	a := render(t, buildFixture(t, 0))
	b := render(t, buildFixture(t, 0))
	if !bytes.Equal(goregularBefore, faceFonts[Regular]) {
		t.Errorf("Render changed the shared font bytes")
	}
	if !bytes.Equal(a, b) {
		t.Fatalf("two renders of one plan differ (%d and %d bytes)", len(a), len(b))
	}
	if !bytes.Contains(a, []byte("/CreationDate (D:20250314")) {
		t.Errorf("Render: creation date is not the plan's date 2025-03-14")
	}
	// a different date changes the PDF dates only
	p := fixturePlan(t, fixtures[0].spec, fixtures[0].conn)
	pk, _ := Build(p, Options{Date: time.Date(2026, 1, 2, 0, 0, 0, 0, time.UTC)})
	if c := render(t, pk); !bytes.Contains(c, []byte("/CreationDate (D:20260102")) {
		t.Errorf("Render with Options.Date 2026-01-02: creation date not set from it")
	}
}

func TestRenderConcurrent(t *testing.T) {
	want := make([][]byte, len(fixtures))
	for i := range fixtures {
		want[i] = render(t, buildFixture(t, i))
	}
	var wg sync.WaitGroup
	errs := make(chan string, 16)
	for g := 0; g < 8; g++ {
		wg.Add(1)
		go func(g int) {
			defer wg.Done()
			i := g % len(fixtures)
			pk, err := Build(fixturePlan(t, fixtures[i].spec, fixtures[i].conn), Options{})
			if err != nil {
				errs <- err.Error()
				return
			}
			var buf bytes.Buffer
			if err := Render(pk, &buf); err != nil {
				errs <- err.Error()
				return
			}
			if !bytes.Equal(buf.Bytes(), want[i]) {
				errs <- fmt.Sprintf("goroutine %d: render of %s differs from the serial one", g, fixtures[i].name)
			}
		}(g)
	}
	wg.Wait()
	close(errs)
	for e := range errs {
		t.Error(e)
	}
}

// TestGoldenModel keeps the text of every page of the 12/10 pack, so a
// change in wording or order shows in review. Run with -update to rewrite.
func TestGoldenModel(t *testing.T) {
	for i, fx := range fixtures[:2] {
		pk := buildFixture(t, i)
		var b strings.Builder
		for k, p := range pk.Pages {
			fmt.Fprintf(&b, "== sheet %d: %s (%s, %d shapes)\n", k+1, p.Title, p.Kind, len(p.Shapes))
			for _, s := range p.Texts() {
				b.WriteString(s)
				b.WriteByte('\n')
			}
		}
		path := filepath.Join("..", "testdata", "golden", "printout", fx.name+".txt")
		if *update {
			if err := os.WriteFile(path, []byte(b.String()), 0o644); err != nil {
				t.Fatal(err)
			}
			continue
		}
		want, err := os.ReadFile(path)
		if err != nil {
			t.Fatalf("%v (run go test ./printout -update)", err)
		}
		if got := b.String(); got != string(want) {
			t.Errorf("page text of %s differs from %s (run with -update after checking the change)", fx.name, path)
		}
	}
}

func BenchmarkBuildAndRender12(b *testing.B) {
	p := fixturePlan(b, winding.Spec{Slots: 12, Poles: 10}, winding.Star)
	benchPack(b, p, Options{})
}

func BenchmarkBuildAndRender120(b *testing.B) {
	p := fixturePlan(b, winding.Spec{Slots: 120, Poles: 112, Paths: 2}, winding.Star)
	benchPack(b, p, Options{})
}
