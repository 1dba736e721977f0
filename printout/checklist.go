package printout

import (
	"fmt"
	"math"
	"strings"

	"coilwright/winding"
	"coilwright/winding/plan"
)

// Checklist row heights, mm.
const (
	ckCoilH = 7.2
	ckBoxS  = 4.2
	ckHeadH = 6.6 // the column header
)

// checklist writes one row per bench step in the plan's order: a coil row
// with boxes for turns counted, sense checked and initials; other steps
// (preparation, insulation, jumpers, leads, joints, tests) with a done box.
func (b *builder) checklist() {
	f := b.startFlow(ChecklistPage, "Winding checklist")
	w := b.width()
	f.y = f.c.para(marginMM, f.y, w, sizeSmall, Regular, Ink,
		"Work down the list in order. Tick each box as it is done and initial the row; count turns aloud or with a counter. "+
			"Sense: seen from the air gap facing the tooth, following the wire from the path's start terminal.")
	f.y += 1
	steps := b.p.Steps
	if len(steps) == 0 {
		steps = coilSteps(b.p)
	}
	rec := matchProgress(b.o.Progress, steps)
	if rec != nil {
		b.progressSummary(f, rec, steps)
	}
	b.checkHeader(f)
	for i, st := range steps {
		keep := 0.0
		if i == len(steps)-1 {
			keep = signOffKeep // the sign-off never stands alone on a sheet
		}
		b.checkRow(f, st, rec, keep)
	}
	// closing sign-off, under the column header on a page of its own
	if f.need(signOffKeep) {
		b.checkHeader(f)
	}
	f.y += 4
	b.signOff(f, "Winding finished")
}

// coilSteps stands in for a plan without steps: one coil step per coil.
func coilSteps(p *plan.Plan) []plan.Step {
	out := make([]plan.Step, 0, len(p.Coils))
	for i, c := range p.Coils {
		out = append(out, plan.Step{Index: i + 1, Kind: plan.StepCoil, Coil: &plan.CoilStep{
			Order: c.Order, Of: len(p.Coils), Tooth: c.Tooth, Phase: c.Phase, Path: c.Path, Position: c.Position,
			Direction: c.Direction.String(), Turns: c.Turns, WireLengthM: c.WireLengthM}})
	}
	return out
}

// checklist columns (x offsets from the margin, mm).
var ckCols = []struct {
	head string
	x    float64
}{
	{"step", 0}, {"coil", 9}, {"tooth", 24}, {"phase", 35}, {"path·pos", 43}, {"sense", 56}, {"turns", 73},
	{"wind / from → to", 83}, {"turns counted", 146}, {"sense checked", 158}, {"initials", 170},
}

func (b *builder) checkHeader(f *flow) {
	w := b.width()
	f.c.box(marginMM, f.y, w, ckHeadH, Pen{}, &Fill{Colour{215, 215, 215}})
	for i, col := range ckCols {
		x := marginMM + col.x*w/186
		if i >= 8 {
			f.c.text(x+5, f.y+2.8, sizeTiny, Bold, Ink, centre, firstWord(col.head))
			f.c.text(x+5, f.y+5.6, sizeTiny, Bold, Ink, centre, restWords(col.head))
			continue
		}
		f.c.text(x+1, f.y+4.3, sizeTiny, Bold, Ink, left, col.head)
	}
	f.y += ckHeadH
}

func firstWord(s string) string {
	for i, r := range s {
		if r == ' ' {
			return s[:i]
		}
	}
	return s
}

func restWords(s string) string {
	for i, r := range s {
		if r == ' ' {
			return s[i+1:]
		}
	}
	return ""
}

func (b *builder) colX(i int) float64 { return marginMM + ckCols[i].x*b.width()/186 }

// ckSmall is the size of the from / to and detail text of a checklist row.
const ckSmall = sizeTiny

// fromToLines is the "from / to" part of a coil row's wind cell, wrapped to
// its column.
func (b *builder) fromToLines(cs *plan.CoilStep) []string {
	ft := cs.From
	if cs.To != "" {
		ft += " → " + cs.To
	}
	if ft == "" {
		ft = fmt.Sprintf("%.2f m", cs.WireLengthM)
	}
	return wrap(clean(Regular, ft), b.colX(8)-b.colX(7)-2, ckSmall, Regular)
}

// slotWords is the instruction of a coil row in the guide's words ("down
// slot 1, up slot 24"), "" when the plan gives no slots.
func slotWords(cs *plan.CoilStep) string {
	if cs.DownSlot == 0 || cs.UpSlot == 0 {
		return ""
	}
	return plan.SlotWords(cs.DownSlot, cs.UpSlot)
}

