package printout

import (
	"math"
	"strings"
)

// canvas collects the shapes of one page while a page builder lays it out.
type canvas struct {
	page *Page
}

func newCanvas(kind PageKind, title string, p Paper) *canvas {
	return &canvas{page: &Page{Kind: kind, Title: title, W: p.W, H: p.H}}
}

// Alignment of a text run about its x position.
type align int

const (
	left align = iota
	centre
	right
)

var thin = Pen{Width: lineWidthMM, Colour: Ink}

func (c *canvas) add(s Shape) { c.page.Shapes = append(c.page.Shapes, s) }

// text places one run; x is its left edge, centre or right edge by a. It
// returns the run's width.
func (c *canvas) text(x, y, size float64, f Face, col Colour, a align, s string) float64 {
	s = clean(f, s)
	if s == "" {
		return 0
	}
	w := textWidth(f, size, s)
	switch a {
	case centre:
		x -= w / 2
	case right:
		x -= w
	}
	c.add(&Text{X: x, Y: y, Size: size, Face: f, Colour: col, S: s, Width: w})
	return w
}

// label centres a run on a point (vertically on the cap height).
func (c *canvas) label(x, y, size float64, f Face, col Colour, s string) {
	c.text(x, y+0.35*size*ptMM, size, f, col, centre, s)
}

func (c *canvas) line(x0, y0, x1, y1 float64, p Pen) {
	c.add(&Line{From: Point{x0, y0}, To: Point{x1, y1}, Pen: p})
}

func (c *canvas) box(x, y, w, h float64, p Pen, fill *Fill) {
	c.add(&Box{X: x, Y: y, W: w, H: h, Pen: p, Fill: fill})
}

func (c *canvas) circle(x, y, r float64, p Pen, fill *Fill) {
	c.add(&Arc{Centre: Point{x, y}, Radius: r, Start: 0, Sweep: 360, Pen: p, Fill: fill})
}

func (c *canvas) poly(pts []Point, closed bool, p Pen, fill *Fill) {
	c.add(&Poly{Points: pts, Closed: closed, Pen: p, Fill: fill})
}

// checkbox draws an empty tick box of side s with its top left at x, y.
func (c *canvas) checkbox(x, y, s float64) {
	c.box(x, y, s, s, Pen{Width: 0.3, Colour: Ink}, &Fill{White})
}

// wrap breaks s into lines no wider than w at the given size and face.
func wrap(s string, w, size float64, f Face) []string {
	var lines []string
	for _, para := range strings.Split(s, "\n") {
		words := strings.Fields(para)
		cur := ""
		for _, wd := range words {
			try := wd
			if cur != "" {
				try = cur + " " + wd
			}
			if textWidth(f, size, try) <= w || cur == "" {
				cur = try
				continue
			}
			lines = append(lines, cur)
			cur = wd
		}
		lines = append(lines, cur)
	}
	// A single word wider than w is cut by characters.
	var out []string
	for _, l := range lines {
		for textWidth(f, size, l) > w && len([]rune(l)) > 1 {
			r := []rune(l)
			n := len(r) - 1
			for n > 1 && textWidth(f, size, string(r[:n])) > w {
				n--
			}
			out = append(out, string(r[:n]))
			l = string(r[n:])
		}
		out = append(out, l)
	}
	return out
}

// para writes wrapped text from the top left x, y (y is the first baseline)
// and returns the y below the last line.
func (c *canvas) para(x, y, w, size float64, f Face, col Colour, s string) float64 {
	lh := size * ptMM * 1.3
	for _, l := range wrap(clean(f, s), w, size, f) {
		c.text(x, y, size, f, col, left, l)
		y += lh
	}
	return y
}

// paraHeight is the height para would take.
func paraHeight(w, size float64, f Face, s string) float64 {
	return float64(len(wrap(clean(f, s), w, size, f))) * size * ptMM * 1.3
}

// fit shortens s with an ellipsis until it fits in w.
func fit(s string, w, size float64, f Face) string {
	s = clean(f, s)
	if textWidth(f, size, s) <= w {
		return s
	}
	r := []rune(s)
	for len(r) > 0 && textWidth(f, size, string(r)+"…") > w {
		r = r[:len(r)-1]
	}
	return string(r) + "…"
}

