package printout

// column is one column of a table.
type column struct {
	head  string
	w     float64 // mm
	align align
	face  Face
}

// cellBox in a table row draws an empty tick box; cellLine a write-in line.
const (
	cellBox  = "\x00box"
	cellLine = "\x00line"
)

// flow is a cursor that moves down the pages of one kind, starting a new
// page (with the title marked as continued) when the next block does not fit.
type flow struct {
	b     *builder
	kind  PageKind
	title string
	c     *canvas
	y     float64
}

func (b *builder) startFlow(kind PageKind, title string) *flow {
	f := &flow{b: b, kind: kind, title: title}
	f.c = b.newPage(kind, title)
	f.y = b.top() + 3
	return f
}

// need makes room for h mm, starting a new page when the block would cross
// the bottom margin; it reports whether a new page was started.
func (f *flow) need(h float64) bool {
	if f.y+h <= f.b.bottom() {
		return false
	}
	f.c = f.b.newPage(f.kind, f.title+" (continued)")
	f.y = f.b.top() + 3
	return true
}

// heading writes a section heading.
func (f *flow) heading(s string) {
	f.need(14)
	f.y += 3
	f.c.text(marginMM, f.y+1, sizeHead, Bold, Ink, left, s)
	f.y += 5
}

// table draws a table with a header row, repeating the header on each new
// page. Each row is one line of text per cell, shortened to fit.
func (f *flow) table(cols []column, rows [][]string, rowH float64) {
	header := func() {
		x := float64(marginMM)
		w := 0.0
		for _, c := range cols {
			w += c.w
		}
		f.c.box(x, f.y, w, rowH, Pen{}, &Fill{Colour{215, 215, 215}})
		for _, col := range cols {
			f.cell(x, col, col.head, rowH, Bold, sizeSmall)
			x += col.w
		}
		f.y += rowH
	}
	f.need(2 * rowH)
	header()
	for i, r := range rows {
		if f.need(rowH) {
			header()
		}
		x := float64(marginMM)
		w := 0.0
		for _, c := range cols {
			w += c.w
		}
		if i%2 == 1 {
			f.c.box(x, f.y, w, rowH, Pen{}, &Fill{Colour{246, 246, 246}})
		}
		for j, col := range cols {
			v := ""
			if j < len(r) {
				v = r[j]
			}
			f.cell(x, col, v, rowH, col.face, sizeBody)
			x += col.w
		}
		f.c.line(marginMM, f.y+rowH, x, f.y+rowH, Pen{Width: 0.15, Colour: Faint})
		f.y += rowH
	}
	f.y += 2
}

func (f *flow) cell(x float64, col column, v string, h float64, face Face, size float64) {
	switch v {
	case cellBox:
		s := min(4.2, h-1.6)
		f.c.checkbox(x+col.w/2-s/2, f.y+(h-s)/2, s)
		return
	case cellLine:
		f.c.line(x+1.5, f.y+h-1.3, x+col.w-1.5, f.y+h-1.3, Pen{Width: 0.2, Colour: Ink})
		return
	}
	v = fit(v, col.w-2.4, size, face)
	base := f.y + h/2 + 0.36*size*ptMM
	switch col.align {
	case right:
		f.c.text(x+col.w-1.2, base, size, face, Ink, right, v)
	case centre:
		f.c.text(x+col.w/2, base, size, face, Ink, centre, v)
	default:
		f.c.text(x+1.2, base, size, face, Ink, left, v)
	}
}

// scaleCols stretches column widths to fill w.
func scaleCols(cols []column, w float64) []column {
	sum := 0.0
	for _, c := range cols {
		sum += c.w
	}
	out := make([]column, len(cols))
	for i, c := range cols {
		c.w = c.w * w / sum
		out[i] = c
	}
	return out
}