// Coil row text positions, mm from the top of the row.
const (
	ckWindBase = 1.3 + 0.75*sizeBody*ptMM // first baseline of the wind cell
	ckCoilPad  = 1.3                      // below the last line
)

// coilRowHeight is the height of a coil row whose wind cell holds the
// instruction and n lines of from / to.
func coilRowHeight(n int) float64 {
	return max(ckCoilH, ckWindBase+lineStep(sizeBody)*0.95+float64(max(0, n-1))*lineStep(ckSmall)+0.25*ckSmall*ptMM+ckCoilPad)
}

// coilRow draws a coil row of height h at f.y; band is the height of its
// phase band (the row and the notes under it on this page). It leaves f.y.
func (b *builder) coilRow(f *flow, st plan.Step, ft []string, h, band float64, sp *StepProgress) {
	c := f.c
	cs := st.Coil
	y := f.y
	mid := y + h/2
	base := mid + 1.1
	ph := b.phaseIndex(cs.Phase)
	if ph >= 0 {
		sty := b.phaseStyle(ph)
		c.box(marginMM, y+0.4, 1.6, band-0.8, Pen{}, &Fill{sty.Colour})
	}
	c.text(b.colX(0)+2.5, base, sizeSmall, Regular, Ink, left, fmt.Sprint(st.Index))
	of := fmt.Sprintf("%d of %d", cs.Order, cs.Of)
	c.text(b.colX(1)+1, base, sizeBody, Bold, Ink, left, of)
	c.text(b.colX(2)+1, base, sizeBody+1, Bold, Ink, left, fmt.Sprintf("T%d", cs.Tooth))
	if ph >= 0 {
		b.phaseMark(c, Point{b.colX(3) + 4, mid}, 2.3, ph)
	} else {
		c.text(b.colX(3)+1, base, sizeBody, Bold, Ink, left, cs.Phase)
	}
	c.text(b.colX(4)+1, base, sizeBody, Regular, Ink, left, fmt.Sprintf("%d·%d", cs.Path, cs.Position))
	// the sense as large as the row allows, with its word
	cw := cs.Direction != winding.CCW.String()
	c.senseArrow(b.colX(5)+3.6, mid, 2.6, cw, Ink, 0.45)
	word := "cw"
	if !cw {
		word = "ccw"
	}
	c.text(b.colX(5)+9.6, base+0.3, sizeBody+1.5, Bold, Ink, left, word)
	c.text(b.colX(6)+1, base, sizeBody+1, Bold, Ink, left, fmt.Sprint(cs.Turns))
	// the instruction in the guide's words, then from / to under it
	fy := y + ckWindBase
	if sw := slotWords(cs); sw != "" {
		c.text(b.colX(7)+1, fy, sizeBody, Bold, Ink, left, fit(sw, b.colX(8)-b.colX(7)-2, sizeBody, Bold))
		fy += lineStep(sizeBody) * 0.95
	}
	for _, l := range ft {
		c.text(b.colX(7)+1, fy, ckSmall, Regular, Ink, left, l)
		fy += lineStep(ckSmall)
	}
	b.tickBoxes(f, y, h, cs, sp)
}

// tickBoxes draws the boxes at the right of a row: two for a coil (cs not
// nil), one for any other step, and the initials space. A step the record
// has done (sp not nil) gets its box ticked and the date above the initials
// line, and a coil the turns counted written in their box.
func (b *builder) tickBoxes(f *flow, y, h float64, cs *plan.CoilStep, sp *StepProgress) {
	c := f.c
	cy := y + (h-ckBoxS)/2
	if cs != nil {
		if sp != nil && sp.Turns > 0 {
			b.countCell(c, y, h, sp.Turns, cs.Turns)
		} else {
			c.checkbox(b.colX(8)+5-ckBoxS/2, cy, ckBoxS)
		}
	}
	switch {
	case sp != nil && sp.Skipped:
		// an optional test left out: said, not ticked
		c.text(b.colX(9)+5, cy+ckBoxS/2+0.35*sizeSmall*ptMM, sizeSmall, Bold, Ink, centre, "skipped")
	case sp != nil:
		c.checkbox(b.colX(9)+5-ckBoxS/2, cy, ckBoxS)
		c.tick(b.colX(9)+5-ckBoxS/2, cy, ckBoxS)
	default:
		c.checkbox(b.colX(9)+5-ckBoxS/2, cy, ckBoxS)
	}
	x := b.colX(10)
	c.line(x+1, y+h-1.4, marginMM+b.width()-0.5, y+h-1.4, Pen{Width: 0.2, Colour: Ink})
	if sp != nil && !sp.When.IsZero() {
		c.text(x+1, y+2.9, sizeTiny, Regular, Ink, left, dateOf(sp.When))
	}
}

