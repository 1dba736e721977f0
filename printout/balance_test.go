package printout

import (
	"math"
	"slices"
	"strings"
	"testing"
	"time"

	"coilwright/winding/journal"
	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// blockText is the text of one test's block on the record, from its head
// "n. Title" to the next test's head, with white space collapsed.
func blockText(texts []string, head, next string) string {
	all := words(strings.Join(texts, " "))
	i := strings.Index(all, head)
	if i < 0 {
		return ""
	}
	rest := all[i:]
	if j := strings.Index(rest, next); j > 0 {
		rest = rest[:j]
	}
	return rest
}

// The balance is computed from the resistance test's readings, never read
// a second time: its block names the test it comes from, gives one cell for
// the computed imbalance against the 2 % limit and the formula, and fills
// the cell from the record's resistance readings.
//
// Worked by hand (star, R_U = (R_UV + R_WU − R_VW)/2 and rotations) from
// U–V 0.2855, V–W 0.2861, W–U 0.2858 Ω: U 0.1426, V 0.1429, W 0.1432 Ω, mean
// 0.1429, largest deviation 0.0003, imbalance 0.2099 % (EASA AR100's rule;
// the correction to 20 °C scales every phase alike and leaves it unchanged).
func TestBalanceComputedFromResistanceReadings(t *testing.T) {
	p := demoPlan(t)
	head, next := "5. Resistance balance", "6. Insulation resistance"
	blank := blockText(recordTexts(t, p, Options{}), head, next)
	for _, want := range []string{
		"computed from the readings of test 4, Resistance of each phase: nothing is read again",
		"imbalance, computed", "at most 2 %", "R_mean", "(EASA AR100)",
	} {
		if !strings.Contains(blank, want) {
			t.Errorf("balance block lacks %q in %q", want, blank)
		}
	}
	for _, bad := range []string{"U–V V–W", "winding temperature", "meter (make, model)"} {
		if strings.Contains(blank, bad) {
			t.Errorf("balance block asks again for %q: %q", bad, blank)
		}
	}
	uv, vw, wu := 0.2855, 0.2861, 0.2858
	ru, rv, rw := (uv+wu-vw)/2, (uv+vw-wu)/2, (vw+wu-uv)/2
	mean := (ru + rv + rw) / 3
	dev := math.Max(math.Abs(ru-mean), math.Max(math.Abs(rv-mean), math.Abs(rw-mean)))
	want := plan.FormatValue(100*dev/mean, plan.UnitPercent)
	if math.Abs(100*dev/mean-0.2099) > 0.0005 {
		t.Fatalf("hand imbalance = %.4f %%; want 0.2099 %%", 100*dev/mean)
	}
	filled := recordTexts(t, p, Options{Readings: map[string]Reading{
		plan.TestResistance: {Values: map[string]float64{"uv": uv, "vw": vw, "wu": wu, "temp": 15}, Verdict: "pass"},
	}})
	got := blockText(filled, head, next)
	if !strings.Contains(got, "imbalance, computed at most 2 % "+want) {
		t.Errorf("balance cell filled from the resistance readings: %q; want the imbalance %s", got, want)
	}
}

// An optional test left out on the bench (the record's step is done and
// skipped) prints as skipped in the checklist and on the test record, not
// as done and not blank.
func TestSkippedTestPrintsSkipped(t *testing.T) {
	p := demoPlan(t)
	var emf plan.Step
	for _, st := range p.Steps {
		if st.Kind == plan.StepTest && st.Test == plan.TestBackEMF {
			emf = st
		}
	}
	if emf.Index == 0 {
		t.Fatal("demo plan has no back-EMF step")
	}
	day := time.Date(2026, 11, 22, 10, 0, 0, 0, time.UTC)
	events := []journal.Event{
		progress.FingerprintEvent(p),
		progress.Stamp(p, journal.Event{Kind: journal.Done, Step: emf.Index, Skipped: true, Time: day}),
	}
	for i := range events {
		events[i].Seq, events[i].Line = i+1, i+1
	}
	st := progress.Fold(p, events)
	if !st.Steps[emf.Index-1].Skipped {
		t.Fatalf("progress of step %d = %+v; want skipped", emf.Index, st.Steps[emf.Index-1])
	}
	pk, err := Build(p, Options{Progress: st})
	if err != nil {
		t.Fatal(err)
	}
	// the checklist row: "skipped" in place of a ticked box
	found := false
	for _, pg := range pagesOf(pk, ChecklistPage) {
		texts := pg.Texts()
		if slices.Contains(texts, emf.Title) || slices.ContainsFunc(texts, func(s string) bool { return strings.HasPrefix(emf.Title, s) && s != "" }) {
			found = found || slices.Contains(texts, "skipped")
		}
	}
	if !found {
		t.Errorf("checklist row of step %d (%s) does not say skipped", emf.Index, emf.Title)
	}
	rec := words(strings.Join(recordTexts(t, p, Options{Progress: st}), " "))
	if !strings.Contains(rec, "skipped: this optional test was left out, as recorded on 2026-11-22") {
		t.Errorf("test record does not print the back-EMF test as skipped: %q", rec[max(0, len(rec)-900):])
	}
	// a test left out is not ticked as passed
	b := &builder{p: p, o: Options{Readings: readingsOf(st, p.Steps)}, paper: A4}
	if r := b.o.Readings[plan.TestBackEMF]; !r.Skipped || r.Verdict != "" {
		t.Errorf("record of the back-EMF test = %+v; want skipped without a verdict", r)
	}
}

// The back-EMF cells say what the meter should show per 1000 rpm: the
// demo's phase constant times √3 for a star read line to line (adjacent
// lines of three phases 120° apart), about 68.3 V.
func TestBackEMFCellsPerThousandRPM(t *testing.T) {
	p := demoPlan(t)
	if p.EMF == nil {
		t.Fatal("demo plan has no EMF")
	}
	want := plan.FormatValue(1000*p.EMF.VoltsPerRPMPhase*math.Sqrt(3), plan.UnitVolt) + " per 1000 rpm"
	got := blockText(recordTexts(t, p, Options{}), "8. Back-EMF", "Instruments used")
	if strings.Count(got, want) != 3 {
		t.Errorf("back-EMF block: %q; want %q in each of the 3 line cells", got, want)
	}
}

// Where the plan cannot estimate the iron loss, the machine sheet says so
// and gives the losses as a lower bound, never "iron 0.0"; each note reads
// once ("… not estimated: give …"), not prefixed a second time.
func TestMachineSheetIronNotEstimated(t *testing.T) {
	p := testJobPlan(t, "delta_paths_airgap.toml")
	if p.Machine == nil || p.Machine.Iron != nil {
		t.Skip("this job now gives the iron loss")
	}
	pk, err := Build(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	all := words(strings.Join(pagesOf(pk, MachinePage)[0].Texts(), " "))
	if !strings.Contains(all, "iron not estimated") || !strings.Contains(all, "at least ") || strings.Contains(all, "iron 0.0") {
		t.Errorf("machine sheet without an iron loss: %q", all)
	}
	if strings.Contains(all, "Not estimated:") {
		t.Errorf("machine sheet notes say \"not estimated\" twice: %q", all)
	}
}
