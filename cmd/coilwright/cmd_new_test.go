package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"coilwright/winding/job"
)

func TestNewWritesAndRefusesToOverwrite(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "job.toml")
	if code, _, errs := runCLI(t, "new", "-o", path); code != 0 {
		t.Fatalf("new -o job.toml = %d (%s); want 0", code, errs)
	}
	got, _ := os.ReadFile(path)
	if string(got) != string(job.TemplateTOML()) {
		t.Errorf("new -o wrote %d bytes; want the template", len(got))
	}
	code, _, errs := runCLI(t, "new", "--demo", "-o", path)
	if code != 2 || !strings.Contains(errs, "already exists") || !strings.Contains(errs, "--force") {
		t.Errorf("new over an existing file = %d %q; want 2 naming --force", code, errs)
	}
	if code, _, errs := runCLI(t, "new", "--demo", "--force", "-o", path); code != 0 {
		t.Errorf("new --demo --force = %d (%s); want 0", code, errs)
	}
	got, _ = os.ReadFile(path)
	if string(got) != string(job.DemoTOML()) {
		t.Errorf("new --demo --force did not write the demo")
	}
	// The template is a working job file.
	if code, _, errs := runCLI(t, "new", "-o", filepath.Join(dir, "t.toml")); code != 0 {
		t.Fatalf("new = %d (%s)", code, errs)
	}
	if code, out, errs := runCLI(t, "plan", filepath.Join(dir, "t.toml")); code != 0 || !strings.Contains(out, "Steps") {
		t.Errorf("plan of the template = %d (%s); want a plan", code, errs)
	}
}

func TestNewRefusals(t *testing.T) {
	cases := []struct {
		name string
		args []string
		want string
	}{
		{"no output", []string{"new"}, "-o FILE"},
		{"stray argument", []string{"new", "x.toml"}, "accepts 0 arg"},
		{"missing directory", []string{"new", "-o", filepath.Join(t.TempDir(), "no", "such", "x.toml")}, "cannot write"},
	}
	for _, c := range cases {
		code, _, errs := runCLI(t, c.args...)
		if code != 2 || !strings.Contains(errs, c.want) {
			t.Errorf("%s: %v = %d %q; want 2 containing %q", c.name, c.args, code, errs, c.want)
		}
	}
	code, out, _ := runCLI(t, "new", "--demo", "-o", "-")
	if code != 0 || out != string(job.DemoTOML()) {
		t.Errorf("new --demo -o - = %d, %d bytes; want the demo on stdout", code, len(out))
	}
}
