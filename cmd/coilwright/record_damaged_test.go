package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"coilwright/winding/job"
	"coilwright/winding/journal"
)

// A record damaged in the middle or at its last line is refused by every
// command that reads it, with its line and how to go on, and left as it is.
// check --record still shows its verdict and says it was not recorded.
func TestDamagedRecordRefusedWithTheWayOn(t *testing.T) {
	good := `{"seq":1,"time":"2025-03-08T09:00:00Z","kind":"done","step":1}` + "\n"
	cases := []struct {
		name, data, where string
	}{
		{"middle", good + "{\"seq\":2,\"kind\":\n" + strings.Replace(good, `"seq":1`, `"seq":3`, 1), "line 2 of 3"},
		{"last", good + "{\"seq\":2,\x01}\n", "its last line, 2"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			dir := t.TempDir()
			jobPath := filepath.Join(dir, "leat.toml")
			if err := os.WriteFile(jobPath, job.DemoTOML(), 0o644); err != nil {
				t.Fatal(err)
			}
			rec := journal.PathFor(jobPath)
			if err := os.WriteFile(rec, []byte(c.data), 0o644); err != nil {
				t.Fatal(err)
			}
			runs := []struct {
				args   []string
				code   int
				stdout string
			}{
				{[]string{"sheet", jobPath, "-o", filepath.Join(dir, "pack.pdf")}, 2, ""},
				{[]string{"bench", jobPath}, 2, ""},
				{append([]string{"check", jobPath, "--four-wire", "--record"}, demoLines(t, 21, [3]float64{1, 1, 1})...), 1, "Verdict: PASS"},
			}
			for _, r := range runs {
				code, out, errs := runCLI(t, r.args...)
				if code != r.code || strings.Count(strings.TrimSpace(errs), "\n") != 0 {
					t.Errorf("%s = exit %d, %q; want %d and one line", r.args[0], code, errs, r.code)
				}
				for _, want := range []string{c.where, "kept exactly as it is", "delete line 2", ".damaged", "fresh, empty record"} {
					if !strings.Contains(errs, want) {
						t.Errorf("%s says %q\nlacking %q", r.args[0], errs, want)
					}
				}
				if !strings.Contains(out, r.stdout) {
					t.Errorf("%s printed %q; want %q", r.args[0], out, r.stdout)
				}
				if r.args[0] == "check" && !strings.Contains(errs, "NOT recorded") {
					t.Errorf("check --record says %q; want it to say the check was not recorded", errs)
				}
				if b, _ := os.ReadFile(rec); string(b) != c.data {
					t.Fatalf("%s changed the damaged record", r.args[0])
				}
			}
			if _, err := os.Stat(filepath.Join(dir, "pack.pdf")); err == nil {
				t.Errorf("sheet wrote a pack from a damaged record")
			}
		})
	}
}

// check --record says which tests it filed on which steps; with the record
// held by a guide it still prints its verdict, exits 1 and says how to go on.
func TestCheckRecordSaysWhatItFiled(t *testing.T) {
	rec := filepath.Join(t.TempDir(), "demo.progress")
	args := append([]string{"check", "--demo", "--four-wire", "--record", "--progress", rec}, demoLines(t, 21, [3]float64{1, 1, 1})...)
	code, out, errs := runCLI(t, args...)
	if code != 0 || !strings.Contains(out, "Verdict: PASS") {
		t.Fatalf("check --record = exit %d, %q", code, errs)
	}
	for _, want := range []string{"recorded in " + rec, ", resistance of each phase: PASS", ", resistance balance: PASS"} {
		if !strings.Contains(errs, want) {
			t.Errorf("check --record says %q; want %q in it", errs, want)
		}
	}
	before, _ := os.ReadFile(rec)
	held, _, _, err := journal.Open(rec, "bench")
	if err != nil {
		t.Fatal(err)
	}
	defer held.Close()
	code, out, errs = runCLI(t, args...)
	if code != 1 || !strings.Contains(out, "Verdict: PASS") || strings.Count(strings.TrimSpace(errs), "\n") != 0 {
		t.Errorf("check --record on a held record = exit %d, stdout %q, stderr %q; want 1, the verdict shown, one line", code, out, errs)
	}
	for _, want := range []string{`"bench"`, "quit it", "same check again", "NOT recorded"} {
		if !strings.Contains(errs, want) {
			t.Errorf("check --record on a held record says %q; want %q in it", errs, want)
		}
	}
	if after, _ := os.ReadFile(rec); string(after) != string(before) {
		t.Errorf("the held record was changed")
	}
}

// No command writes its output over a progress record, of its own job or of
// another, even with --force: the work in it cannot be made again.
func TestOutputNeverOverARecord(t *testing.T) {
	dir := t.TempDir()
	jobPath := filepath.Join(dir, "leat.toml")
	if err := os.WriteFile(jobPath, job.DemoTOML(), 0o644); err != nil {
		t.Fatal(err)
	}
	other := filepath.Join(dir, "another-stator.progress")
	data := `{"seq":1,"time":"2025-03-08T09:00:00Z","kind":"done","step":1}` + "\n" + `{"seq":2,"time":"2025-03-08T09:01:00Z","kind":"done","step":2}` + "\n"
	if err := os.WriteFile(other, []byte(data), 0o644); err != nil {
		t.Fatal(err)
	}
	for _, args := range [][]string{
		{"new", "--demo", "--force", "-o", other},
		{"new", "--force", "-o", other},
		{"sheet", jobPath, "-o", other},
	} {
		code, _, errs := runCLI(t, args...)
		if code != 2 || !strings.Contains(errs, "progress record (2 entries") || strings.Count(strings.TrimSpace(errs), "\n") != 0 {
			t.Errorf("%v = exit %d, %q; want 2 and one line naming the record", args, code, errs)
		}
		if b, _ := os.ReadFile(other); string(b) != data {
			t.Fatalf("%v changed the record", args)
		}
	}
	// A file that is not a record is overwritten with --force as before.
	pdf := filepath.Join(dir, "old.toml")
	os.WriteFile(pdf, []byte("%PDF-1.4 not a record\n"), 0o644)
	if code, _, errs := runCLI(t, "new", "--demo", "--force", "-o", pdf); code != 0 {
		t.Errorf("new --force over a non-record = exit %d, %q; want 0", code, errs)
	}
}
