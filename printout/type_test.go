package printout

import (
	"fmt"
	"strings"
	"testing"

	"coilwright/printout/pdftext"
	"coilwright/winding"
	"coilwright/winding/plan"
)

// packsUnderTest are the demo pack and every fixture pack.
func packsUnderTest(t *testing.T) map[string]*Pack {
	t.Helper()
	out := map[string]*Pack{}
	pk, err := Build(demoPlan(t), Options{})
	if err != nil {
		t.Fatal(err)
	}
	out["demo"] = pk
	for i, fx := range fixtures {
		out[fx.name] = buildFixture(t, i)
	}
	return out
}

// No word is set below sizeMin (7 pt, the ISO 3098 1.8 mm lettering, from
// memory): read back from the written PDF, not the model.
func TestNoWordBelowMinimumSize(t *testing.T) {
	for name, pk := range packsUnderTest(t) {
		pages, err := pdftext.Runs(render(t, pk))
		if err != nil {
			t.Fatalf("pdftext.Runs(%s) = %v", name, err)
		}
		small := 0
		for k, runs := range pages {
			for _, r := range runs {
				if r.Size < sizeMin-0.005 {
					if small < 5 {
						t.Errorf("%s sheet %d: %q set in %.2f pt; want at least %d pt", name, k+1, r.Text, r.Size, sizeMin)
					}
					small++
				}
			}
		}
		if small > 5 {
			t.Errorf("%s: %d runs below %d pt in all", name, small, sizeMin)
		}
	}
}

// Every rune the pack prints is one the fonts have: no text run of the
// model or of the written PDF carries the '?' that stands for a missing
// glyph, and every rune of the plan's own words has a glyph in the regular
// and the bold face.
func TestNoReplacedGlyph(t *testing.T) {
	for name, pk := range packsUnderTest(t) {
		for _, pg := range pk.Pages {
			for _, s := range pg.Texts() {
				if strings.ContainsRune(s, '?') {
					t.Errorf("%s page %q: %q has a replaced glyph", name, pg.Title, s)
				}
			}
		}
		pages, err := pdftext.Pages(render(t, pk))
		if err != nil {
			t.Fatal(err)
		}
		for k, runs := range pages {
			for _, s := range runs {
				if strings.ContainsRune(s, '?') {
					t.Errorf("%s PDF sheet %d: %q has a replaced glyph", name, k+1, s)
				}
			}
		}
	}
	p := demoPlan(t)
	var words []string
	for _, tt := range p.Tests {
		words = append(words, tt.Title, tt.What, tt.Note, tt.Source, tt.Caution, string(tt.Unit), plan.LimitText(tt))
		for _, r := range tt.Readings {
			words = append(words, r.Label, string(r.Unit))
		}
	}
	for _, st := range p.Steps {
		words = append(words, st.Title, st.Detail)
		words = append(words, st.Reminders...)
	}
	for _, m := range p.Materials {
		words = append(words, m.Item, m.SizeText, m.Note)
	}
	words = append(words, p.Cautions...)
	words = append(words, p.Warnings...)
	for _, w := range p.Layout.Warnings {
		words = append(words, w.Message)
	}
	// the signs the pack itself writes
	words = append(words, "√ − Ω ° ± × µ ² · ≤ ≥ → –")
	for _, s := range words {
		for _, r := range s {
			for _, f := range []Face{Regular, Bold} {
				if !hasGlyph(f, r) && stand[r] == 0 {
					t.Errorf("face %d has no glyph for %q (U+%04X) in %q", f, r, r, s)
				}
			}
		}
	}
	if got := clean(Regular, "E = √2·π·f"); got != "E = √2·π·f" {
		t.Errorf("clean(Regular, √) = %q; want the root sign kept", got)
	}
}

// The warnings of the plan, in words, on the first sheet.
func TestWarningsOnFirstSheet(t *testing.T) {
	pdfFirst := func(t *testing.T, pk *Pack) string {
		pages, err := pdftext.Pages(render(t, pk))
		if err != nil {
			t.Fatal(err)
		}
		return strings.Join(pages[0], " ")
	}
	demo, err := Build(demoPlan(t), Options{})
	if err != nil {
		t.Fatal(err)
	}
	first := pdfFirst(t, demo)
	for _, want := range []string{"Warnings of this plan", "Sub-harmonic:", "MMF sub-harmonic of order 10"} {
		if !strings.Contains(first, want) {
			t.Errorf("demo first sheet lacks %q", want)
		}
	}
	// 9/8 cannot balance the radial pull; a plan warning of overfill
	p := fixturePlan(t, winding.Spec{Slots: 9, Poles: 8}, winding.Star)
	p.Warnings = append(p.Warnings, "fill: slot fill 0.52 is beyond the practical 0.45 for hand winding")
	pk, err := Build(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	first = pdfFirst(t, pk)
	for _, want := range []string{"Unbalanced radial pull:", "Overfill:", "Slot fill 0.52 is beyond"} {
		if !strings.Contains(first, want) {
			t.Errorf("9/8 first sheet lacks %q in %q", want, first)
		}
	}
	// no box without warnings
	p = fixturePlan(t, winding.Spec{Slots: 12, Poles: 10}, winding.Star)
	p.Layout.Warnings, p.Warnings = nil, nil
	pk, _ = Build(p, Options{})
	if s := strings.Join(pk.Pages[0].Texts(), " "); strings.Contains(s, "Warnings of this plan") {
		t.Errorf("first sheet of a plan without warnings prints a warnings box")
	}
}

// On the slot map sheets of large stators tooth numbers, lead tags and
// phase marks keep clear of each other (word boxes and mark discs), and
// every tooth is numbered.
func TestSlotMapLabelsApartLargeStators(t *testing.T) {
	for _, s := range []winding.Spec{{Slots: 72, Poles: 66}, {Slots: 72, Poles: 64}, {Slots: 144, Poles: 132}, {Slots: 144, Poles: 140, Paths: 2}} {
		for _, paper := range PaperSizes {
			name := fmt.Sprintf("%d/%d %s", s.Slots, s.Poles, paper.Name)
			pk, err := Build(fixturePlan(t, s, winding.Star), Options{Paper: paper})
			if err != nil {
				t.Fatal(err)
			}
			seen := map[string]bool{}
			for _, pg := range pagesOf(pk, SlotMapPage) {
				if o := overlappingTexts(pg); len(o) > 0 {
					t.Errorf("%s %q: %d words overlap, first %s", name, pg.Title, len(o), o[0])
				}
				var labels []Shape
				for _, sh := range pg.Shapes {
					switch v := sh.(type) {
					case *Text:
						seen[v.S] = true
						labels = append(labels, v)
					case *Box:
						if v.H == leadTagH {
							labels = append(labels, v)
						}
					case *Arc:
						if isLabel(v) && v.Radius > 1 && v.Radius < 6 { // phase mark discs, not the iron
							labels = append(labels, v)
						}
					}
				}
				for i, a := range labels {
					for _, o := range labels[i+1:] {
						_, okA := a.(*Text)
						_, okO := o.(*Text)
						if okA || okO {
							// words are compared above; a word inside its
							// own tag or disc is fine
							continue
						}
						if shapesMeet(a, o, -0.05) {
							x0, y0, _, _ := a.bounds()
							t.Errorf("%s %q: %T and %T overlap near (%.1f, %.1f)", name, pg.Title, a, o, x0, y0)
						}
					}
				}
			}
			for k := 1; k <= s.Slots; k++ {
				if !seen[fmt.Sprint(k)] {
					t.Errorf("%s: slot map sheets lack tooth number %d", name, k)
				}
			}
		}
	}
}
