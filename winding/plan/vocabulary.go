package plan

import (
	"math"
	"sort"
	"strconv"
	"strings"
)

// Unit is the unit of a test's limit or of one of its readings, written as
// its SI symbol (or the trade's: rpm). The same symbols appear in the plan's
// JSON, its text, the bench guide and the printed record.
type Unit string

// The units of the test plan.
const (
	UnitOhm     Unit = "Ω"  // winding resistance; FormatValue writes mΩ and kΩ where they read better
	UnitMegaohm Unit = "MΩ" // insulation resistance; FormatValue writes kΩ and GΩ where they read better
	UnitVolt    Unit = "V"
	UnitCelsius Unit = "°C"
	UnitPercent Unit = "%"
	UnitSecond  Unit = "s"
	UnitRPM     Unit = "rpm"
	UnitRatio   Unit = ""     // a plain number, such as the polarization index
	UnitPole    Unit = "pole" // N or S, seen at a tooth face (polarity test)
	// UnitPassFail is a yes/no result typed as a number: 1 when the test held
	// (no breakdown), 0 when it did not.
	UnitPassFail Unit = "pass/fail"
)

// Compare says how a test's readings are judged against its Limit.
type Compare string

// The ways a limit is applied.
const (
	AtMost  Compare = "max"   // every reading at most Limit
	AtLeast Compare = "min"   // every reading at least Limit
	InBand  Compare = "band"  // within LowPercent .. HighPercent of the expected value (Limit is the larger, rounded)
	Matches Compare = "match" // every reading is what the plan says (the pole of each tooth)
)

// sig writes v with n significant figures in plain decimal notation (never
// an exponent) and without trailing zeros after the point: 0.13920 → 0.1392,
// 24.00 → 24, 1500 → 1500.
func sig(v float64, n int) string {
	if v == 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		return strconv.FormatFloat(v, 'f', -1, 64)
	}
	dec := n - 1 - int(math.Floor(math.Log10(math.Abs(v))))
	dec = max(dec, 0)
	s := strconv.FormatFloat(v, 'f', dec, 64)
	if strings.Contains(s, ".") {
		// Trailing zeros go only where the value is that round number
		// (a limit of 5 MΩ, a reading typed as 0.279 Ω); a computed
		// 145.98 mΩ keeps its "146.0", so it does not look less
		// certain than its neighbour's 145.6.
		t := strings.TrimRight(strings.TrimRight(s, "0"), ".")
		if r, err := strconv.ParseFloat(t, 64); err == nil && math.Abs(r-v) <= 1e-9*math.Abs(v) {
			s = t
		}
	}
	return s
}

// FormatValue writes a value with its unit the one way the plan text, the
// bench guide, the check and the printed pack all use: four significant
// figures and the SI symbol, with the prefix that keeps the number readable
// (0.1392 Ω → "139.2 mΩ", 2400 MΩ → "2.4 GΩ"); temperatures to 0.1 °C,
// speeds to 1 rpm. An open circuit (+Inf) is "OL", as a meter shows it.
func FormatValue(v float64, u Unit) string {
	if math.IsInf(v, 1) {
		return "OL"
	}
	a := math.Abs(v)
	switch u {
	case UnitOhm:
		switch {
		case a > 0 && a < 1:
			return sig(v*1000, 4) + " mΩ"
		case a >= 1e6:
			return sig(v/1e6, 4) + " MΩ"
		case a >= 1e4:
			return sig(v/1000, 4) + " kΩ"
		}
		return sig(v, 4) + " Ω"
	case UnitMegaohm:
		switch {
		case a > 0 && a < 1:
			return sig(v*1000, 4) + " kΩ"
		case a >= 1000:
			return sig(v/1000, 4) + " GΩ"
		}
		return sig(v, 4) + " MΩ"
	case UnitCelsius:
		return sig(math.Round(v*10)/10, 6) + " °C"
	case UnitRPM:
		return strconv.FormatFloat(math.Round(v), 'f', 0, 64) + " rpm"
	case UnitPercent:
		return sig(v, 3) + " %"
	case UnitPole:
		if pole, ok := PoleFromValue(v); ok {
			return string(pole)
		}
		return "unsure"
	case UnitPassFail:
		if v >= 1 {
			return "held"
		}
		return "broke down"
	case UnitRatio:
		return sig(v, 3)
	}
	return sig(v, 4) + " " + string(u)
}

