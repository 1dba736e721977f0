package tui

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"coilwright/winding/plan"
)

// A reading typed as the meter shows it: a number, with a comma or a point,
// in the field's unit; for resistance and voltage also with a metric prefix
// and the unit, as a meter's display reads ("285.5m", "285.5 mΩ", "2.4 GΩ",
// "0.5 kV"). A plain number about a thousand times the expected value (or a
// thousandth of it) is refused with a word on the prefix: the commonest slip
// is a milliohm reading typed as ohms. Typed with its unit it stands.

// prefixes are the metric prefixes a meter shows.
var prefixes = map[string]float64{"": 1, "m": 1e-3, "u": 1e-6, "µ": 1e-6, "μ": 1e-6, "k": 1e3, "K": 1e3, "M": 1e6, "G": 1e9}

// unitSymbols are the ways the unit of a field may be typed after the
// number, prefix apart; the scale is that of the symbol in the field's unit
// (an ohm is a millionth of the megohm field's unit).
func unitSymbols(u plan.Unit) (symbols []string, scale float64) {
	switch u {
	case plan.UnitOhm:
		return []string{"Ω", "\u2126", "ohms", "ohm", "R"}, 1
	case plan.UnitMegaohm:
		return []string{"Ω", "\u2126", "ohms", "ohm", "R"}, 1e-6
	case plan.UnitVolt:
		return []string{"V", "v"}, 1
	case plan.UnitCelsius:
		return []string{"°C", "°", "C", "c"}, 1
	case plan.UnitSecond:
		return []string{"s"}, 1
	case plan.UnitRPM:
		return []string{"rpm"}, 1
	case plan.UnitPercent:
		return []string{"%"}, 1
	}
	return nil, 1
}

// readingValue reads one field's text in the field's unit; the error says
// why not and what would do.
func readingValue(txt string, f field) (float64, string) {
	txt = strings.TrimSpace(strings.ReplaceAll(txt, ",", "."))
	if strings.EqualFold(txt, "ol") || strings.EqualFold(txt, "open") {
		return 0, "OL is an open circuit: the path is broken or a lead is off; find the break before going on"
	}
	n := numberPrefix(txt)
	v, err := strconv.ParseFloat(txt[:n], 64)
	if n == 0 || err != nil || math.IsNaN(v) || math.IsInf(v, 0) || math.Abs(v) > 1e15 {
		return 0, fmt.Sprintf("%q is not a number (use digits and a point, e.g. 1.25)", txt)
	}
	if v < 0 {
		return 0, fmt.Sprintf("%s is negative; readings here are magnitudes", txt)
	}
	rest := strings.TrimSpace(txt[n:])
	if rest == "" {
		return v, thousandfold(v, f)
	}
	symbols, scale := unitSymbols(f.u)
	for _, sym := range symbols {
		if p, ok := strings.CutSuffix(rest, sym); ok {
			mult, known := prefixes[strings.TrimSpace(p)]
			if !known || (mult != 1 && f.u != plan.UnitOhm && f.u != plan.UnitMegaohm && f.u != plan.UnitVolt) {
				break
			}
			return v * mult * scale, ""
		}
	}
	if mult, ok := prefixes[rest]; ok && (f.u == plan.UnitOhm || f.u == plan.UnitMegaohm || f.u == plan.UnitVolt) {
		return v * mult * scale, ""
	}
	return 0, fmt.Sprintf("%q: %q is not a unit here; type the number in %s (or with m, k, M as the meter shows)", txt, rest, unitName(f))
}

// numberPrefix is the length of the decimal number at the start of s.
func numberPrefix(s string) int {
	i := 0
	if i < len(s) && (s[i] == '+' || s[i] == '-') {
		i++
	}
	digits := false
	for i < len(s) && (s[i] >= '0' && s[i] <= '9' || s[i] == '.') {
		digits = digits || s[i] != '.'
		i++
	}
	if !digits {
		return 0
	}
	// An exponent only when digits follow: "2e3", not the "e" of a unit.
	if i+1 < len(s) && (s[i] == 'e' || s[i] == 'E') {
		j := i + 1
		if j < len(s) && (s[j] == '+' || s[j] == '-') {
			j++
		}
		if j < len(s) && s[j] >= '0' && s[j] <= '9' {
			for j < len(s) && s[j] >= '0' && s[j] <= '9' {
				j++
			}
			i = j
		}
	}
	return i
}

// thousandfold refuses a plain number about a thousand times the expected
// value or a thousandth of it: a prefix slipped.
func thousandfold(v float64, f field) string {
	e := f.expected
	if e == nil || e.Value <= 0 || v <= 0 {
		return ""
	}
	r := v / e.Value
	exp := plan.FormatValue(e.Value, f.u)
	got := plan.FormatValue(v, f.u)
	switch {
	case r >= 300 && r <= 3000:
		return fmt.Sprintf("%s is about 1000 times the expected %s: a milli reading typed as %s? Type it with its prefix (%gm), or with the unit (%g %s) if the meter really shows that", got, exp, unitName(f), v, v, f.u)
	case r >= 1.0/3000 && r <= 1.0/300:
		return fmt.Sprintf("%s is about a thousandth of the expected %s: type it with its prefix (%gk), or with the unit (%g %s) if the meter really shows that", got, exp, v, v, f.u)
	}
	return ""
}

// unitName is the field's unit for a message.
func unitName(f field) string {
	if f.u == "" {
		return "plain numbers"
	}
	return string(f.u)
}
