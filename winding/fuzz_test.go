package winding

import (
	"bufio"
	"errors"
	"fmt"
	"os"
	"strings"
	"testing"
)

// seedSpecs reads testdata/layout/specs.txt: one "Q 2p m layers paths" per
// line, # for comments.
func seedSpecs(f *testing.F) [][5]int {
	fh, err := os.Open("../testdata/layout/specs.txt")
	if err != nil {
		f.Fatalf("seed corpus: %v", err)
	}
	defer fh.Close()
	var out [][5]int
	sc := bufio.NewScanner(fh)
	for sc.Scan() {
		line := strings.TrimSpace(sc.Text())
		if line == "" || strings.HasPrefix(line, "#") {
			continue
		}
		var v [5]int
		if _, err := fmt.Sscan(line, &v[0], &v[1], &v[2], &v[3], &v[4]); err != nil {
			f.Fatalf("seed corpus line %q: %v", line, err)
		}
		out = append(out, v)
	}
	return out
}

// FuzzDesign: no input panics; every refusal is a *SpecError with a field and
// a reason; every layout is balanced, in sequence and self-consistent.
func FuzzDesign(f *testing.F) {
	for _, v := range seedSpecs(f) {
		f.Add(v[0], v[1], v[2], v[3], v[4])
	}
	f.Fuzz(func(t *testing.T, q, poles, m, layers, paths int) {
		// Keep the fuzzer where work is small; the range checks above
		// MaxSlots are cheap and still run.
		if q > 240 || poles > 240 {
			q, poles = q%241, poles%241
		}
		s := Spec{Slots: q, Poles: poles, Phases: m, Layers: layers, Paths: paths}
		l, err := Design(s)
		if err != nil {
			var se *SpecError
			if !errors.As(err, &se) || se.Field == "" || se.Reason == "" {
				t.Fatalf("Design(%+v) = %v; want a *SpecError with field and reason", s, err)
			}
			if !errors.Is(err, ErrInvalid) && !errors.Is(err, ErrInfeasible) {
				t.Fatalf("Design(%+v) error %v is neither invalid nor infeasible", s, err)
			}
			return
		}
		checkBalanceAndSequence(t, l)
		checkPaths(t, l)
	})
}
