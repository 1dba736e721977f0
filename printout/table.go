package printout

import "math"

// column is one column of a table. Left-aligned columns wrap their text onto
// as many lines as it needs and the row grows to fit; centred and
// right-aligned columns (counts, lengths, resistances) keep one line.
type column struct {
	head  string
	w     float64 // mm
	align align
	face  Face
}

// wraps reports whether the column's cells wrap onto more lines.
func (c column) wraps() bool { return c.align == left }

// cellBox in a table row draws an empty tick box; cellLine a write-in line.
const (
	cellBox  = "\x00box"
	cellLine = "\x00line"
)

// Table cell geometry, mm.
const (
	cellPadX = 1.2 // text inset from each side of a cell
	cellLead = 1.2 // line spacing as a multiple of the font size
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
	f.newPage()
	return true
}

func (f *flow) newPage() {
	f.c = f.b.newPage(f.kind, f.title+" (continued)")
	f.y = f.b.top() + 3
}

// heading writes a section heading.
func (f *flow) heading(s string) {
	f.need(14)
	f.y += 3
	f.c.text(marginMM, f.y+1, sizeHead, Bold, Ink, left, s)
	f.y += 5
}

// cellLines breaks one cell into the lines it prints: wrapped to the column
// in a wrapping column, one line shortened to fit otherwise.
func cellLines(col column, v string, size float64, face Face) []string {
	if v == "" || v == cellBox || v == cellLine {
		return nil
	}
	inner := col.w - 2*cellPadX
	if !col.wraps() {
		return []string{fit(v, inner, size, face)}
	}
	return wrap(clean(face, v), inner, size, face)
}

// lineStep is the distance between baselines of wrapped cell lines.
func lineStep(size float64) float64 { return size * ptMM * cellLead }

// rowHeight is the height of a row of n lines with a one-line height of rowH.
func rowHeight(n int, rowH, size float64) float64 {
	return rowH + float64(max(0, n-1))*lineStep(size)
}

// table draws a table with a header row, repeating the header on each new
// page. Text in left-aligned columns wraps and the row grows to hold it; a
// row that would cross the bottom margin starts a new page, and a row taller
// than a whole page is split across pages line by line.
func (f *flow) table(cols []column, rows [][]string, rowH float64) {
	width := 0.0
	for _, c := range cols {
		width += c.w
	}
	// header: every column wraps its heading, aligned as its cells
	head := make([][]string, len(cols))
	headN := 1
	for j, col := range cols {
		head[j] = wrap(clean(Bold, col.head), col.w-2*cellPadX, sizeSmall, Bold)
		headN = max(headN, len(head[j]))
	}
	headH := rowHeight(headN, rowH, sizeSmall)
	onPage := 0 // rows (or parts of rows) drawn below the current header
	header := func() {
		f.c.box(marginMM, f.y, width, headH, Pen{}, &Fill{Colour{215, 215, 215}})
		x := float64(marginMM)
		for j, col := range cols {
			f.cellText(x, col, head[j], rowH, Bold, sizeSmall)
			x += col.w
		}
		f.y += headH
		onPage = 0
	}
	// a table starts on a new page unless its header and first row fit
	first := rowH
	if len(rows) > 0 {
		first = f.rowH(cols, rows[0], rowH)
	}
	f.need(headH + min(first, f.b.bottom()-f.b.top()-3-headH))
	header()
	for i, r := range rows {
		lines := make([][]string, len(cols))
		n := 1
		for j, col := range cols {
			lines[j] = cellLines(col, cellAt(r, j), sizeBody, col.face)
			n = max(n, len(lines[j]))
		}
		from := 0 // first line still to print
		for from < n {
			rest := n - from
			fits := 0 // lines that fit above the bottom margin
			for k := rest; k > 0; k-- {
				if f.y+rowHeight(k, rowH, sizeBody) <= f.b.bottom() {
					fits = k
					break
				}
			}
			if fits < rest && onPage > 0 {
				// keep the row whole: start it on a new page, where one
				// taller than a page is then split line by line
				f.newPage()
				header()
				continue
			}
			fits = max(fits, 1) // a page shorter than one line prints it anyway
			h := rowHeight(fits, rowH, sizeBody)
			if i%2 == 1 {
				f.c.box(marginMM, f.y, width, h, Pen{}, &Fill{Colour{246, 246, 246}})
			}
			x := float64(marginMM)
			for j, col := range cols {
				v := cellAt(r, j)
				if from == 0 && (v == cellBox || v == cellLine) {
					f.cellMark(x, col, v, rowH)
				}
				seg := lines[j][min(from, len(lines[j])):min(from+fits, len(lines[j]))]
				f.cellText(x, col, seg, rowH, col.face, sizeBody)
				x += col.w
			}
			f.c.line(marginMM, f.y+h, marginMM+width, f.y+h, Pen{Width: 0.15, Colour: Faint})
			f.y += h
			onPage++
			from += fits
			if from < n {
				f.newPage()
				header()
			}
		}
	}
	f.y += 2
}

// rowH is the height row r would take.
func (f *flow) rowH(cols []column, r []string, rowH float64) float64 {
	n := 1
	for j, col := range cols {
		n = max(n, len(cellLines(col, cellAt(r, j), sizeBody, col.face)))
	}
	return rowHeight(n, rowH, sizeBody)
}

func cellAt(r []string, j int) string {
	if j < len(r) {
		return r[j]
	}
	return ""
}

// cellMark draws a tick box or a write-in line in the first line of a cell.
func (f *flow) cellMark(x float64, col column, v string, h float64) {
	switch v {
	case cellBox:
		s := math.Min(4.2, h-1.6)
		f.c.checkbox(x+col.w/2-s/2, f.y+(h-s)/2, s)
	case cellLine:
		f.c.line(x+1.5, f.y+h-1.3, x+col.w-1.5, f.y+h-1.3, Pen{Width: 0.2, Colour: Ink})
	}
}

// cellText writes the lines of one cell from the top of the row, the first
// baseline centred in a one-line row of height h.
func (f *flow) cellText(x float64, col column, lines []string, h float64, face Face, size float64) {
	base := f.y + h/2 + 0.36*size*ptMM
	for _, l := range lines {
		switch col.align {
		case right:
			f.c.text(x+col.w-cellPadX, base, size, face, Ink, right, l)
		case centre:
			f.c.text(x+col.w/2, base, size, face, Ink, centre, l)
		default:
			f.c.text(x+cellPadX, base, size, face, Ink, left, l)
		}
		base += lineStep(size)
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