// countCell writes the turns counted on a done coil in its box. A count that
// is not the plan's is printed white on black with the planned count under
// it, so it stands out on a monochrome printer too.
func (b *builder) countCell(c *canvas, y, h float64, got, want int) {
	cx := b.colX(8) + 5
	s := fmt.Sprint(got)
	tw := textWidth(Bold, sizeBody+1, s)
	bw := math.Min(math.Max(ckBoxS, tw+1.6), b.colX(9)-b.colX(8)-0.6)
	if got == want {
		c.box(cx-bw/2, y+(h-ckBoxS)/2, bw, ckBoxS, Pen{Width: 0.3, Colour: Ink}, &Fill{White})
		c.text(cx, y+h/2+1.2, sizeBody+1, Bold, Ink, centre, s)
		return
	}
	const bh = 4.1
	c.box(cx-bw/2, y+0.6, bw, bh, Pen{Width: 0.3, Colour: Ink}, &Fill{Ink})
	c.text(cx, y+0.6+bh/2+1.15, sizeBody+1, Bold, White, centre, s)
	c.text(cx, y+h-0.75, sizeTiny, Bold, Ink, centre, fmt.Sprintf("plan %d", want))
}

func (b *builder) stepText(st plan.Step) (title, detail string) {
	title = st.Title
	if title == "" {
		title = string(st.Kind)
	}
	detail = st.Detail
	if st.Kind == plan.StepSeparator && st.Slot > 0 && detail == "" {
		detail = fmt.Sprintf("slot %d", st.Slot)
	}
	if st.Kind == plan.StepTest && detail == "" {
		detail = b.testStepWords(st)
	}
	if j := st.Jumper; j != nil && j.LeavesSlot > 0 && !strings.Contains(detail, j.Words()) {
		// the row names the slots the jumper leaves and enters, in the
		// guide's words
		detail = strings.TrimSpace(sentence(j.Words()) + ". " + detail)
	}
	for _, r := range st.Reminders {
		if detail != "" {
			detail += " "
		}
		detail += "• " + r
	}
	return title, detail
}

// testStepWords says where a test step's readings go on paper: the test
// record's test, and for a test worked out from another's readings (the
// balance), the step they are read on, so nothing is read twice.
func (b *builder) testStepWords(st plan.Step) string {
	n, _ := b.testNumber(st.Test)
	if n == 0 {
		return ""
	}
	t := b.p.Tests[n-1]
	if t.ReadingsFrom == "" {
		return fmt.Sprintf("Write the readings in the test record, test %d.", n)
	}
	from := 0
	for _, s := range b.p.Steps {
		if s.Kind == plan.StepTest && s.Test == t.ReadingsFrom {
			from = s.Index
		}
	}
	src, title := b.testNumber(t.ReadingsFrom)
	if from == 0 || src == 0 {
		return fmt.Sprintf("Write the computed imbalance in the test record, test %d.", n)
	}
	return fmt.Sprintf("Nothing is read again: computed from the readings of step %d (%s, test %d); write the imbalance in the test record, test %d.", from, strings.ToLower(title[:1])+title[1:], src, n)
}

// stepTextW is the width of the title and detail of a step row.
func (b *builder) stepTextW() float64 { return b.colX(8) - b.colX(2) - 2 }

// titleLines is the step title wrapped to its column.
func (b *builder) titleLines(title string) []string {
	return wrap(clean(Bold, title), b.stepTextW(), sizeBody, Bold)
}

func (b *builder) stepRowHeight(st plan.Step) float64 {
	title, detail := b.stepText(st)
	h := 6.5 + float64(len(b.titleLines(title))-1)*lineStep(sizeBody)
	if detail != "" {
		h += paraHeight(b.stepTextW(), ckSmall, Regular, detail) + 0.8
	}
	return math.Max(h, ckCoilH)
}

var kindWords = map[plan.StepKind]string{
	plan.StepPrepare: "prepare", plan.StepJumper: "jumper", plan.StepSeparator: "insulate",
	plan.StepTerminal: "leads", plan.StepJoin: "join", plan.StepTest: "test",
}

