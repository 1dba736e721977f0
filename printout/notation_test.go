package printout_test

import (
	"bytes"
	"strings"
	"testing"

	"coilwright/printout"
	"coilwright/printout/pdftext"
	"coilwright/winding/job"
	"coilwright/winding/job/jobtest"
	"coilwright/winding/plan"
	"coilwright/winding/sensetest"
)

// No page of the printed pack writes a coil's sense by letter case: the
// pack shows sense by its drawn marks and, where it writes a phase, an
// upper-case letter. Read back from the rendered PDF, run by run and page by
// page (runs joined by spaces, so a sequence split into one run per tooth is
// caught too).
func TestPackWritesNoCaseCodedSense(t *testing.T) {
	jobs := map[string]*job.Job{
		"demo":          job.Demo(),
		"24/22 single":  jobtest.DemoVariant(jobtest.Variant{Slots: 24, Poles: 22, Layers: 1, Paths: 1, Phases: 3, TurnsPerCoil: 12}),
		"20/18 5-phase": jobtest.DemoVariant(jobtest.Variant{Slots: 20, Poles: 18, Layers: 2, Paths: 1, Phases: 5, TurnsPerCoil: 12}),
	}
	for name, j := range jobs {
		p, err := plan.Build(j)
		if err != nil {
			t.Fatalf("%s: plan.Build: %v", name, err)
		}
		pack, err := printout.Build(p, printout.Options{})
		if err != nil {
			t.Fatalf("%s: printout.Build: %v", name, err)
		}
		var pdf bytes.Buffer
		if err := printout.Render(pack, &pdf); err != nil {
			t.Fatalf("%s: Render: %v", name, err)
		}
		pages, err := pdftext.Pages(pdf.Bytes())
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		for i, runs := range pages {
			for _, text := range []string{strings.Join(runs, "\n"), strings.Join(runs, " ")} {
				if bad := sensetest.CaseCoded(text); len(bad) > 0 {
					t.Errorf("%s page %d writes sense by letter case: %.200q", name, i+1, bad)
				}
			}
		}
	}
}
