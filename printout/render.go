package printout

import (
	"bytes"
	"fmt"
	"io"
	"math"

	"codeberg.org/go-pdf/fpdf"
)

// Render writes the pack as PDF. It draws the page model as it is: no
// layout happens here. The output depends only on the pack: dates come from
// pack.Date, resources are written in sorted order, so two renders of one
// pack are byte-identical. Fonts are the Go fonts, embedded as subsets of the
// glyphs used. Render is safe to call from several goroutines at once on
// different packs (or the same one: it only reads it).
func Render(p *Pack, w io.Writer) error {
	if p == nil || len(p.Pages) == 0 {
		return fmt.Errorf("printout: render: empty pack")
	}
	f := fpdf.NewCustom(&fpdf.InitType{
		OrientationStr: "P", UnitStr: "mm",
		Size: fpdf.SizeType{Wd: p.Pages[0].W, Ht: p.Pages[0].H},
	})
	f.SetCatalogSort(true)
	f.SetCreationDate(p.Date)
	f.SetModificationDate(p.Date)
	f.SetCompression(true)
	f.SetProducer("coilwright", false)
	f.SetCreator("coilwright", false)
	f.SetTitle(p.Title, true)
	f.SetSubject(p.Subject, true)
	f.SetAutoPageBreak(false, 0)
	f.SetMargins(0, 0, 0)
	for face, data := range faceFonts {
		// fpdf writes into the font bytes it is given while it cuts the
		// subset, so each render gets its own copy: the shared gofont
		// slices stay pristine, renders stay identical and free of races.
		f.AddUTF8FontFromBytes(faceFamily[face], "", bytes.Clone(data))
	}
	r := &renderer{f: f}
	for _, pg := range p.Pages {
		f.AddPageFormat("P", fpdf.SizeType{Wd: pg.W, Ht: pg.H})
		r.reset()
		for _, s := range pg.Shapes {
			r.shape(s)
		}
	}
	if err := f.Error(); err != nil {
		return fmt.Errorf("printout: render: %w", err)
	}
	return f.Output(w)
}

// renderer keeps the graphics state last set so unchanged settings are not
// written again.
type renderer struct {
	f      *fpdf.Fpdf
	pen    Pen
	penSet bool
	fill   Colour
	fillOK bool
	font   Face
	size   float64
	text   Colour
	textOK bool
}

func (r *renderer) reset() { r.penSet, r.fillOK, r.textOK, r.size = false, false, false, 0 }

func (r *renderer) setPen(p Pen) {
	if r.penSet && p.Width == r.pen.Width && p.Colour == r.pen.Colour && p.Round == r.pen.Round && dashEqual(p.Dash, r.pen.Dash) {
		return
	}
	r.f.SetLineWidth(p.Width)
	r.f.SetDrawColor(int(p.Colour.R), int(p.Colour.G), int(p.Colour.B))
	if p.Round {
		r.f.SetLineCapStyle("round")
		r.f.SetLineJoinStyle("round")
	} else {
		r.f.SetLineCapStyle("butt")
		r.f.SetLineJoinStyle("miter")
	}
	if p.Dash == nil {
		r.f.SetDashPattern([]float64{}, 0)
	} else {
		r.f.SetDashPattern(p.Dash, 0)
	}
	r.pen, r.penSet = p, true
}

func (r *renderer) setFill(c Colour) {
	if r.fillOK && c == r.fill {
		return
	}
	r.f.SetFillColor(int(c.R), int(c.G), int(c.B))
	r.fill, r.fillOK = c, true
}

func dashEqual(a, b Dash) bool {
	if (a == nil) != (b == nil) || len(a) != len(b) {
		return false
	}
	for i := range a {
		if a[i] != b[i] {
			return false
		}
	}
	return true
}

// style sets pen and fill and returns the fpdf paint operator, "" for
// nothing to paint.
func (r *renderer) style(p Pen, fill *Fill) string {
	st := ""
	if fill != nil {
		r.setFill(fill.Colour)
		st = "F"
	}
	if p.Width > 0 {
		r.setPen(p)
		st = "D" + st
	}
	return st
}

func (r *renderer) shape(s Shape) {
	f := r.f
	switch s := s.(type) {
	case *Line:
		if s.Pen.Width > 0 {
			r.setPen(s.Pen)
			f.Line(s.From.X, s.From.Y, s.To.X, s.To.Y)
		}
	case *Box:
		if st := r.style(s.Pen, s.Fill); st != "" {
			f.Rect(s.X, s.Y, s.W, s.H, st)
		}
	case *Arc:
		if math.Abs(s.Sweep) >= 360 {
			if st := r.style(s.Pen, s.Fill); st != "" {
				f.Circle(s.Centre.X, s.Centre.Y, s.Radius, st)
			}
			return
		}
		if s.Pen.Width > 0 {
			r.setPen(s.Pen)
			r.arcPath(s)
			f.DrawPath("D")
		}
	case *Poly:
		if len(s.Points) < 2 {
			return
		}
		st := r.style(s.Pen, s.Fill)
		if st == "" {
			return
		}
		if !s.Closed {
			st = "D"
		}
		f.MoveTo(s.Points[0].X, s.Points[0].Y)
		for _, p := range s.Points[1:] {
			f.LineTo(p.X, p.Y)
		}
		if s.Closed {
			f.ClosePath()
		}
		f.DrawPath(st)
	case *Text:
		if r.size != s.Size || r.font != s.Face {
			f.SetFont(faceFamily[s.Face], "", s.Size)
			r.font, r.size = s.Face, s.Size
		}
		if !r.textOK || r.text != s.Colour {
			f.SetTextColor(int(s.Colour.R), int(s.Colour.G), int(s.Colour.B))
			r.text, r.textOK = s.Colour, true
		}
		f.Text(s.X, s.Y, s.S)
	}
}

// arcPath adds an arc to the current path as cubic Bézier pieces of at most
// 45 degrees each (the control distance 4/3·tan(θ/4)·r keeps a piece within
// 0.0003 r of the circle at 45 degrees).
func (r *renderer) arcPath(a *Arc) {
	n := int(math.Ceil(math.Abs(a.Sweep) / 45))
	n = max(n, 1)
	step := a.Sweep / float64(n)
	k := 4.0 / 3 * math.Tan(step*math.Pi/180/4) * a.Radius
	p0 := polar(a.Centre, a.Radius, a.Start)
	r.f.MoveTo(p0.X, p0.Y)
	for i := 0; i < n; i++ {
		t0 := a.Start + float64(i)*step
		t1 := t0 + step
		p1 := polar(a.Centre, a.Radius, t1)
		// tangents at both ends (counter-clockwise on the page is positive angle)
		c0 := polar(p0, k, t0+90)
		c1 := polar(p1, k, t1-90)
		r.f.CurveBezierCubicTo(c0.X, c0.Y, c1.X, c1.Y, p1.X, p1.Y)
		p0 = p1
	}
}
