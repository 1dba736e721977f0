package sensetest

import "testing"

func TestCaseCoded(t *testing.T) {
	tests := []struct {
		name string
		text string
		want int
	}{
		{"case-coded sequence", "Layout  U u v V W w u U V v w W", 1},
		{"case-coded five phases", "  A c C b", 1},
		{"ring token", "|   2u<  @1U>   12W> |", 1},
		{"strip rows", "phase   U  u  w  W\nwind    >  <  <  >", 1},
		{"signed sequence", "Layout  +U -U -V +V +W -W", 0},
		{"signed ring", "|   2-U  @1+U   12+W |", 0},
		{"single layer", "+U 0 +U 0 -V 0", 0},
		{"upper-case list", "phases U V W", 0},
		{"prose", "a coil of phase U wound clockwise", 0},
	}
	for _, tt := range tests {
		if got := CaseCoded(tt.text); len(got) != tt.want {
			t.Errorf("%s: CaseCoded(%q) = %q; want %d line(s)", tt.name, tt.text, got, tt.want)
		}
	}
}
