package tui

import (
	"fmt"
	"strconv"
	"strings"

	"github.com/charmbracelet/x/ansi"

	"coilwright/winding/plan"
)

// phaseIndex is the index of a phase name in the layout, -1 if unknown.
func (c *shared) phaseIndex(name string) int {
	if c.plan == nil || c.plan.Layout == nil {
		return -1
	}
	for i, n := range c.plan.Layout.PhaseNames {
		if n == name {
			return i
		}
	}
	return -1
}

// planName is the job's name for headings.
func (c *shared) planName() string {
	if c.plan == nil || c.plan.Name == "" {
		return "this stator"
	}
	return c.plan.Name
}

// wireText says which wire this coil takes and how much of it.
func (c *shared) wireText(cs *plan.CoilStep) string {
	if c.plan == nil {
		return ""
	}
	w := c.plan.Wire
	var b strings.Builder
	if w.BareDiameterMM > 0 {
		fmt.Fprintf(&b, "%.3g mm bare", w.BareDiameterMM)
		if w.AWG > 0 {
			fmt.Fprintf(&b, " (AWG %d)", w.AWG)
		}
	}
	if w.StrandsInHand > 1 {
		fmt.Fprintf(&b, ", %d strands in hand", w.StrandsInHand)
	}
	if cs.WireLengthM > 0 {
		if b.Len() > 0 {
			b.WriteString(", ")
		}
		fmt.Fprintf(&b, "about %.1f m on this coil", cs.WireLengthM)
	}
	return b.String()
}

// specText is the winding in the trade's short form with the rotor side,
// leaving out what the job's name already says (a name such as "24/28 outer
// rotor" would otherwise be repeated on the header).
func (c *shared) specText() string {
	if c.plan == nil || c.plan.Layout == nil {
		return ""
	}
	s := c.plan.Layout.Spec
	name := strings.ToLower(c.plan.Name)
	var parts []string
	if !strings.Contains(name, fmt.Sprintf("%d/%d", s.Slots, s.Poles)) && !strings.Contains(name, fmt.Sprintf("%d slots", s.Slots)) {
		parts = append(parts, fmt.Sprintf("%d slots / %d poles", s.Slots, s.Poles))
	}
	if r := string(c.plan.Rotor); r != "" && !strings.Contains(name, r+" rotor") && !strings.Contains(name, r+"-rotor") {
		parts = append(parts, r+" rotor")
	}
	return strings.Join(parts, ", ")
}

// ringCaption is written inside the ring; on the set-up step (i, 0-based)
// it says where slot 1 lies.
func (c *shared) ringCaption(i int) []string {
	if c.plan == nil || c.plan.Layout == nil {
		return nil
	}
	if s, ok := c.step(i); ok && s.Kind == plan.StepSetup {
		return []string{"slot 1 lies", "between", "tooth 1 and 2", "", "ring seen from", "the lead end,", "numbers ccw"}
	}
	s := c.plan.Layout.Spec
	out := []string{strconv.Itoa(s.Slots) + " slots", strconv.Itoa(s.Poles) + " poles"}
	if c.plan.Rotor != "" {
		out = append(out, string(c.plan.Rotor)+" rotor")
	}
	// The ring is the lead-end view, but the signs are senses seen from
	// the air gap: the caption says both, so no sign is read as an arrow.
	return append(out, "", "ring seen from", "the lead end,", "numbers ccw;", "+U cw, -U ccw", "seen from", "the air gap")
}

// joinColumns puts two blocks side by side with a gap, padding the left one
// to its widest line.
func joinColumns(left, right string, gap int) string {
	l := strings.Split(left, "\n")
	r := strings.Split(right, "\n")
	lw := 0
	for _, s := range l {
		lw = max(lw, ansi.StringWidth(s))
	}
	n := max(len(l), len(r))
	var b strings.Builder
	for i := 0; i < n; i++ {
		if i > 0 {
			b.WriteByte('\n')
		}
		ls := ""
		if i < len(l) {
			ls = l[i]
		}
		b.WriteString(ls)
		if i < len(r) {
			b.WriteString(strings.Repeat(" ", max(0, lw-ansi.StringWidth(ls))+gap))
			b.WriteString(r[i])
		}
	}
	return b.String()
}

// fit cuts a frame to w x h cells: at most h lines, each at most w wide.
func fit(s string, w, h int) string {
	if w <= 0 || h <= 0 {
		return ""
	}
	ls := strings.Split(s, "\n")
	if len(ls) > h {
		ls = ls[:h]
	}
	for i, l := range ls {
		if ansi.StringWidth(l) > w {
			ls[i] = ansi.Truncate(l, w, "")
		}
	}
	return strings.Join(ls, "\n")
}

// lipglossWidth is the display width of a styled string.
func lipglossWidth(s string) int { return ansi.StringWidth(s) }

// wrapPlain wraps a plain line to w columns.
func wrapPlain(s string, w int) []string {
	if w <= 0 {
		return nil
	}
	return strings.Split(ansi.Wrap(s, w, " "), "\n")
}
