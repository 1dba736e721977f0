package main

import (
	"bytes"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"coilwright/printout/pdftext"
	"coilwright/winding/job"
	"coilwright/winding/journal"
	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

func TestSheetDemo(t *testing.T) {
	// the demo prints the bench's demo record: keep it out of the home
	t.Setenv("XDG_STATE_HOME", t.TempDir())
	dir := t.TempDir()
	out := filepath.Join(dir, "pack.pdf")
	start := time.Now()
	code, _, stderr := runCLI(t, "sheet", "--demo", "-o", out)
	took := time.Since(start)
	if code != 0 {
		t.Fatalf("sheet --demo = exit %d (%s); want 0", code, stderr)
	}
	data, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.HasPrefix(data, []byte("%PDF-")) {
		t.Errorf("sheet --demo wrote %q...; want a PDF", data[:min(8, len(data))])
	}
	if len(data) >= 1<<20 {
		t.Errorf("sheet --demo = %d bytes; want under 1 MB", len(data))
	}
	if n := bytes.Count(data, []byte("/Type /Page\n")); n < 4 {
		t.Errorf("sheet --demo = %d pages; want at least 4", n)
	}
	// a loose guard, not a benchmark (see printout's benchmarks)
	if took > 10*time.Second {
		t.Errorf("sheet --demo took %v", took)
	}
	// same job, same bytes
	out2 := filepath.Join(dir, "again.pdf")
	runCLI(t, "sheet", "--demo", "-o", out2)
	again, _ := os.ReadFile(out2)
	if !bytes.Equal(data, again) {
		t.Errorf("two runs of sheet --demo wrote different files")
	}
}

func TestSheetPaperAndDate(t *testing.T) {
	t.Setenv("XDG_STATE_HOME", t.TempDir())
	out := filepath.Join(t.TempDir(), "pack.pdf")
	code, _, stderr := runCLI(t, "sheet", "--demo", "-o", out, "--paper", "letter", "--date", "2025-06-01")
	if code != 0 {
		t.Fatalf("sheet --paper letter --date = exit %d (%s); want 0", code, stderr)
	}
	data, _ := os.ReadFile(out)
	if !bytes.Contains(data, []byte("/CreationDate (D:20250601")) {
		t.Errorf("sheet --date 2025-06-01: PDF creation date not set from it")
	}
	// US Letter is 612 x 792 pt
	if !bytes.Contains(data, []byte("/MediaBox [0 0 612.00 792.00]")) {
		t.Errorf("sheet --paper letter: no 612 x 792 pt media box")
	}
}

func TestSheetRefusals(t *testing.T) {
	t.Setenv("XDG_STATE_HOME", t.TempDir())
	dir := t.TempDir()
	tests := []struct {
		name string
		args []string
		want string
	}{
		{"missing job file", []string{"sheet", filepath.Join(dir, "nothere.toml"), "-o", filepath.Join(dir, "x.pdf")}, "nothere.toml"},
		{"no output", []string{"sheet", "--demo"}, "-o FILE.pdf"},
		{"bad paper", []string{"sheet", "--demo", "-o", filepath.Join(dir, "x.pdf"), "--paper", "a3"}, "a4 or letter"},
		{"bad date", []string{"sheet", "--demo", "-o", filepath.Join(dir, "x.pdf"), "--date", "14/03/2025"}, "YYYY-MM-DD"},
		{"no job", []string{"sheet", "-o", filepath.Join(dir, "x.pdf")}, "--demo"},
		{"missing record", []string{"sheet", "--demo", "-o", filepath.Join(dir, "x.pdf"), "--progress", filepath.Join(dir, "none.progress")}, "none.progress"},
	}
	for _, tt := range tests {
		code, _, stderr := runCLI(t, tt.args...)
		if code != 2 || !strings.Contains(stderr, tt.want) {
			t.Errorf("%s: %v = exit %d, %q; want exit 2 naming %q", tt.name, tt.args[1:], code, stderr, tt.want)
		}
	}
	if _, err := os.Stat(filepath.Join(dir, "x.pdf")); err == nil {
		t.Errorf("a refused sheet command left a file behind")
	}
}

// pdfText renders the text of a written PDF, one run a line.
func pdfText(t *testing.T, path string) string {
	t.Helper()
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	pages, err := pdftext.Pages(data)
	if err != nil {
		t.Fatalf("pdftext.Pages(%s) = %v", path, err)
	}
	var b strings.Builder
	for _, pg := range pages {
		for _, r := range pg {
			b.WriteString(r)
			b.WriteByte('\n')
		}
	}
	return b.String()
}

// A pack printed beside a record is the stator's record: the turns counted
// on the done coils, the note and the summary come out in the PDF.
func TestSheetPrintsTheRecord(t *testing.T) {
	dir := t.TempDir()
	jobPath := filepath.Join(dir, "leat.toml")
	if err := os.WriteFile(jobPath, job.DemoTOML(), 0o644); err != nil {
		t.Fatal(err)
	}
	p, err := plan.Build(job.Demo())
	if err != nil {
		t.Fatal(err)
	}
	var coils []plan.Step
	for _, st := range p.Steps {
		if st.Coil != nil {
			coils = append(coils, st)
		}
	}
	a, b := coils[0], coils[1]
	s, _, _, err := journal.Open(journal.PathFor(jobPath), "sheet test")
	if err != nil {
		t.Fatal(err)
	}
	at := time.Date(2026, 11, 21, 10, 0, 0, 0, time.FixedZone("bench", 3600))
	const note = "17 fit on the last layer, not 18"
	// as the guide records them: the plan's fingerprint, then each entry
	// stamped with what its step is
	if err := s.Append(progress.FingerprintEvent(p)); err != nil {
		t.Fatal(err)
	}
	for _, e := range []journal.Event{
		{Time: at, Kind: journal.Done, Step: 1},
		{Time: at, Kind: journal.Done, Step: a.Index, Tooth: a.Coil.Tooth, Turns: a.Coil.Turns},
		{Time: at, Kind: journal.Done, Step: b.Index, Tooth: b.Coil.Tooth, Turns: b.Coil.Turns - 1},
		{Time: at, Kind: journal.Note, Step: b.Index, Tooth: b.Coil.Tooth, Note: note},
		// done, then undone: not printed as done
		{Time: at, Kind: journal.Done, Step: coils[2].Index, Tooth: coils[2].Coil.Tooth, Turns: 99},
		{Time: at.Add(time.Hour), Kind: journal.Undo, Step: coils[2].Index},
	} {
		if err := s.Append(progress.Stamp(p, e)); err != nil {
			t.Fatal(err)
		}
	}
	if err := s.Close(); err != nil {
		t.Fatal(err)
	}
	out := filepath.Join(dir, "pack.pdf")
	if code, _, stderr := runCLI(t, "sheet", jobPath, "-o", out); code != 0 {
		t.Fatalf("sheet JOB = exit %d (%s); want 0", code, stderr)
	}
	text := pdfText(t, out)
	for _, want := range []string{
		fmt.Sprintf("3 of %d steps done, 2 of 24 coils, as recorded on 2026-11-21.", demoSteps(t)),
		"note 2026-11-21: " + note,
		"\n17\nplan 18\n",    // coil B: 17 counted against 18
		"\n18\n2026-11-21\n", // coil A: 18 counted, done that day
	} {
		if !strings.Contains(text, want) {
			t.Errorf("sheet JOB with a record: PDF lacks %q", want)
		}
	}
	if strings.Contains(text, "\n99\n") {
		t.Errorf("sheet JOB with a record: the undone coil prints its 99 turns")
	}
	// the same record named with --progress beside another job file prints the same
	other := filepath.Join(dir, "copy.toml")
	os.WriteFile(other, job.DemoTOML(), 0o644)
	out2 := filepath.Join(dir, "again.pdf")
	if code, _, stderr := runCLI(t, "sheet", other, "--progress", journal.PathFor(jobPath), "-o", out2); code != 0 {
		t.Fatalf("sheet --progress = exit %d (%s); want 0", code, stderr)
	}
	if got := pdfText(t, out2); got != text {
		t.Errorf("sheet --progress FILE prints other text than the record beside the job")
	}
	// without a record the checklist is a blank form
	blank := filepath.Join(dir, "blank.toml")
	os.WriteFile(blank, job.DemoTOML(), 0o644)
	out3 := filepath.Join(dir, "blank.pdf")
	runCLI(t, "sheet", blank, "-o", out3)
	if got := pdfText(t, out3); strings.Contains(got, "steps done") || strings.Contains(got, note) {
		t.Errorf("sheet of a job without a record prints progress")
	}
}

// sheet --demo prints the bench's demo record; a torn last line is left out
// and said.
func TestSheetDemoRecord(t *testing.T) {
	state := t.TempDir()
	t.Setenv("XDG_STATE_HOME", state)
	rec, err := demoProgressPath()
	if err != nil {
		t.Fatal(err)
	}
	p, err := plan.Build(job.Demo())
	if err != nil {
		t.Fatal(err)
	}
	line, _ := journal.Line(progress.Stamp(p, journal.Event{Seq: 1, Time: time.Date(2026, 11, 22, 9, 0, 0, 0, time.UTC), Kind: journal.Done, Step: 1}))
	if err := os.WriteFile(rec, append(line, []byte(`{"seq":2,"kind":"do`)...), 0o644); err != nil {
		t.Fatal(err)
	}
	out := filepath.Join(t.TempDir(), "pack.pdf")
	code, _, stderr := runCLI(t, "sheet", "--demo", "-o", out)
	if code != 0 {
		t.Fatalf("sheet --demo = exit %d (%s); want 0", code, stderr)
	}
	if !strings.Contains(stderr, "cut short") {
		t.Errorf("sheet --demo over a torn record: stderr %q does not say the last line was left out", stderr)
	}
	if text := pdfText(t, out); !strings.Contains(text, fmt.Sprintf("1 of %d steps done, 0 of 24 coils, as recorded on 2026-11-22.", demoSteps(t))) {
		t.Errorf("sheet --demo does not print the demo record")
	}
}

// demoSteps is the number of steps of the demo plan.
func demoSteps(t *testing.T) int {
	t.Helper()
	p, err := plan.Build(job.Demo())
	if err != nil {
		t.Fatal(err)
	}
	return len(p.Steps)
}

// sheet never writes over the job, its record or the record's lock, however
// the name is written (a symbolic link, another spelling of the path).
func TestSheetRefusesJobAndRecord(t *testing.T) {
	dir := t.TempDir()
	jobPath := filepath.Join(dir, "leat.toml")
	os.WriteFile(jobPath, job.DemoTOML(), 0o644)
	rec := journal.PathFor(jobPath)
	os.WriteFile(rec, nil, 0o644)
	link := filepath.Join(dir, "link.pdf")
	if err := os.Symlink(rec, link); err != nil {
		t.Skip("no symbolic links here:", err)
	}
	other := filepath.Join(dir, "elsewhere.progress")
	os.WriteFile(other, nil, 0o644)
	cases := []struct{ name, out string }{
		{"the job", jobPath},
		{"the job spelt otherwise", filepath.Join(dir, ".", "..", filepath.Base(dir), "leat.toml")},
		{"the record", rec},
		{"the record through a link", link},
		{"the record's lock, not there yet", journal.LockPathFor(rec)},
		{"--progress", other},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			before, _ := os.ReadFile(c.out)
			args := []string{"sheet", jobPath, "-o", c.out}
			if c.name == "--progress" {
				args = append(args, "--progress", other)
			}
			code, _, stderr := runCLI(t, args...)
			if code != 2 || strings.Count(strings.TrimSpace(stderr), "\n") != 0 || !strings.Contains(stderr, "would destroy") {
				t.Errorf("sheet -o %s = exit %d, %q; want 2 and one line", c.out, code, stderr)
			}
			if after, _ := os.ReadFile(c.out); string(after) != string(before) {
				t.Errorf("sheet -o %s changed the file", c.out)
			}
		})
	}
}
