package printout

import (
	"math"
	"testing"
)

// TestLeadTagsClear checks every slot map's lead tags: each leader leaves
// its tooth radially for at least leadMinLen mm, and no tag covers another
// tag or sits on another lead's leader.
func TestLeadTagsClear(t *testing.T) {
	for _, fx := range fixtures {
		t.Run(fx.name, func(t *testing.T) {
			p := fixturePlan(t, fx.spec, fx.conn)
			for _, paper := range PaperSizes {
				b := &builder{p: p, paper: paper}
				g := b.slotRing()
				places := b.placeLeads(g)
				if want := 2 * len(p.Layout.Chains); len(places) != want {
					t.Errorf("placeLeads(%s) = %d tags; want %d", fx.name, len(places), want)
				}
				for k, a := range places {
					if run := math.Hypot(a.knee.X-a.from.X, a.knee.Y-a.from.Y); run < leadMinLen {
						t.Errorf("%s %s: leader of %s runs %.1f mm off tooth %d; want at least %g", fx.name, paper.Name, a.mark, run, a.tooth, leadMinLen)
					}
					for m, o := range places {
						if m == k {
							continue
						}
						if m > k && a.r.overlaps(o.r) {
							t.Errorf("%s %s: tag %s covers tag %s", fx.name, paper.Name, a.mark, o.mark)
						}
						if o.r.hitsSegment(a.from, a.knee) || o.r.hitsSegment(a.knee, a.at) {
							t.Errorf("%s %s: leader of %s crosses tag %s", fx.name, paper.Name, a.mark, o.mark)
						}
					}
				}
			}
		})
	}
}
