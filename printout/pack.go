package printout

import (
	"errors"
	"fmt"
	"strings"
	"time"

	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// Options are the choices of one print run.
type Options struct {
	Paper Paper     // A4 when zero
	Date  time.Time // printed date and PDF dates; the plan's Date when zero
	// Readings are measurements already recorded for the tests of the plan,
	// by test name. The test record prints them in the reading column; tests
	// without one get a blank to fill in. When nil they are taken from
	// Progress.
	Readings map[string]Reading
	// Progress is where the stator's work stands, folded from its progress
	// record (nil when there is none): the checklist ticks the steps done and
	// writes the turns counted, the dates and the notes.
	Progress *progress.State
}

// Reading is what was recorded for one test.
type Reading struct {
	// Values are the named values as measured (e.g. "U": 0.412), printed in
	// name order with the test's unit.
	Values  map[string]float64
	Text    string    // a reading as written, when there are no values
	Taken   time.Time // zero when unknown
	By      string    // initials, when recorded
	Verdict string    // "pass", "warn", "fail" or "" when none was recorded
	// Skipped: an optional test left out (progress.Step.Skipped); its
	// cells stay blank and the record says "skipped".
	Skipped bool
}

// ErrNoPlan is returned for a nil plan or one without a layout.
var ErrNoPlan = errors.New("printout: plan has no layout")

// Build lays out the whole shop pack of a plan: slot map, developed layout,
// connections, design figures, cut list and materials, winding checklist,
// polarity sheet and test record, in that order. It reads the plan only and does no I/O.
func Build(p *plan.Plan, o Options) (*Pack, error) {
	if p == nil || p.Layout == nil || len(p.Layout.Coils) == 0 {
		return nil, ErrNoPlan
	}
	if o.Paper.W == 0 {
		o.Paper = A4
	}
	if o.Paper.W < 150 || o.Paper.H < 200 {
		return nil, &OptionError{Field: "paper", Value: fmt.Sprintf("%gx%g mm", o.Paper.W, o.Paper.H), Reason: "too small for the pack", Want: "a4 or letter"}
	}
	if o.Date.IsZero() {
		o.Date = p.Date
	}
	if o.Readings == nil {
		o.Readings = readingsOf(o.Progress, p.Steps)
	}
	if o.Date.IsZero() {
		// a fixed date keeps two renders identical when neither the job nor
		// the caller gives one
		o.Date = time.Date(2000, 1, 1, 0, 0, 0, 0, time.UTC)
	}
	b := &builder{p: p, o: o, paper: o.Paper}
	b.slotMap()
	b.developed()
	b.connections()
	b.figures()
	b.machine()
	b.cutList()
	b.checklist()
	b.polarity()
	b.testRecord()
	b.frames()
	name := p.Name
	if name == "" {
		name = "stator"
	}
	return &Pack{
		Title:   "Shop pack: " + name,
		Subject: fmt.Sprintf("%d/%d tooth-coil winding", p.Layout.Spec.Slots, p.Layout.Spec.Poles),
		Paper:   o.Paper,
		Pages:   b.pages,
		Date:    o.Date,
	}, nil
}

// builder carries the plan and the pages laid out so far.
type builder struct {
	p     *plan.Plan
	o     Options
	paper Paper
	pages []*Page
}

// Page frame geometry in mm.
const (
	headerH = 16 // title band at the top of every page
	footerH = 9  // footer band
)

func (b *builder) top() float64    { return marginMM + headerH }
func (b *builder) bottom() float64 { return b.paper.H - marginMM - footerH }
func (b *builder) width() float64  { return b.paper.W - 2*marginMM }

// newPage starts a page and returns its canvas.
func (b *builder) newPage(kind PageKind, title string) *canvas {
	c := newCanvas(kind, title, b.paper)
	b.pages = append(b.pages, c.page)
	return c
}

// jobName is the name printed on every sheet.
func (b *builder) jobName() string {
	if b.p.Name == "" {
		return "unnamed stator"
	}
	return b.p.Name
}

func (b *builder) dateText() string { return b.o.Date.Format("2006-01-02") }

// frames draws the header and footer of every page once the page count is
// known. Frames go first in drawing order so they never cover content.
func (b *builder) frames() {
	n := len(b.pages)
	l := b.p.Layout
	for i, pg := range b.pages {
		c := &canvas{page: &Page{}}
		x0, x1 := float64(marginMM), b.paper.W-marginMM
		y := float64(marginMM)
		c.text(x0, y+6, sizeTitle, Bold, Ink, left, pg.Title)
		c.text(x1, y+3.2, sizeBody, Bold, Ink, right, fit(b.jobName(), 80, sizeBody, Bold))
		c.text(x1, y+7.4, sizeSmall, Regular, Ink, right,
			fmt.Sprintf("%d/%d  %s  %s", l.Spec.Slots, l.Spec.Poles, layerText(l.Spec.Layers), b.p.Connection))
		c.line(x0, y+10, x1, y+10, Pen{Width: 0.5, Colour: Ink})
		fy := b.paper.H - marginMM
		c.line(x0, fy-5, x1, fy-5, Pen{Width: 0.2, Colour: Faint})
		rev := b.p.Revision
		if rev == "" {
			rev = "-"
		}
		c.text(x0, fy-1.5, sizeSmall, Regular, Ink, left,
			fit(fmt.Sprintf("coilwright shop pack · %s · rev %s · %s", b.jobName(), rev, b.dateText()), 140, sizeSmall, Regular))
		c.text(x1, fy-1.5, sizeSmall, Bold, Ink, right, fmt.Sprintf("sheet %d of %d", i+1, n))
		pg.Shapes = append(c.page.Shapes, pg.Shapes...)
	}
}

func layerText(n int) string {
	if n == 1 {
		return "single layer"
	}
	return "double layer"
}

// phaseStyle returns the style of phase index i of the plan's layout.
func (b *builder) phaseStyle(i int) PhaseStyle {
	return StyleOf(i, b.p.Layout.PhaseName(i))
}

// phaseIndex finds a phase by name; -1 when unknown.
func (b *builder) phaseIndex(name string) int {
	for i, n := range b.p.Layout.PhaseNames {
		if n == name {
			return i
		}
	}
	return -1
}

// wireText describes the conductor in a few words.
func (b *builder) wireText() string {
	w := b.p.Wire
	var s strings.Builder
	if w.StrandsInHand > 1 {
		fmt.Fprintf(&s, "%d × ", w.StrandsInHand)
	}
	fmt.Fprintf(&s, "%.3g mm", w.BareDiameterMM)
	if w.AWG > 0 {
		fmt.Fprintf(&s, " (AWG %d)", w.AWG)
	}
	if w.Grade > 0 {
		fmt.Fprintf(&s, " grade %d", w.Grade)
	}
	return s.String()
}
