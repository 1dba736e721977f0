package printout

import (
	"fmt"
	"strconv"

	"coilwright/winding/plan"
)

// PolarityPage is the sheet of the polarity test: per phase, a strip of the
// wound teeth with the pole each must show, to tick at the bench.
const PolarityPage PageKind = "polarity"

// Polarity strip geometry, mm.
const (
	polCellW = 17.0 // one tooth
	polCellH = 21.0
	polTick  = 4.5 // tick box side
)

// polarity lays out the polarity sheet: the cautions, how to read a tooth,
// then each phase as a strip of cells, one per wound tooth in tooth order,
// each with the tooth number, the pole of the plan in large type and a box
// to tick (the pole seen is written in where the record has it).
func (b *builder) polarity() {
	p := b.p
	poles := p.Polarity
	if len(poles) == 0 {
		poles = plan.Poles(p.Layout)
	}
	test, _ := p.TestNamed(plan.TestPolarity)
	seen := b.polaritySeen()
	f := b.startFlow(PolarityPage, "Polarity test: the pole of every tooth")
	c := f.c
	x0 := float64(marginMM)
	w := b.width()

	caution := plan.PolarityCaution
	h := paraHeight(w-24, sizeBody, Regular, caution) + 6
	c.box(x0, f.y, w, h, Pen{Width: 0.4, Colour: Ink}, &Fill{Colour{255, 244, 204}})
	c.warningSign(x0+10, f.y+2, 11)
	c.para(x0+22, f.y+5, w-24, sizeBody, Regular, Ink, caution)
	f.y += h + 3

	current := "a few amperes"
	if test.Current > 0 {
		current = fmt.Sprintf("%g A", test.Current)
	}
	how := fmt.Sprintf("Set the supply's current limit to %s and feed one phase at a time from its start lead (+) to its finish lead (−), every parallel path at once. "+
		"Hold a compass at each tooth face in turn: its north end points AT a south (S) face and AWAY from a north (N) face. Tick the box when the tooth shows the pole printed; "+
		"where it shows the other pole write it in: that coil is wound the wrong way round (its step is in the checklist). "+
		"Test each phase right after its last coil, and every phase again before the %s is made.", current, jointWord(p))
	if test.Note != "" {
		how += " " + capitalise(test.Note) + "."
	}
	f.y = c.para(x0, f.y+3, w, sizeSmall, Regular, Ink, how)

	perRow := max(1, int(w/polCellW))
	for ph, name := range p.Layout.PhaseNames {
		var teeth []plan.ToothPole
		for _, tp := range poles {
			if tp.Phase == name {
				teeth = append(teeth, tp)
			}
		}
		rows := (len(teeth) + perRow - 1) / perRow
		f.need(11 + float64(rows)*(polCellH+2))
		st := StyleOf(ph, name)
		f.y += 5
		c = f.c
		c.box(x0, f.y-3.2, 6, 4.2, Pen{}, &Fill{st.Tint})
		c.text(x0+3, f.y, sizeHead, Bold, st.Colour, centre, name)
		c.text(x0+8, f.y, sizeHead, Bold, Ink, left, fmt.Sprintf("Phase %s: DC into %s1 (+), out of %s2 (−)", name, name, name))
		f.y += 3
		for i, tp := range teeth {
			col, row := i%perRow, i/perRow
			x := x0 + float64(col)*polCellW
			y := f.y + float64(row)*(polCellH+2)
			b.poleCell(c, x, y, tp, seen)
		}
		f.y += float64(rows) * (polCellH + 2)
	}
	f.y += 2
	f.need(8)
	f.c.text(x0, f.y+4, sizeSmall, Regular, Ink, left, "Read by ____________________   date ____________   supply set to ______ A   compass checked against north  [  ]")
}

// poleCell draws one tooth: its number, the pole of the plan, a tick box and,
// where the record has it, the pole seen.
func (b *builder) poleCell(c *canvas, x, y float64, tp plan.ToothPole, seen map[string]float64) {
	w, h := polCellW-1.5, polCellH
	c.box(x, y, w, h, Pen{Width: 0.3, Colour: Ink}, nil)
	c.text(x+w/2, y+4, sizeSmall, Regular, Ink, centre, "tooth "+strconv.Itoa(tp.Tooth))
	c.text(x+w/2, y+12.5, 20, Bold, Ink, centre, string(tp.Pole))
	bx, by := x+1.5, y+h-polTick-1.5
	c.checkbox(bx, by, polTick)
	if v, ok := seen[plan.PoleKey(tp.Tooth)]; ok {
		if pole, sure := plan.PoleFromValue(v); sure && pole == tp.Pole {
			c.tick(bx, by, polTick)
		} else {
			word := "?"
			if sure {
				word = string(pole) + "!"
			}
			c.text(bx+polTick+1.5, by+polTick-0.8, sizeSmall, Bold, Ink, left, word)
		}
	}
}

func jointWord(p *plan.Plan) string {
	if p.Connection.String() == "delta" {
		return "delta"
	}
	return "star point"
}

func capitalise(s string) string {
	if s == "" {
		return s
	}
	r := []rune(s)
	if r[0] >= 'a' && r[0] <= 'z' {
		r[0] -= 'a' - 'A'
	}
	return string(r)
}

// polaritySeen is the pole read at each tooth, from every polarity step of
// the record in step order (a later reading of a tooth stands), or else from
// the readings given for the test.
func (b *builder) polaritySeen() map[string]float64 {
	st := b.o.Progress
	if st == nil {
		return b.o.Readings[plan.TestPolarity].Values
	}
	out := map[string]float64{}
	for i, s := range b.p.Steps {
		if s.Kind != plan.StepTest || s.Test != plan.TestPolarity || i >= len(st.Steps) || st.Steps[i].Reading == nil {
			continue
		}
		for k, v := range st.Steps[i].Reading.Values {
			out[k] = v
		}
	}
	return out
}
