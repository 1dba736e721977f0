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
