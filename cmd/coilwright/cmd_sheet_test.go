package main

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

func TestSheetDemo(t *testing.T) {
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
