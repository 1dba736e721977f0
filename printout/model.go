package printout

import (
	"math"
	"time"
)

// Colour is an RGB colour, 0..255 a channel.
type Colour struct{ R, G, B uint8 }

// Colours used on every page.
var (
	Black = Colour{0, 0, 0}
	White = Colour{255, 255, 255}
	Ink   = Colour{25, 25, 25}    // body text
	Faint = Colour{150, 150, 150} // grid lines and hints
	Panel = Colour{240, 240, 240} // light panel fill
)

// Dash is a stroke pattern: lengths in mm of dash, gap, dash, gap...; nil is
// a solid line.
type Dash []float64

// Pen is how an outline is drawn. A zero Width draws no outline.
type Pen struct {
	Width  float64 // mm
	Colour Colour
	Dash   Dash
	Round  bool // round caps and joins (dotted patterns need them)
}

// Fill is how an area is filled; a nil *Fill leaves it empty.
type Fill struct{ Colour Colour }

// Point is a position on the page in mm from the top left corner, y down.
type Point struct{ X, Y float64 }

// Shape is one drawing item of a page: a *Line, *Box, *Arc, *Poly or *Text.
type Shape interface {
	bounds() (x0, y0, x1, y1 float64)
}

// Line is a straight stroke.
type Line struct {
	From, To Point
	Pen      Pen
}

// Box is an axis-aligned rectangle.
type Box struct {
	X, Y, W, H float64
	Pen        Pen
	Fill       *Fill
}

// Arc is part of a circle, or the whole of it when Sweep is 360. Angles are in
// degrees counter-clockwise on the page from the +x axis (the page's y axis
// points down, so "counter-clockwise" is as a reader sees it).
type Arc struct {
	Centre Point
	Radius float64
	Start  float64 // degrees
	Sweep  float64 // degrees, positive counter-clockwise as seen on the page
	Pen    Pen
	Fill   *Fill // only for a full circle
}

// Poly is an open polyline or, with Closed, a polygon.
type Poly struct {
	Points []Point
	Closed bool
	Pen    Pen
	Fill   *Fill
}

// Face is a type face of the Go font family.
type Face int

const (
	Regular Face = iota
	Bold
	Mono
)

// Text is one run of text on one line. X is the left edge of the run, Y its
// baseline; Width is the measured advance of the run (mm) so layout and
// tests need no font.
type Text struct {
	X, Y   float64
	Size   float64 // points
	Face   Face
	Colour Colour
	S      string
	Width  float64
}

func (l *Line) bounds() (float64, float64, float64, float64) {
	return min(l.From.X, l.To.X), min(l.From.Y, l.To.Y), max(l.From.X, l.To.X), max(l.From.Y, l.To.Y)
}

func (b *Box) bounds() (float64, float64, float64, float64) { return b.X, b.Y, b.X + b.W, b.Y + b.H }

func (a *Arc) bounds() (float64, float64, float64, float64) {
	if math.Abs(a.Sweep) >= 360 {
		return a.Centre.X - a.Radius, a.Centre.Y - a.Radius, a.Centre.X + a.Radius, a.Centre.Y + a.Radius
	}
	// the ends and every quarter point the arc passes
	lo, hi := a.Start, a.Start+a.Sweep
	if hi < lo {
		lo, hi = hi, lo
	}
	p := polar(a.Centre, a.Radius, lo)
	x0, y0, x1, y1 := p.X, p.Y, p.X, p.Y
	add := func(ang float64) {
		q := polar(a.Centre, a.Radius, ang)
		x0, y0, x1, y1 = min(x0, q.X), min(y0, q.Y), max(x1, q.X), max(y1, q.Y)
	}
	add(hi)
	for k := math.Ceil(lo/90) * 90; k < hi; k += 90 {
		add(k)
	}
	return x0, y0, x1, y1
}

func (p *Poly) bounds() (float64, float64, float64, float64) {
	if len(p.Points) == 0 {
		return 0, 0, 0, 0
	}
	x0, y0, x1, y1 := p.Points[0].X, p.Points[0].Y, p.Points[0].X, p.Points[0].Y
	for _, q := range p.Points[1:] {
		x0, y0, x1, y1 = min(x0, q.X), min(y0, q.Y), max(x1, q.X), max(y1, q.Y)
	}
	return x0, y0, x1, y1
}

func (t *Text) bounds() (float64, float64, float64, float64) {
	h := t.Size * ptMM
	return t.X, t.Y - 0.75*h, t.X + t.Width, t.Y + 0.25*h
}

// ptMM is one typographic point in mm.
const ptMM = 25.4 / 72

// Page is one sheet of the pack: its size and what is drawn on it, in
// drawing order.
type Page struct {
	Kind   PageKind
	Title  string
	W, H   float64 // mm
	Shapes []Shape
}

// PageKind names the sheets of the pack.
type PageKind string

const (
	SlotMapPage    PageKind = "slot-map"
	DevelopedPage  PageKind = "developed-layout"
	ConnectionPage PageKind = "connections"
	FiguresPage    PageKind = "design-figures"
	CutListPage    PageKind = "cut-list"
	ChecklistPage  PageKind = "checklist"
	TestRecordPage PageKind = "test-record"
)

// Texts returns the text runs of the page in drawing order.
func (p *Page) Texts() []string {
	var out []string
	for _, s := range p.Shapes {
		if t, ok := s.(*Text); ok {
			out = append(out, t.S)
		}
	}
	return out
}

// Pack is the whole shop pack: pages in print order and the document facts.
type Pack struct {
	Title   string
	Subject string
	Paper   Paper
	Pages   []*Page
	// Date fixes the creation and modification dates written into the PDF.
	Date time.Time
}
