package tui

import "github.com/charmbracelet/lipgloss"

// palette is the small set of adaptive colours every style is built from.
// Phase colours follow the IEC 60445 phase colours brown, black, grey; black
// is shown light on a dark terminal so it stays visible. Letters always carry
// the same information, so a monochrome terminal loses nothing.
var palette = struct {
	text, dim, accent, ok, warn, fail lipgloss.AdaptiveColor
	phases                            []lipgloss.AdaptiveColor
}{
	text:   lipgloss.AdaptiveColor{Light: "#1c1c1c", Dark: "#e4e4e4"},
	dim:    lipgloss.AdaptiveColor{Light: "#707070", Dark: "#8a8a8a"},
	accent: lipgloss.AdaptiveColor{Light: "#005f87", Dark: "#5fafd7"},
	ok:     lipgloss.AdaptiveColor{Light: "#007a3d", Dark: "#5fd787"},
	warn:   lipgloss.AdaptiveColor{Light: "#9a6700", Dark: "#ffd75f"},
	fail:   lipgloss.AdaptiveColor{Light: "#b00020", Dark: "#ff5f5f"},
	phases: []lipgloss.AdaptiveColor{
		{Light: "#8b4513", Dark: "#d7875f"}, // brown
		{Light: "#000000", Dark: "#ffffff"}, // black (light on dark terminals)
		{Light: "#6c6c6c", Dark: "#a8a8a8"}, // grey
	},
}

// asciiBorder is the frame of the panels: plain ASCII, so no glyph of
// ambiguous width can shift a column on any terminal.
var asciiBorder = lipgloss.Border{
	Top: "-", Bottom: "-", Left: "|", Right: "|",
	TopLeft: "+", TopRight: "+", BottomLeft: "+", BottomRight: "+",
}

// styles holds every style the screens use, built once.
type styles struct {
	title, subtitle, dim, label, value, strong lipgloss.Style
	coilTitle                                  lipgloss.Style
	panel, drawing                             lipgloss.Style
	current, viewed, done                      lipgloss.Style
	phase                                      []lipgloss.Style
	ok, warn, fail, caution, errorBar, notice  lipgloss.Style
	counter, counterDone                       lipgloss.Style
	statusDone, statusNow, statusTodo          lipgloss.Style
	banner, picked                             lipgloss.Style
}

func newStyles() *styles {
	s := &styles{
		title:       lipgloss.NewStyle().Bold(true).Foreground(palette.accent),
		subtitle:    lipgloss.NewStyle().Foreground(palette.dim),
		dim:         lipgloss.NewStyle().Foreground(palette.dim),
		label:       lipgloss.NewStyle().Foreground(palette.dim).Width(7),
		value:       lipgloss.NewStyle().Foreground(palette.text),
		strong:      lipgloss.NewStyle().Bold(true).Foreground(palette.text),
		coilTitle:   lipgloss.NewStyle().Bold(true).Foreground(palette.accent),
		panel:       lipgloss.NewStyle().Border(asciiBorder).BorderForeground(palette.dim).Padding(0, 1),
		drawing:     lipgloss.NewStyle().Border(asciiBorder).BorderForeground(palette.dim),
		current:     lipgloss.NewStyle().Reverse(true).Bold(true),
		viewed:      lipgloss.NewStyle().Underline(true).Bold(true).Foreground(palette.warn),
		banner:      lipgloss.NewStyle().Bold(true).Foreground(palette.warn),
		done:        lipgloss.NewStyle().Foreground(palette.dim),
		ok:          lipgloss.NewStyle().Bold(true).Foreground(palette.ok),
		warn:        lipgloss.NewStyle().Bold(true).Foreground(palette.warn),
		fail:        lipgloss.NewStyle().Bold(true).Foreground(palette.fail),
		caution:     lipgloss.NewStyle().Foreground(palette.warn),
		errorBar:    lipgloss.NewStyle().Bold(true).Foreground(palette.fail),
		notice:      lipgloss.NewStyle().Foreground(palette.warn),
		counter:     lipgloss.NewStyle().Bold(true).Foreground(palette.text),
		counterDone: lipgloss.NewStyle().Bold(true).Foreground(palette.ok),
		statusDone:  lipgloss.NewStyle().Foreground(palette.dim),
		statusNow:   lipgloss.NewStyle().Bold(true).Foreground(palette.accent),
		statusTodo:  lipgloss.NewStyle().Foreground(palette.text),
		picked:      lipgloss.NewStyle().Reverse(true),
	}
	for _, c := range palette.phases {
		s.phase = append(s.phase, lipgloss.NewStyle().Bold(true).Foreground(c))
	}
	return s
}

// phaseStyle returns the style of phase i; phases beyond the three IEC
// colours use the plain text colour (their letters tell them apart).
func (s *styles) phaseStyle(i int) lipgloss.Style {
	if i >= 0 && i < len(s.phase) {
		return s.phase[i]
	}
	return s.strong
}
