package printout

import (
	"bytes"
	"fmt"
	"path/filepath"
	"slices"
	"testing"
	"time"

	"coilwright/winding/job"
	"coilwright/winding/job/jobtest"
	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

func demoPlan(t testing.TB) *plan.Plan {
	t.Helper()
	p, err := plan.Build(job.Demo())
	if err != nil {
		t.Fatalf("plan.Build(job.Demo()) = %v", err)
	}
	return p
}

// testJobPlan builds the plan of the named job among the test jobs.
func testJobPlan(t testing.TB, file string) *plan.Plan {
	t.Helper()
	j, err := job.Load(filepath.Join(jobtest.Dir(t), file))
	if err != nil {
		t.Fatal(err)
	}
	p, err := plan.Build(j)
	if err != nil {
		t.Fatal(err)
	}
	return p
}

func TestDemoPackReadsBack(t *testing.T) {
	p := demoPlan(t)
	pk, err := Build(p, Options{})
	if err != nil {
		t.Fatal(err)
	}
	pdf := render(t, pk)
	pages, err := pdfPageTexts(pdf)
	if err != nil {
		t.Fatal(err)
	}
	for k := 1; k <= p.Layout.Spec.Slots; k++ {
		if !slices.Contains(pages[0], fmt.Sprint(k)) {
			t.Errorf("demo slot map lacks tooth %d", k)
		}
	}
	var all []string
	for _, pg := range pages {
		all = append(all, pg...)
	}
	for _, m := range []string{"U1", "U2", "V1", "V2", "W1", "W2", fmt.Sprintf("%d turns per coil", p.TurnsPerCoil), "Winding checklist", "Caution"} {
		if !slices.Contains(all, m) {
			t.Errorf("demo pack PDF lacks %q", m)
		}
	}
	if len(pdf) >= 1<<20 || len(pk.Pages) < 4 {
		t.Errorf("demo pack = %d bytes, %d pages; want under 1 MB and at least 4 pages", len(pdf), len(pk.Pages))
	}
}

func BenchmarkDemoPack(b *testing.B) {
	p := demoPlan(b)
	benchPack(b, p, Options{})
}

// BenchmarkDemoPackWithRecord prints the demo pack from a record in which
// every step is done, every coil a turn short and noted.
func BenchmarkDemoPackWithRecord(b *testing.B) {
	p := demoPlan(b)
	when := p.Date.Add(24 * time.Hour)
	pr := progress.New(p)
	for i, st := range p.Steps {
		pr.Steps[i] = progress.Step{Done: true, At: when}
		if st.Coil != nil {
			pr.Steps[i].Turns = st.Coil.Turns - 1
			pr.Steps[i].Note, pr.Steps[i].NoteAt = "one turn short: the last layer was full", when
		}
	}
	pr.Recorded = when
	benchPack(b, p, Options{Progress: pr})
}

// benchPack builds and renders the pack of p once per benchmark loop.
func benchPack(b *testing.B, p *plan.Plan, o Options) {
	b.Helper()
	for b.Loop() {
		pk, err := Build(p, o)
		if err != nil {
			b.Fatal(err)
		}
		var buf bytes.Buffer
		if err := Render(pk, &buf); err != nil {
			b.Fatal(err)
		}
		b.SetBytes(int64(buf.Len()))
	}
}