// LimitText says a test's acceptance in words, the one way the plan text,
// the bench guide and the printed pack show it: "at least 5 MΩ at 500 V",
// "at most 1.25 Ω", "within −6.9 % .. +7.1 % of expected".
func LimitText(t Test) string {
	at := ""
	if t.Voltage > 0 {
		at = " at " + FormatValue(t.Voltage, UnitVolt)
		if t.VoltageKind != "" {
			at += " " + t.VoltageKind
		}
	}
	switch t.Compare {
	case AtLeast:
		return "at least " + FormatValue(t.Limit, t.Unit) + at
	case AtMost:
		if f, ok := t.ownBoundFactor(); ok {
			// each reading against its own expected value (the continuity of
			// each path): one figure for all would pass a path over its own
			// bound
			return "each at most " + sig(100*f, 3) + " % of its expected value" + at
		}
		return "at most " + FormatValue(t.Limit, t.Unit) + at
	case InBand:
		if t.LowPercent != 0 || t.HighPercent != 0 {
			return "within " + BandText(t.LowPercent, t.HighPercent) + " of expected" + at
		}
		return "within ±" + FormatValue(t.Limit, UnitPercent) + " of expected" + at
	case Matches:
		return "every tooth shows its " + string(t.Unit) + " of the plan"
	}
	if t.Limit != 0 {
		return FormatValue(t.Limit, t.Unit) + at
	}
	return strings.TrimSpace(at)
}

// SignedPercent writes a deviation or a band edge in per cent with its
// sign, the minus as a true minus sign, to 0.1 % (−6.8 %, +7.0 %, not +7 %;
// 0.0 % without a sign).
// The plan's limits, the check's findings and the bench all write them so.
func SignedPercent(v float64) string {
	if math.Round(v*10) == 0 {
		return "0.0 %" // no sign on what rounds to nothing (not −0.0 %)
	}
	if v < 0 {
		return "−" + strconv.FormatFloat(-v, 'f', 1, 64) + " %"
	}
	return "+" + strconv.FormatFloat(v, 'f', 1, 64) + " %"
}

// BandText writes a resistance band as its two edges: "−6.9 % .. +7.1 %".
func BandText(low, high float64) string { return SignedPercent(low) + " .. " + SignedPercent(high) }

// FormatReadings writes recorded values of a test by the names and units of
// its reading schema, in the schema's order: "U–V 278.4 mΩ, V–W 278.6 mΩ,
// W–U 279 mΩ, winding temperature 20 °C". Values under keys the schema does
// not know (a record from another version of the plan) follow, sorted, as
// key and number. Keys without a value are left out.
func FormatReadings(rs []Reading, values map[string]float64) string {
	var parts []string
	seen := map[string]bool{}
	for _, r := range rs {
		v, ok := values[r.Key]
		if !ok {
			continue
		}
		seen[r.Key] = true
		parts = append(parts, r.Label+" "+FormatValue(v, r.Unit))
	}
	var rest []string
	for k := range values {
		if !seen[k] {
			rest = append(rest, k)
		}
	}
	sort.Strings(rest)
	for _, k := range rest {
		parts = append(parts, k+" "+sig(values[k], 5))
	}
	return strings.Join(parts, ", ")
}

// ImbalancePercent is the imbalance of phase values as EASA AR100 states
// it: the largest deviation of any value from their mean, over the mean, in
// per cent. 0.1392, 0.1392 and 0.14268 Ω: mean 0.14036, largest deviation
// 0.00232, 1.65 %. It returns the mean too; with no values or a mean not
// above zero the percentage is 0.
func ImbalancePercent(v []float64) (pct, mean float64) {
	if len(v) == 0 {
		return 0, 0
	}
	for _, x := range v {
		mean += x
	}
	mean /= float64(len(v))
	if mean <= 0 {
		return 0, mean
	}
	var dev float64
	for _, x := range v {
		dev = math.Max(dev, math.Abs(x-mean))
	}
	return 100 * dev / mean, mean
}

// BoundOf is the figure reading i of t is judged against: for an "at most"
// test whose readings carry their own window (each path of the continuity
// test against its own expected resistance) the top of that window, else
// the test's limit. The bench, the check and the printed record judge by it.
func (t Test) BoundOf(i int) float64 {
	if t.Compare == AtMost && i >= 0 && i < len(t.Readings) {
		if e := t.Readings[i].Expected; e != nil && e.High > 0 {
			return e.High
		}
	}
	return t.Limit
}

// ownBoundFactor reports whether every reading of an "at most" test has
// its own bound at one common multiple of its expected value, and that
// multiple.
func (t Test) ownBoundFactor() (float64, bool) {
	if t.Compare != AtMost || len(t.Readings) == 0 {
		return 0, false
	}
	f := 0.0
	for _, r := range t.Readings {
		e := r.Expected
		if e == nil || e.High <= 0 || e.Value <= 0 {
			return 0, false
		}
		g := e.High / e.Value
		if f != 0 && math.Abs(g-f) > 1e-9*f {
			return 0, false
		}
		f = g
	}
	return f, true
}
