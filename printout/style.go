package printout

import (
	"fmt"
	"strings"
)

// Paper is a sheet size.
type Paper struct {
	Name string
	W, H float64 // mm, portrait
}

// Paper sizes: ISO 216 A4 and US Letter (ANSI/ASME Y14.1, 8.5 x 11 in).
var (
	A4     = Paper{"a4", 210, 297}
	Letter = Paper{"letter", 215.9, 279.4}
)

// PaperSizes lists the sizes the pack prints on, by name.
var PaperSizes = []Paper{A4, Letter}

// ParsePaper finds a paper size by name ("a4", "letter"; case does not
// matter).
func ParsePaper(name string) (Paper, error) {
	for _, p := range PaperSizes {
		if strings.EqualFold(p.Name, strings.TrimSpace(name)) {
			return p, nil
		}
	}
	return Paper{}, &OptionError{Field: "paper", Value: name, Reason: "unknown paper size", Want: "a4 or letter"}
}

// OptionError reports an option the printout cannot use.
type OptionError struct {
	Field, Value, Reason, Want string
}

func (e *OptionError) Error() string {
	return fmt.Sprintf("printout: %s %q: %s; use %s", e.Field, e.Value, e.Reason, e.Want)
}

// PhaseStyle is how one phase is marked in print. The colour is never the
// only code: the letter is printed beside every mark and the line pattern
// tells the phases apart on a monochrome printer.
type PhaseStyle struct {
	Name    string // phase letter
	Colour  Colour
	Pattern string // "solid", "dashed", "dotted", ...
	Dash    Dash
	Tint    Colour // light fill behind the letter
}

// Phase colours. The first three are the IEC 60445 (2017) colours for line
// conductors L1, L2, L3: brown, black, grey. IEC 60445 names no colour for a
// fourth or fifth phase; this project adds orange and violet, chosen away from
// blue (neutral) and green-and-yellow (protective earth), which IEC 60445
// reserves. Further phases repeat the colours with the dash-dot patterns.
var phaseColours = []struct {
	c    Colour
	tint Colour
}{
	{Colour{128, 64, 0}, Colour{240, 226, 210}},    // brown
	{Colour{0, 0, 0}, Colour{225, 225, 225}},       // black
	{Colour{128, 128, 128}, Colour{246, 246, 246}}, // grey
	{Colour{230, 115, 0}, Colour{253, 232, 205}},   // orange (project choice)
	{Colour{120, 40, 160}, Colour{236, 222, 243}},  // violet (project choice)
}

// Line patterns in mm: solid, dashed, dotted, dash-dot, dash-dot-dot and a long
// dash. Dotted uses round caps on a zero dash so dots stay round.
var phasePatterns = []struct {
	name string
	dash Dash
}{
	{"solid", nil},
	{"dashed", Dash{2.2, 1.2}},
	{"dotted", Dash{0, 1.1}},
	{"dash-dot", Dash{2.4, 0.9, 0, 0.9}},
	{"dash-dot-dot", Dash{2.4, 0.9, 0, 0.9, 0, 0.9}},
	{"long dash", Dash{4.5, 1.5}},
}

// StyleOf returns the print style of phase i of a winding. Phases 1..5 take a
// colour and a pattern each; beyond five the colours repeat and the patterns
// keep counting, so colour and pattern together stay distinct up to 30 phases.
func StyleOf(i int, name string) PhaseStyle {
	if i < 0 {
		i = 0
	}
	c := phaseColours[i%len(phaseColours)]
	p := phasePatterns[i%len(phasePatterns)]
	return PhaseStyle{Name: name, Colour: c.c, Tint: c.tint, Pattern: p.name, Dash: p.dash}
}

// Font sizes in points. Nothing on a sheet is set smaller than sizeMin:
// ISO 3098 lettering starts at a nominal height of 1.8 mm (from memory), and
// 7 pt is the smallest body size whose capitals in the Go fonts come near it.
const (
	sizeMin     = 7
	sizeTitle   = 15
	sizeHead    = 10.5
	sizeBody    = 8.5
	sizeSmall   = 7
	sizeTiny    = sizeMin
	marginMM    = 12
	lineWidthMM = 0.25
)

// colour names for the legend.
var colourNames = []string{"brown", "black", "grey", "orange", "violet"}

func colourName(i int) string { return colourNames[max(0, i)%len(colourNames)] }
