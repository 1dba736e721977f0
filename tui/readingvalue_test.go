package tui

import (
	"math"
	"strings"
	"testing"

	"coilwright/winding/plan"
)

func TestReadingValue(t *testing.T) {
	ohm := field{label: "U–V", u: plan.UnitOhm, expected: &plan.Expected{Value: 0.2855, Low: 0.2659, High: 0.3058}}
	meg := field{label: "IR 1 min", u: plan.UnitMegaohm}
	volt := field{label: "test V", u: plan.UnitVolt}
	temp := field{label: "temp", u: plan.UnitCelsius}
	tests := []struct {
		txt  string
		f    field
		want float64
		err  string // a word of the error; "" for none
	}{
		{"0.2855", ohm, 0.2855, ""},
		{"0,2855", ohm, 0.2855, ""},
		{"285.5m", ohm, 0.2855, ""},
		{"285.5 mΩ", ohm, 0.2855, ""},
		{"285.5mohm", ohm, 0.2855, ""},
		{"285.5 m\u2126", ohm, 0.2855, ""}, // the ohm sign, as some keyboards give it
		{"285.5", ohm, 0, "about 1000 times the expected 285.5 mΩ"},
		{"285.5 Ω", ohm, 285.5, ""}, // typed with its unit it stands
		{"1.2k", ohm, 1200, ""},
		{"OL", ohm, 0, "open circuit"},
		{"abc", ohm, 0, "not a number"},
		{"-1", ohm, 0, "negative"},
		{"285.5 mV", ohm, 0, "not a unit here"},
		{"2.4 GΩ", meg, 2400, ""},
		{"500k", meg, 0.5, ""},
		{"200", meg, 200, ""},
		{"0.5 kV", volt, 500, ""},
		{"500V", volt, 500, ""},
		{"15 °C", temp, 15, ""},
		{"15C", temp, 15, ""},
		{"15 mC", temp, 0, "not a unit here"},
		{"2e3", ohm, 2000, ""},
		{"1e400", ohm, 0, "not a number"},
	}
	for _, tc := range tests {
		got, err := readingValue(tc.txt, tc.f)
		switch {
		case tc.err != "" && !strings.Contains(err, tc.err):
			t.Errorf("readingValue(%q, %s) error %q; want one saying %q", tc.txt, tc.f.u, err, tc.err)
		case tc.err == "" && err != "":
			t.Errorf("readingValue(%q, %s) error %q; want %g", tc.txt, tc.f.u, err, tc.want)
		case tc.err == "" && math.Abs(got-tc.want) > 1e-9*math.Max(1, tc.want):
			t.Errorf("readingValue(%q, %s) = %g; want %g", tc.txt, tc.f.u, got, tc.want)
		}
	}
}
