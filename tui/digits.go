package tui

import (
	"strconv"
	"strings"
)

// bigDigits are three-row seven-segment figures in plain ASCII, so the turn
// count can be read from across the bench on any terminal.
var bigDigits = [10][3]string{
	{" _ ", "| |", "|_|"},
	{"   ", " | ", " | "}, // 1 stands in the middle, so 17 and 71 do not read as a box
	{" _ ", " _|", "|_ "},
	{" _ ", " _|", " _|"},
	{"   ", "|_|", "  |"},
	{" _ ", "|_ ", " _|"},
	{" _ ", "|_ ", "|_|"},
	{" _ ", "  |", "  |"},
	{" _ ", "|_|", "|_|"},
	{" _ ", "|_|", " _|"},
}

// bigNumber renders n (n >= 0) as three lines of seven-segment figures.
func bigNumber(n int) [3]string {
	var out [3]string
	var rows [3][]string
	for _, r := range strconv.Itoa(max(0, n)) {
		d := bigDigits[r-'0']
		for i := range rows {
			rows[i] = append(rows[i], d[i])
		}
	}
	for i := range out {
		out[i] = strings.Join(rows[i], " ")
	}
	return out
}

// segments says which of the seven segments each figure lights: top, upper
// left, upper right, middle, lower left, lower right, bottom.
var segments = [10][7]bool{
	{true, true, true, false, true, true, true},
	{false, false, true, false, false, true, false},
	{true, false, true, true, true, false, true},
	{true, false, true, true, false, true, true},
	{false, true, true, true, false, true, false},
	{true, true, false, true, false, true, true},
	{true, true, false, true, true, true, true},
	{true, false, true, false, false, true, false},
	{true, true, true, true, true, true, true},
	{true, true, true, true, false, true, true},
}

// scaledNumber renders n (n >= 0) as seven-segment figures of '#' blocks,
// 2k+3 rows tall and 2k+2 columns wide per figure (k >= 1; a terminal cell is
// about twice as tall as it is wide), one column apart: the count grows with
// the terminal so it can be read at arm's length.
func scaledNumber(n, k int) []string {
	k = max(1, k)
	h, w := 2*k+3, 2*k+2
	mid := k + 1
	rows := make([][]string, h)
	for _, r := range strconv.Itoa(max(0, n)) {
		sg := segments[r-'0']
		for y := 0; y < h; y++ {
			line := []byte(strings.Repeat(" ", w))
			if (y == 0 && sg[0]) || (y == mid && sg[3]) || (y == h-1 && sg[6]) {
				copy(line, strings.Repeat("#", w))
			}
			upper, lower := y <= mid, y >= mid
			if (upper && sg[1]) || (lower && sg[4]) {
				line[0] = '#'
			}
			if (upper && sg[2]) || (lower && sg[5]) {
				line[w-1] = '#'
			}
			rows[y] = append(rows[y], string(line))
		}
	}
	out := make([]string, h)
	for y := range rows {
		out[y] = strings.Join(rows[y], " ")
	}
	return out
}
