package printout

import "testing"

// TestSentence: a sentence starts with a capital letter, but a job-file key
// at its start keeps the spelling the job file needs.
func TestSentence(t *testing.T) {
	for _, c := range []struct{ in, want string }{
		{"phases balanced", "Phases balanced"},
		{"width_top_mm + tooth_width_mm = 12.0 mm is more than the tooth pitch", "width_top_mm + tooth_width_mm = 12.0 mm is more than the tooth pitch"},
		{"machine.yoke_thickness_mm is missing", "machine.yoke_thickness_mm is missing"},
		{"ωL limits the current", "ωL limits the current"},
		{"µF of the bus", "µF of the bus"},
		{"", ""},
	} {
		if got := sentence(c.in); got != c.want {
			t.Errorf("sentence(%q) = %q, want %q", c.in, got, c.want)
		}
	}
}
