// Package sensetest finds coil sense written by letter case in text output:
// a run of single phase letters that mixes upper and lower case ("U u v V")
// or a tooth token that carries the sense in its case and an arrow ("2u<").
// A coil's sense is written with a sign glued to an upper-case phase letter
// ("+U", "-U"); letter case never carries meaning. It is for tests only.
package sensetest

import (
	"regexp"
	"strings"
)

// phaseLetter matches one phase letter of up to seven phases (U, V, W or
// A..G) in either case, as a whole token.
var phaseLetter = regexp.MustCompile(`^[UVWA-Guvwa-g]$`)

// arrowToken matches a tooth number glued to a phase letter and an arrow.
var arrowToken = regexp.MustCompile(`\d[UVWA-Guvwa-g][<>]`)

// CaseCoded returns the lines of text that write a coil's sense by letter
// case: a run of two or more whitespace-separated single phase letters with
// both cases in it, or a token like "2u<".
func CaseCoded(text string) []string {
	var bad []string
	for _, line := range strings.Split(text, "\n") {
		if arrowToken.MatchString(line) || mixedRun(strings.Fields(line)) {
			bad = append(bad, line)
		}
	}
	return bad
}

// mixedRun reports whether the fields hold a run of single phase letters
// with upper and lower case in it.
func mixedRun(fields []string) bool {
	upper, lower, n := false, false, 0
	for _, f := range append(fields, "") {
		if phaseLetter.MatchString(f) {
			n++
			upper = upper || f == strings.ToUpper(f)
			lower = lower || f == strings.ToLower(f)
			continue
		}
		if n >= 2 && upper && lower {
			return true
		}
		upper, lower, n = false, false, 0
	}
	return false
}
