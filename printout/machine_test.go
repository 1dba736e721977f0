package printout

import (
	"fmt"
	"strings"
	"testing"

	"coilwright/winding/job"
	"coilwright/winding/plan"
)

// TestMachinePage: the demo pack has the machine sheet after the design
// figures, with the figures of the plan's Machine and the charging curve
// plotted point by point; a 5.0 V test-coil reading shows the saturation
// on the sheet; plans with nothing estimated get no sheet.
func TestMachinePage(t *testing.T) {
	p := demoPlan(t)
	pk, err := Build(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	pages := pagesOf(pk, MachinePage)
	if len(pages) != 1 {
		t.Fatalf("demo pack has %d machine sheets; want 1", len(pages))
	}
	for i, pg := range pk.Pages {
		if pg.Kind == MachinePage && (i == 0 || pk.Pages[i-1].Kind != FiguresPage) {
			t.Errorf("machine sheet is sheet %d, not right after the design figures", i+1)
		}
	}
	text := strings.Join(pages[0].Texts(), " ")
	for _, want := range []string{fmt.Sprintf("%.3f mH", p.Machine.PhaseInductanceMH), "tooth 1.20 T", "cut-in 286 rpm", "Charging curve", "Caution"} {
		if !strings.Contains(text, want) {
			t.Errorf("machine sheet text lacks %q:\n%s", want, text)
		}
	}
	// One dot per point of the curve.
	dots := 0
	for _, s := range pages[0].Shapes {
		if a, ok := s.(*Arc); ok && a.Radius == 0.55 && a.Sweep == 360 {
			dots++
		}
	}
	if dots != len(p.Machine.LoadCurve) {
		t.Errorf("machine sheet plots %d points; the curve has %d", dots, len(p.Machine.LoadCurve))
	}

	pk5 := demoEditPack(t, "five.toml", "volts_rms = 1.70", "volts_rms = 5.0")
	if text := strings.Join(textsOf(pagesOf(pk5, MachinePage)), " "); !strings.Contains(text, "ABOVE 1.8 T") {
		t.Errorf("machine sheet of the 5.0 V variant lacks the saturation mark:\n%s", text)
	}

	// The sheet keeps to its margins for the charging curve, the saturated
	// variant and the voltage curve of an EMF target.
	pkE := demoEditPack(t, "emf.toml", "target = \"dc_bus\"\nvolts = 26\nspeed_rpm = 300\nbridge_drop_v = 1.6", "target = \"line_emf\"\nvolts = 34\nspeed_rpm = 500")
	if text := strings.Join(textsOf(pagesOf(pkE, MachinePage)), " "); !strings.Contains(text, "Terminal voltage under load") {
		t.Errorf("machine sheet of a line-EMF job lacks the voltage curve:\n%s", text)
	}
	for name, k := range map[string]*Pack{"demo": pk, "5.0 V": pk5, "line EMF": pkE} {
		for _, pg := range pagesOf(k, MachinePage) {
			for _, s := range pg.Shapes {
				x0, y0, x1, y1 := s.bounds()
				if x0 < marginMM-0.6 || x1 > pg.W-marginMM+0.6 || y0 < 0 || y1 > pg.H-marginMM {
					t.Errorf("%s machine sheet: %T at (%.1f,%.1f)-(%.1f,%.1f) crosses the margins", name, s, x0, y0, x1, y1)
				}
			}
		}
	}

	for i, fx := range fixtures {
		if n := len(pagesOf(buildFixture(t, i), MachinePage)); n != 0 {
			t.Errorf("Build(%s): %d machine sheets; want none (no machine figures in the plan)", fx.name, n)
		}
	}
}

// demoEditPack builds the pack of the demo job with the text old of its
// TOML replaced by with, read under the file name name.
func demoEditPack(t *testing.T, name, old, with string) *Pack {
	t.Helper()
	j, err := job.Parse([]byte(strings.Replace(string(job.DemoTOML()), old, with, 1)), name)
	if err != nil {
		t.Fatal(err)
	}
	p, err := plan.Build(j)
	if err != nil {
		t.Fatal(err)
	}
	pk, err := Build(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	return pk
}
