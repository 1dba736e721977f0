package printout

import (
	"sync"

	"golang.org/x/image/font"
	"golang.org/x/image/font/gofont/gobold"
	"golang.org/x/image/font/gofont/gomono"
	"golang.org/x/image/font/gofont/goregular"
	"golang.org/x/image/font/sfnt"
	"golang.org/x/image/math/fixed"
)

// faceFonts are the TrueType files of the three faces, embedded by gofont.
var faceFonts = [...][]byte{Regular: goregular.TTF, Bold: gobold.TTF, Mono: gomono.TTF}

// family names used in the PDF.
var faceFamily = [...]string{Regular: "goregular", Bold: "gobold", Mono: "gomono"}

// metrics holds advance widths per rune in font units for one face, read
// once from the embedded font.
type metrics struct {
	unitsPerEm float64
	advance    map[rune]float64
	fallback   float64
}

var (
	metricsOnce sync.Once
	faceMetrics [3]*metrics
)

// loadMetrics reads the advance of every rune each face has from U+0020 up
// to the end of the mathematical operators (U+22FF): Latin, Greek, Cyrillic,
// punctuation, letter-like symbols (Ω), arrows and the operators the pages
// use (√, −, ±, ×, ·, ≤, ≥). A rune outside that range or missing from a face
// is replaced by clean and counted on its page (Page.Replaced).
func loadMetrics() {
	for f, data := range faceFonts {
		fnt, err := sfnt.Parse(data)
		m := &metrics{unitsPerEm: 1000, advance: map[rune]float64{}, fallback: 600}
		faceMetrics[f] = m
		if err != nil {
			continue
		}
		var buf sfnt.Buffer
		upem := fnt.UnitsPerEm()
		m.unitsPerEm = float64(upem)
		ppem := fixed.Int26_6(upem) << 6
		for r := rune(0x20); r <= lastRune; r++ {
			gi, err := fnt.GlyphIndex(&buf, r)
			if err != nil || gi == 0 {
				continue
			}
			adv, err := fnt.GlyphAdvance(&buf, gi, ppem, font.HintingNone)
			if err != nil {
				continue
			}
			m.advance[r] = float64(adv) / 64
		}
		if a, ok := m.advance['n']; ok {
			m.fallback = a
		}
	}
}

// lastRune is the last rune whose glyph the faces are searched for.
const lastRune = 0x22ff

func metricsOf(f Face) *metrics {
	metricsOnce.Do(loadMetrics)
	if f < 0 || int(f) >= len(faceMetrics) {
		f = Regular
	}
	return faceMetrics[f]
}

// hasGlyph reports whether the face can print r.
func hasGlyph(f Face, r rune) bool {
	_, ok := metricsOf(f).advance[r]
	return ok
}

// clean replaces runes the face cannot print (and control characters) with
// the nearest rune it has (a minus sign by a hyphen) or else '?', so no text
// run ever asks the font for a missing glyph.
func clean(f Face, s string) string {
	ok := true
	for _, r := range s {
		if !hasGlyph(f, r) {
			ok = false
			break
		}
	}
	if ok {
		return s
	}
	b := make([]rune, 0, len(s))
	for _, r := range s {
		switch {
		case hasGlyph(f, r):
			b = append(b, r)
		case stand[r] != 0 && hasGlyph(f, stand[r]):
			b = append(b, stand[r])
		default:
			b = append(b, '?')
		}
	}
	return string(b)
}

// stand maps runes the Go fonts may lack to the nearest one they have.
var stand = map[rune]rune{
	'\u2212': '-',      // minus sign
	'\u2011': '-',      // non-breaking hyphen
	'\u2012': '\u2013', // figure dash to en dash
	'\u202f': ' ',      // narrow no-break space
	'\u2009': ' ',      // thin space
}

// textWidth is the advance of s in mm at size pt.
func textWidth(f Face, size float64, s string) float64 {
	m := metricsOf(f)
	w := 0.0
	for _, r := range s {
		a, ok := m.advance[r]
		if !ok {
			a = m.fallback
		}
		w += a
	}
	return w / m.unitsPerEm * size * ptMM
}
