package job_test

import (
	"errors"
	"path/filepath"
	"testing"

	"coilwright/winding/job"
	"coilwright/winding/job/jobtest"
	"coilwright/winding/plan"
)

// FuzzParse feeds the parser arbitrary bytes, seeded with the job files under
// testdata/job/. It must never panic: every input is either a valid job (which
// then builds a plan or is refused with a FieldError) or a *job.FieldError.
func FuzzParse(f *testing.F) {
	for _, data := range jobtest.Seeds(f) {
		f.Add(data)
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		j, err := job.Parse(data, "fuzz.toml")
		if err != nil {
			var fe *job.FieldError
			if !errors.As(err, &fe) {
				t.Fatalf("Parse error %T %v; want *job.FieldError", err, err)
			}
			if fe.Field == "" || fe.Reason == "" {
				t.Fatalf("Parse error %q names no field or reason", err)
			}
			return
		}
		if err := j.Validate(); err != nil {
			t.Fatalf("Validate after Parse = %v; want nil", err)
		}
		if len(data) > 4096 {
			return // keep each run quick; layouts are benchmarked elsewhere
		}
		if _, err := plan.Build(j); err != nil {
			var fe *job.FieldError
			if !errors.As(err, &fe) {
				t.Fatalf("plan.Build error %T %v; want *job.FieldError", err, err)
			}
		}
	})
}

// The seeds that are not valid jobs must be refused with a named field.
func TestSeedFiles(t *testing.T) {
	cases := []struct {
		file  string
		field string // "" for a valid job
	}{
		{"demo.toml", ""},
		{"template.toml", ""},
		{"awg_area_slot.toml", ""},
		{"delta_paths_airgap.toml", ""},
		{"single_layer_perpole.toml", ""},
		{"unknown_key.toml", "winding.pole"},
		{"truncated.toml", "(syntax)"},
		{"mistyped_value.toml", "winding.slots"},
	}
	for _, c := range cases {
		j, err := job.Load(filepath.Join(jobtest.Dir(t), c.file))
		if c.field == "" {
			if err != nil {
				t.Errorf("Load(%s) = %v; want a valid job", c.file, err)
				continue
			}
			if _, err := plan.Build(j); err != nil {
				t.Errorf("plan.Build(%s) = %v; want a plan", c.file, err)
			}
			continue
		}
		var fe *job.FieldError
		if !errors.As(err, &fe) || fe.Field != c.field || fe.Line == 0 {
			t.Errorf("Load(%s) = %v; want a FieldError on %s with its line", c.file, err, c.field)
		}
	}
}
