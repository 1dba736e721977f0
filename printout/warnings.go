package printout

import (
	"strings"
)

// layoutWarningTitles put the layout's warning codes in words.
var layoutWarningTitles = map[string]string{
	"low-winding-factor": "Low winding factor",
	"q-out-of-range":     "Slots per pole and phase out of the usual range",
	"sub-harmonic":       "Sub-harmonic",
	"unbalanced-pull":    "Unbalanced radial pull",
}

// planWarningTitles put the subject a plan warning starts with ("fill:",
// "slot:") in words.
var planWarningTitles = map[string]string{
	"fill":    "Overfill",
	"slot":    "Slot",
	"wire":    "Wire",
	"current": "Current density",
	"delta":   "Delta connection",
}

// warning is one warning of the plan as the first sheet prints it.
type warning struct{ title, text string }

// warnings lists every warning of the plan, the layout's first, each with a
// title in words.
func (b *builder) warnings() []warning {
	var out []warning
	for _, w := range b.p.Layout.Warnings {
		t := layoutWarningTitles[w.Code]
		if t == "" {
			t = sentence(strings.ReplaceAll(w.Code, "-", " "))
		}
		out = append(out, warning{t, sentence(w.Message)})
	}
	for _, w := range b.p.Warnings {
		t, text := "Note", w
		if k, rest, ok := strings.Cut(w, ": "); ok && !strings.Contains(k, " ") {
			t, text = planWarningTitles[k], rest
			if t == "" {
				t = sentence(k)
			}
		}
		out = append(out, warning{t, sentence(text)})
	}
	return out
}

// warningsHeight is the height of the warnings box of width w, 0 when the
// plan has no warning.
func (b *builder) warningsHeight(w float64) float64 {
	ws := b.warnings()
	if len(ws) == 0 {
		return 0
	}
	h := 8.5
	for _, x := range ws {
		h += paraHeight(w-14, sizeSmall, Regular, x.title+": "+x.text) + 0.6
	}
	return h
}

// warningsBox prints every warning of the plan in a ruled box at y with the
// warning sign, and returns the y below it.
func (b *builder) warningsBox(c *canvas, y float64) float64 {
	ws := b.warnings()
	if len(ws) == 0 {
		return y
	}
	x0, w := float64(marginMM), b.width()
	h := b.warningsHeight(w)
	c.box(x0, y, w, h, Pen{Width: 0.6, Colour: Black}, &Fill{Colour{255, 248, 215}})
	c.warningSign(x0+5.5, y+1.8, 7)
	c.text(x0+11, y+5.2, sizeBody, Bold, Ink, left, "Warnings of this plan")
	ty := y + 9.5
	for _, x := range ws {
		// the title in bold, the rest of the first line and the lines
		// after it in regular type
		lines := wrap(clean(Regular, x.title+": "+x.text), w-14, sizeSmall, Regular)
		for i, l := range lines {
			if i == 0 {
				tw := c.text(x0+11, ty, sizeSmall, Bold, Ink, left, x.title+":")
				c.text(x0+11+tw+textWidth(Regular, sizeSmall, " "), ty, sizeSmall, Regular, Ink, left, strings.TrimPrefix(l, x.title+": "))
			} else {
				c.text(x0+11, ty, sizeSmall, Regular, Ink, left, l)
			}
			ty += sizeSmall * ptMM * 1.3
		}
		ty += 0.6
	}
	return y + h
}
