package printout

import (
	"fmt"
	"regexp"
	"slices"
	"strings"
	"testing"

	"coilwright/winding"
	"coilwright/winding/job/jobtest"
	"coilwright/winding/plan"
)

// Every coil row of the demo's checklist carries the guide's instruction,
// "down slot D, up slot U", with the slots worked out here from the
// convention (lead end up, facing the tooth from the air gap, a clockwise
// coil goes down the right-hand slot: slot k for an outer rotor, k-1 for an
// inner one), and every jumper row names the slots it leaves and enters.
func TestChecklistCoilRowsSayDownAndUp(t *testing.T) {
	p := demoPlan(t)
	all := strings.Join(sheetTexts(t, p, Options{}, ChecklistPage), "\n")
	q := p.Layout.Spec.Slots
	slot := func(k int) int { return (k-1+q)%q + 1 }
	coils, jumpers := 0, 0
	for _, st := range p.Steps {
		if c := st.Coil; c != nil {
			coils++
			right, left := slot(c.Tooth-1), slot(c.Tooth) // inner rotor
			if p.Rotor == plan.OuterRotor {
				right, left = left, right
			}
			down, up := right, left
			if c.Direction == winding.CCW.String() {
				down, up = left, right
			}
			want := fmt.Sprintf("down slot %d, up slot %d", down, up)
			// the row: its "N of M", then the instruction on its own line
			row := fmt.Sprintf("%d of %d\n", c.Order, c.Of)
			i := strings.Index(all, row)
			if i < 0 || !strings.Contains(all[i:min(len(all), i+200)], "\n"+want+"\n") {
				t.Errorf("checklist row of coil %d (tooth %d, %s) lacks %q", c.Order, c.Tooth, c.Direction, want)
			}
		}
		if j := st.Jumper; j != nil {
			jumpers++
			if !strings.Contains(strings.ReplaceAll(all, "\n", " "), fmt.Sprintf("leaves slot %d at the lead end, enters slot %d", j.LeavesSlot, j.EntersSlot)) {
				t.Errorf("checklist jumper row %d lacks the slots %d and %d", st.Index, j.LeavesSlot, j.EntersSlot)
			}
		}
	}
	if coils != len(p.Layout.Coils) || jumpers == 0 {
		t.Errorf("demo plan has %d coil steps and %d jumpers; want %d coils and some jumpers", coils, jumpers, len(p.Layout.Coils))
	}
	if n := strings.Count(all, "\ncw\n") + strings.Count(all, "\nccw\n"); n != coils {
		t.Errorf("checklist prints %d sense words; want one per coil, %d", n, coils)
	}
}

// The closing sign-off of the checklist never stands alone on a sheet: the
// sheet that carries it carries the last step's row too.
func TestChecklistSignOffNotAlone(t *testing.T) {
	packs := packsUnderTest(t)
	for _, v := range []jobtest.Variant{
		{Slots: 20, Poles: 18, Layers: 2, Paths: 1, Phases: 5, TurnsPerCoil: 18},
		{Slots: 36, Poles: 32, Layers: 2, Paths: 2, Phases: 3, Delta: true, TurnsPerCoil: 12},
		// these left the sign-off alone on its last sheet
		{Slots: 9, Poles: 8, Layers: 2, Paths: 1, Phases: 3, Delta: true, TurnsPerCoil: 12},
		{Slots: 18, Poles: 12, Layers: 2, Paths: 2, Phases: 3, TurnsPerCoil: 12},
		{Slots: 54, Poles: 48, Layers: 2, Paths: 2, Phases: 3, Delta: true, TurnsPerCoil: 12},
	} {
		p, err := plan.Build(jobtest.DemoVariant(v))
		if err != nil {
			t.Fatal(err)
		}
		pk, err := Build(p, Options{})
		if err != nil {
			t.Fatal(err)
		}
		packs[fmt.Sprintf("%d/%d m%d paths %d delta %v", v.Slots, v.Poles, v.Phases, v.Paths, v.Delta)] = pk
	}
	for name, pk := range packs {
		for _, pg := range pagesOf(pk, ChecklistPage) {
			texts := pg.Texts()
			if !slices.Contains(texts, "Winding finished") {
				continue
			}
			rows := 0
			coil := regexp.MustCompile(`^\d+ of \d+$`)
			for _, s := range texts {
				for _, kw := range kindWords {
					if s == kw {
						rows++
					}
				}
				if coil.MatchString(s) {
					rows++
				}
			}
			if rows == 0 {
				t.Errorf("%s: the sign-off stands alone on %q", name, pg.Title)
			}
		}
	}
}