// stepRow draws the row of a step that is not a coil, of height h at f.y;
// band is the height of its panel (the row and the notes under it on this
// page). It leaves f.y.
func (b *builder) stepRow(f *flow, st plan.Step, h, band float64, sp *StepProgress) {
	c := f.c
	y := f.y
	if st.Kind == plan.StepPrepare || st.Kind == plan.StepSeparator {
		c.box(marginMM, y, b.width(), band, Pen{}, &Fill{Panel})
	}
	title, detail := b.stepText(st)
	c.text(b.colX(0)+2.5, y+4.3, sizeSmall, Regular, Ink, left, fmt.Sprint(st.Index))
	kw := kindWords[st.Kind]
	if kw == "" {
		kw = string(st.Kind)
	}
	c.text(b.colX(1)+1, y+4.3, sizeTiny, Bold, Colour{90, 90, 90}, left, kw)
	ty := y + 4.3
	for _, l := range b.titleLines(title) {
		c.text(b.colX(2)+1, ty, sizeBody, Bold, Ink, left, l)
		ty += lineStep(sizeBody)
	}
	if detail != "" {
		c.para(b.colX(2)+1, ty-lineStep(sizeBody)+3.7, b.stepTextW(), ckSmall, Regular, Ink, detail)
	}
	b.tickBoxes(f, y, math.Min(h, 8), nil, sp)
}

// signOff draws name, date and signature fields across the page.
func (b *builder) signOff(f *flow, what string) {
	c := f.c
	x0 := float64(marginMM)
	w := b.width()
	c.box(x0, f.y, w, 16, Pen{Width: 0.45, Colour: Ink}, nil)
	c.para(x0+2, f.y+4.5, 52, sizeBody, Bold, Ink, what)
	fields := []string{"name", "date", "signature"}
	fw := (w - 56) / 3
	for i, fl := range fields {
		x := x0 + 56 + float64(i)*fw
		c.line(x, f.y, x, f.y+16, thin)
		c.text(x+1.5, f.y+3.5, sizeTiny, Regular, Colour{90, 90, 90}, left, fl)
	}
	f.y += 18
}

// signOffKeep is the room the closing sign-off takes under the last row.
const signOffKeep = 22

// checkRow draws one step's row and the recorded notes under it. A row and
// its notes are kept on one page when they fit on one, with keep mm more
// below them (the sign-off under the last row); notes longer than a page
// flow on line by line under a repeated header.
func (b *builder) checkRow(f *flow, st plan.Step, rec *recorded, keep float64) {
	sp := rec.step(st.Index)
	notes := b.noteLines(rec.notesFor(st.Index))
	var ft []string
	var h float64
	if st.Kind == plan.StepCoil && st.Coil != nil {
		ft = b.fromToLines(st.Coil)
		h = coilRowHeight(len(ft))
	} else {
		h = b.stepRowHeight(st)
	}
	nh := notesHeight(len(notes))
	whole := f.b.bottom() - f.b.top() - 3 - ckHeadH
	if f.need(min(h+nh+keep, whole)) {
		b.checkHeader(f)
	}
	band := h
	if f.y+h+nh <= f.b.bottom() {
		band = h + nh
	}
	if ft != nil {
		b.coilRow(f, st, ft, h, band, sp)
	} else {
		b.stepRow(f, st, h, band, sp)
	}
	f.y += h
	if len(notes) > 0 {
		b.noteRows(f, st.Index, notes)
	}
	f.c.line(marginMM, f.y, marginMM+b.width(), f.y, Pen{Width: 0.15, Colour: Faint})
}

// noteRows writes the note lines of a step under its row, starting a new
// page (with the header and the step's number) where they cross the bottom.
func (b *builder) noteRows(f *flow, step int, lines []string) {
	x := b.colX(1) + 1
	ls := lineStep(ckSmall)
	top := f.y
	rule := func() { f.c.line(x-0.6, top, x-0.6, f.y-0.6, Pen{Width: 0.35, Colour: Ink}) }
	f.y += 0.3
	for _, l := range lines {
		if f.y+ls > f.b.bottom() {
			rule()
			f.newPage()
			b.checkHeader(f)
			top = f.y
			f.c.text(b.colX(0)+2.5, f.y+0.3+0.75*ckSmall*ptMM, ckSmall, Regular, Faint, left, fmt.Sprint(step))
			f.y += 0.3
		}
		f.c.text(x+0.6, f.y+0.75*ckSmall*ptMM, ckSmall, Regular, Ink, left, l)
		f.y += ls
	}
	f.y += notesPad
	rule()
}