// polar returns the point at radius r and angle a (degrees, counter-clockwise
// as seen on the page) about centre o.
func polar(o Point, r, a float64) Point {
	rad := a * math.Pi / 180
	return Point{o.X + r*math.Cos(rad), o.Y - r*math.Sin(rad)}
}

// senseArrow draws the vector sign for a winding sense: a circular arrow of
// radius r about (x, y), three quarters round, with its head showing the
// sense as seen on the page: cw true for clockwise. The Go fonts have no
// circular arrow glyph, so it is drawn.
func (c *canvas) senseArrow(x, y, r float64, cw bool, col Colour, w float64) {
	o := Point{x, y}
	start, sweep := 120.0, 270.0
	if cw {
		start, sweep = 60.0, -270.0
	}
	c.add(&Arc{Centre: o, Radius: r, Start: start, Sweep: sweep, Pen: Pen{Width: w, Colour: col}})
	end := start + sweep
	tip := polar(o, r, end)
	// tangent direction of travel at the end
	dir := end + 90
	if cw {
		dir = end - 90
	}
	hl := max(r*0.9, 0.6)
	back := polar(tip, hl, dir+180)
	rad := (dir + 90) * math.Pi / 180
	dx, dy := math.Cos(rad)*hl*0.5, -math.Sin(rad)*hl*0.5
	// move the tip forward a little so the head sits on the arc end
	fw := polar(tip, hl*0.35, dir)
	c.poly([]Point{fw, {back.X + dx, back.Y + dy}, {back.X - dx, back.Y - dy}}, true, Pen{}, &Fill{col})
}

// arrowHead draws a filled arrow head with its tip at p pointing at angle a.
func (c *canvas) arrowHead(p Point, a, size float64, col Colour) {
	back := polar(p, size, a+180)
	rad := (a + 90) * math.Pi / 180
	dx, dy := math.Cos(rad)*size*0.45, -math.Sin(rad)*size*0.45
	c.poly([]Point{p, {back.X + dx, back.Y + dy}, {back.X - dx, back.Y - dy}}, true, Pen{}, &Fill{col})
}

// conductorMark draws the sign of a conductor seen end-on from the lead end:
// a circle with a dot (current toward the viewer, out of the stack) or a cross
// (away from the viewer, into the stack).
func (c *canvas) conductorMark(x, y, r float64, towardViewer bool, col Colour) {
	p := Pen{Width: max(0.18, r*0.18), Colour: col}
	c.circle(x, y, r, p, &Fill{White})
	if towardViewer {
		c.circle(x, y, r*0.28, Pen{}, &Fill{col})
		return
	}
	d := r * 0.62
	c.line(x-d, y-d, x+d, y+d, p)
	c.line(x-d, y+d, x+d, y-d, p)
}

// warningSign draws the general warning sign (ISO 7010 W001 shape: a
// triangle with an exclamation mark) with side s, top vertex at x, y.
func (c *canvas) warningSign(x, y, s float64) {
	h := s * math.Sqrt(3) / 2
	c.poly([]Point{{x, y}, {x + s/2, y + h}, {x - s/2, y + h}}, true, Pen{Width: s * 0.07, Colour: Black}, &Fill{Colour{255, 205, 0}})
	c.box(x-s*0.045, y+h*0.32, s*0.09, h*0.38, Pen{}, &Fill{Black})
	c.circle(x, y+h*0.8, s*0.055, Pen{}, &Fill{Black})
}

// tick draws the mark of a done step in the tick box of side s at x, y: a
// stroked check mark, since the Go fonts have no check mark glyph.
func (c *canvas) tick(x, y, s float64) {
	c.poly([]Point{{x + 0.2*s, y + 0.52*s}, {x + 0.42*s, y + 0.76*s}, {x + 0.8*s, y + 0.22*s}}, false,
		Pen{Width: 0.16 * s, Colour: Ink, Round: true}, nil)
}
