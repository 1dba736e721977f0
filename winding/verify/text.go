package verify

import (
	"fmt"
	"strings"

	"coilwright/winding/plan"
)

// textWidth is the width findings are wrapped to.
const textWidth = 78

// Text renders the report for a terminal: the expected value and its band,
// the phases, the other tests, the findings, the cautions and the verdict.
// Plain text, no colour; every verdict is spelled out.
func (r *Report) Text() string {
	var b strings.Builder
	w := func(format string, a ...any) { fmt.Fprintf(&b, format, a...) }
	if len(r.Phases) > 0 {
		wiring := "two-wire"
		if r.FourWire {
			wiring = "four-wire"
		} else if r.LeadOhm > 0 {
			wiring = fmt.Sprintf("two-wire, leads %s subtracted", ohm(r.LeadOhm))
		}
		w("Resistance  %s winding, read %s (%s), winding at %.1f °C\n", r.Connection, r.Method, wiring, r.TemperatureC)
		w("  expected per phase  %s at 20 °C, %s at %.1f °C\n", ohm(r.Expected.At20C), ohm(r.Expected.AtTemp), r.TemperatureC)
		bd := r.Band
		w("  band                %s  (%s .. %s at 20 °C)\n", plan.BandText(bd.LowPercent, bd.HighPercent), ohm(bd.Low20C), ohm(bd.High20C))
		if bd.DiameterTolMM > 0 {
			w("                      wire %.3f ± %.3f mm (IEC 60317): %s; length estimate ± %.0f %%\n",
				bd.DiameterMM, bd.DiameterTolMM, plan.BandText(bd.DiameterPercent[0], bd.DiameterPercent[1]), bd.LengthPercent)
		} else {
			w("                      length estimate ± %.0f %% (no diameter tolerance in the plan)\n", bd.LengthPercent)
		}
		if len(r.Lines) > 0 {
			b.WriteString("  lines              ")
			for _, l := range r.Lines {
				v := ohm(l.Ohm)
				if l.Open {
					v = "open"
				}
				w("  %s %s", lineText(l.Lines), v)
			}
			b.WriteString("\n")
		}
		w("\n  phase  %12s  %12s  %9s  band\n", fmt.Sprintf("at %.1f °C", r.TemperatureC), "at 20 °C", "deviation")
		for _, p := range r.Phases {
			if p.Open {
				w("  %-5s  %12s  %12s  %9s  -\n", p.Phase, "open", "open", "-")
				continue
			}
			in := "outside"
			if p.InBand {
				in = "inside"
			}
			w("  %-5s  %12s  %12s  %9s  %s\n", p.Phase, ohm(p.OhmAtTemp), ohm(p.Ohm20C), plan.SignedPercent(p.DeviationPercent), in)
		}
		w("  imbalance %.2f %% (limit %.0f %%, EASA AR100)\n", r.ImbalancePercent, r.ImbalanceLimit)
	}
	if in := r.Insulation; in != nil {
		w("\nInsulation  IR after 1 min %s at %.0f V DC, %s at 40 °C (minimum %g MΩ)", mohm(in.IR1MOhm), in.Volts, mohm(in.IR1At40C), in.MinimumMOhm)
		if in.PI > 0 {
			w("; PI %.2f (minimum %.1f)", in.PI, in.PIMinimum)
		}
		b.WriteString("\n")
	}
	if hv := r.Withstand; hv != nil {
		res := "held"
		if !hv.Passed {
			res = "BROKE DOWN"
		}
		w("\nWithstand   %s at %s AC", res, plan.FormatValue(hv.Volts, plan.UnitVolt))
		if hv.Recommended > 0 {
			w("; the plan's test voltage %s AC (IEC 60034-1 clause 9.2), a repeat test at 80 %%", plan.FormatValue(hv.Recommended, plan.UnitVolt))
		}
		w(": %s", strings.ToUpper(string(hv.Verdict)))
		b.WriteString("\n")
	}
	if e := r.EMF; e != nil {
		w("\nBack-EMF    at %.0f rpm: UV %.3g V, VW %.3g V, WU %.3g V; imbalance %.1f %%", e.RPM, e.Lines[0], e.Lines[1], e.Lines[2], e.ImbalancePercent)
		if e.ExpectedLineV > 0 {
			w("; predicted %.3g V (%s)", e.ExpectedLineV, plan.SignedPercent(e.DeviationPercent))
		}
		b.WriteString("\n")
	}
	if pr := r.Polarity; pr != nil {
		if b.Len() > 0 {
			b.WriteString("\n")
		}
		b.WriteString(pr.text())
	}
	b.WriteString("\nFindings\n")
	for _, f := range r.Findings {
		head := strings.ToUpper(string(f.Severity))
		if f.Phase != "" {
			head += " " + f.Phase
		}
		wrap(&b, fmt.Sprintf("  %-6s ", head), f.Test+": "+f.Message)
	}
	if len(r.Resolution) > 0 {
		b.WriteString("\nWhat these tests can see on this job\n")
		for _, x := range r.Resolution {
			wrap(&b, "  ", x.Test+": "+x.Text)
		}
	}
	if len(r.Cautions) > 0 {
		b.WriteString("\nCautions\n")
		for _, c := range r.Cautions {
			wrap(&b, "  ! ", c)
		}
	}
	w("\nVerdict: %s\n", strings.ToUpper(string(r.Verdict)))
	return b.String()
}

// ohm writes a resistance the one way the plan, the bench and the pack do.
func ohm(v float64) string { return plan.FormatValue(v, plan.UnitOhm) }

// wrap writes text after head, wrapped to textWidth with a hanging indent.
func wrap(b *strings.Builder, head, text string) {
	indent := strings.Repeat(" ", len([]rune(head)))
	line := head
	n := len([]rune(head))
	start := true
	for _, word := range unitWords(text) {
		wl := len([]rune(word))
		if !start && n+1+wl > textWidth {
			b.WriteString(line + "\n")
			line, n, start = indent, len([]rune(indent)), true
		}
		if !start {
			line += " "
			n++
		}
		line += word
		n += wl
		start = false
	}
	b.WriteString(line + "\n")
}

// units are kept on the line of the number before them.
var units = map[string]bool{"%": true, "°C": true, "Ω": true, "mΩ": true, "MΩ": true, "GΩ": true, "kΩ": true,
	"V": true, "mm": true, "rpm": true, "W": true, "×": true}

func unitWords(text string) []string {
	var out []string
	for _, w := range strings.Fields(text) {
		if n := len(out); n > 0 && units[strings.TrimRight(w, ",;:.)")] {
			out[n-1] += " " + w
			continue
		}
		out = append(out, w)
	}
	return out
}

// lineText writes a pair of line leads as the plan's readings name them,
// "U–V" for the report's "UV".
func lineText(lines string) string {
	r := []rune(lines)
	if len(r) != 2 {
		return lines
	}
	return string(r[0]) + "–" + string(r[1])
}
