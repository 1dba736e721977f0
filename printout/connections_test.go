package printout

import (
	"regexp"
	"slices"
	"testing"

	"coilwright/winding"
)

// The star point or delta joints never take a sheet of their own: every
// connection sheet carries coils of the chains, and the joints are printed
// once.
func TestJointsBesideTheChains(t *testing.T) {
	coil := regexp.MustCompile(`^T\d+$`)
	specs := []winding.Spec{{Slots: 120, Poles: 112, Paths: 2}, {Slots: 96, Poles: 88}, {Slots: 72, Poles: 66}, {Slots: 12, Poles: 10}}
	for _, s := range specs {
		for _, paper := range PaperSizes {
			pk, err := Build(fixturePlan(t, s, winding.Star), Options{Paper: paper})
			if err != nil {
				t.Fatal(err)
			}
			joints := 0
			for _, pg := range pagesOf(pk, ConnectionPage) {
				texts := pg.Texts()
				if slices.Contains(texts, "Star point") {
					joints++
				}
				if !slices.ContainsFunc(texts, coil.MatchString) {
					t.Errorf("%d/%d %s: sheet %q has no coil of the chains", s.Slots, s.Poles, paper.Name, pg.Title)
				}
			}
			if joints != 1 {
				t.Errorf("%d/%d %s: star point printed %d times; want once", s.Slots, s.Poles, paper.Name, joints)
			}
		}
	}
}
