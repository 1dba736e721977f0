package tui

import (
	"regexp"
	"strconv"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding"
	"coilwright/winding/sensetest"
)

// Every bench screen writes a coil's sense as a sign glued to an upper-case
// phase letter ("+U", "-U"), never by letter case: the guide (ring and strip),
// a look back, the help screen and the list of all steps, at the sizes the
// guide is used at.
func TestScreensWriteSenseBySign(t *testing.T) {
	sizes := []struct{ w, h int }{{60, 18}, {80, 24}, {100, 34}, {170, 48}}
	for _, sz := range sizes {
		m, _ := woundTwo(t, sz.w, sz.h)
		screens := map[string]string{"guide": plain(m)}
		keys(t, m, "left")
		screens["look back"] = plain(m)
		keys(t, m, "esc", "?")
		screens["help"] = plain(m)
		keys(t, m, "esc", "o")
		screens["all steps"] = plain(m)
		for name, v := range screens {
			if bad := sensetest.CaseCoded(v); len(bad) > 0 {
				t.Errorf("%dx%d %s: sense written by letter case in %q:\n%s", sz.w, sz.h, name, bad, v)
			}
		}
	}
}

// The ring's tooth tokens are the layout's signed tokens, tooth by tooth
// (12/10 double layer and 24/22 single layer, which has unwound teeth).
func TestRingTokensFollowTheCoils(t *testing.T) {
	for _, c := range []struct{ q, p, layers int }{{12, 10, 2}, {24, 22, 1}} {
		p := handPlan(t, c.q, c.p, c.layers)
		m := New(Options{Plan: p, Recorder: &memRecorder{}, Now: fixedNow})
		drive(t, m, tea.WindowSizeMsg{Width: 170, Height: 48})
		v := plain(m)
		for i, tok := range p.Layout.SequenceTokens() {
			if tok == winding.Unwound {
				tok = markUnwound
			}
			re := regexp.MustCompile(`(^|[\s#@*])` + strconv.Itoa(i+1) + regexp.QuoteMeta(tok) + `(\s|$)`)
			if !re.MatchString(v) {
				t.Errorf("%d/%d: the ring lacks tooth %d as %q:\n%s", c.q, c.p, i+1, strconv.Itoa(i+1)+tok, v)
			}
		}
	}
}
