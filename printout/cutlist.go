package printout

import (
	"fmt"
	"sort"
	"strings"
)

// cutList writes the wire to cut per path and per coil, the totals to buy
// and the insulation materials.
func (b *builder) cutList() {
	p := b.p
	f := b.startFlow(CutListPage, "Cut list and materials")
	c := f.c
	x0 := float64(marginMM)
	w := b.width()
	// totals panel
	c.box(x0, f.y, w, 24, Pen{Width: 0.4, Colour: Ink}, &Fill{Panel})
	strands := max(1, p.Wire.StrandsInHand)
	facts := [][2]string{
		{"wire", b.wireText()},
		{"copper to buy", fmt.Sprintf("%.1f m, %.3f kg", p.BuyLengthM, p.BuyMassKg)},
		{"copper in the winding", fmt.Sprintf("%.1f m, %.3f kg", p.CopperLengthM, p.CopperMassKg)},
		{"turns per coil", fmt.Sprint(p.TurnsPerCoil)},
		{"mean turn", fmt.Sprintf("%.1f mm", p.MeanTurnLengthMM)},
		{"slot fill", fmt.Sprintf("%.0f %% of the usable slot area", 100*p.SlotFill)},
	}
	for i, kv := range facts {
		cx := x0 + 2 + float64(i%3)*(w/3)
		cy := f.y + 6 + float64(i/3)*10
		c.text(cx, cy, sizeTiny, Regular, Colour{90, 90, 90}, left, kv[0])
		c.text(cx, cy+4.5, sizeBody+1, Bold, Ink, left, fit(kv[1], w/3-4, sizeBody+1, Bold))
	}
	f.y += 27
	note := "Lengths are of one strand."
	if strands > 1 {
		note = fmt.Sprintf("Lengths are of one strand: with %d strands in hand cut %d pieces of each length.", strands, strands)
	}
	f.y = c.para(x0, f.y+2, w, sizeSmall, Regular, Ink, note+" The cut length adds both leads and the working allowance to the wire between the terminals. The amount to buy adds the spool margin.")

	f.heading("Wire per path")
	cols := scaleCols([]column{
		{"phase", 14, left, Bold}, {"path", 12, centre, Regular}, {"coils", 12, centre, Regular},
		{"terminals", 22, centre, Regular}, {"between terminals", 30, right, Mono},
		{"leads and allowance", 30, right, Mono}, {"cut length", 26, right, Mono}, {"R at 20 °C", 24, right, Mono},
	}, w)
	var rows [][]string
	totalCut := 0.0
	for _, pp := range p.Paths {
		totalCut += pp.CutLengthM
		rows = append(rows, []string{pp.Phase, fmt.Sprint(pp.Path), fmt.Sprint(pp.Coils), pp.Phase + "1 – " + pp.Phase + "2",
			fmt.Sprintf("%.2f m", pp.WireLengthM), fmt.Sprintf("%.2f m", pp.CutLengthM-pp.WireLengthM),
			fmt.Sprintf("%.2f m", pp.CutLengthM), fmt.Sprintf("%.4g Ω", pp.Ohm20C)})
	}
	rows = append(rows, []string{"all", "", fmt.Sprint(len(p.Coils)), "", "", "", fmt.Sprintf("%.2f m", totalCut), ""})
	f.table(cols, rows, 6)

	f.heading("Wire per coil")
	b.perCoil(f)

	f.heading("Insulation and other materials")
	mcols := scaleCols([]column{
		{"item", 38, left, Bold}, {"count", 11, right, Regular}, {"size", 60, left, Regular}, {"length", 16, right, Mono}, {"note", 61, left, Regular},
	}, w)
	var mrows [][]string
	for _, m := range p.Materials {
		l := ""
		if m.LengthMM > 0 {
			l = fmt.Sprintf("%.0f mm", m.LengthMM)
		}
		mrows = append(mrows, []string{m.Item, fmt.Sprint(m.Count), m.SizeText, l, m.Note})
	}
	if len(mrows) == 0 {
		mrows = append(mrows, []string{"(none listed in the plan)", "", "", "", ""})
	}
	f.table(mcols, mrows, 6)
}

// perCoil lists coils grouped by turns and wire length, with their teeth.
func (b *builder) perCoil(f *flow) {
	type key struct {
		turns int
		mm    int64
	}
	groups := map[key][]int{}
	var keys []key
	for _, c := range b.p.Coils {
		k := key{c.Turns, int64(c.WireLengthM*1000 + 0.5)}
		if _, ok := groups[k]; !ok {
			keys = append(keys, k)
		}
		groups[k] = append(groups[k], c.Tooth)
	}
	sort.Slice(keys, func(i, j int) bool {
		if keys[i].turns != keys[j].turns {
			return keys[i].turns < keys[j].turns
		}
		return keys[i].mm < keys[j].mm
	})
	w := b.width()
	for _, k := range keys {
		teeth := groups[k]
		sort.Ints(teeth)
		ts := make([]string, len(teeth))
		for i, t := range teeth {
			ts[i] = fmt.Sprint(t)
		}
		head := fmt.Sprintf("%d coils of %d turns, %.2f m of wire each", len(teeth), k.turns, float64(k.mm)/1000)
		body := "teeth " + strings.Join(ts, ", ")
		h := 5 + paraHeight(w-4, sizeSmall, Regular, body)
		f.need(h)
		f.c.text(marginMM, f.y+3, sizeBody, Bold, Ink, left, head)
		f.y = f.c.para(marginMM+4, f.y+7, w-4, sizeSmall, Regular, Ink, body)
	}
	if len(keys) == 0 {
		f.c.text(marginMM, f.y+3, sizeBody, Regular, Ink, left, "(the plan lists no coils)")
		f.y += 5
	}
}
