package progress

import (
	"fmt"
	"hash/fnv"
	"sort"
	"strconv"
	"strings"

	"coilwright/winding/plan"
)

// The parts of a plan's fingerprint: what the bench steps depend on.
const (
	partPair       = "pair"       // "12/10"
	partPhases     = "phases"     // "3"
	partLayers     = "layers"     // "2"
	partPaths      = "paths"      // "1"
	partConnection = "connection" // "star"
	partRotor      = "rotor"      // "inner"
	partTurns      = "turns"      // turns per coil
	partCoils      = "coils"      // the coils in winding order, "+U1 -U2 ..."
	partSteps      = "steps"      // how many steps, and a digest of their keys
	partTests      = "tests"      // the test names in order
)

// partWords says what each part is, for people.
var partWords = map[string]string{
	partPair:       "slot/pole pair",
	partPhases:     "number of phases",
	partLayers:     "layers",
	partPaths:      "parallel paths",
	partConnection: "connection",
	partRotor:      "rotor side",
	partTurns:      "turns per coil",
	partCoils:      "coils (tooth, phase, sense, in winding order)",
	partSteps:      "bench steps",
	partTests:      "tests",
}

// Fingerprint gives the parts of the plan the bench steps depend on, as a
// record's plan event holds them.
func Fingerprint(p *plan.Plan) map[string]string {
	fp := map[string]string{}
	if p == nil {
		return fp
	}
	if l := p.Layout; l != nil {
		fp[partPair] = fmt.Sprintf("%d/%d", l.Spec.Slots, l.Spec.Poles)
		fp[partPhases] = strconv.Itoa(l.Spec.Phases)
		fp[partLayers] = strconv.Itoa(l.Spec.Layers)
		fp[partPaths] = strconv.Itoa(max(1, l.Spec.Paths))
	}
	fp[partConnection] = p.Connection.String()
	fp[partRotor] = string(p.Rotor)
	fp[partTurns] = strconv.Itoa(p.TurnsPerCoil)
	var coils []string
	for _, s := range p.Steps {
		if s.Coil != nil {
			coils = append(coils, Sense(s.Coil)+s.Coil.Phase+strconv.Itoa(s.Coil.Tooth))
		}
	}
	fp[partCoils] = strings.Join(coils, " ")
	h := fnv.New64a()
	for _, k := range Keys(p) {
		h.Write([]byte(k))
		h.Write([]byte{0})
	}
	fp[partSteps] = fmt.Sprintf("%d %016x", len(p.Steps), h.Sum64())
	var tests []string
	for _, t := range p.Tests {
		tests = append(tests, t.Name)
	}
	fp[partTests] = strings.Join(tests, " ")
	return fp
}

// Same reports whether two fingerprints are equal.
func Same(a, b map[string]string) bool {
	if len(a) != len(b) {
		return false
	}
	for k, v := range a {
		if w, ok := b[k]; !ok || v != w {
			return false
		}
	}
	return true
}

// Changes says in words what differs between the fingerprint a record was
// written against (was) and the plan's now (is), one line per part, in a
// fixed order; nil when nothing differs.
func Changes(was, is map[string]string) []string {
	var keys []string
	for k := range was {
		keys = append(keys, k)
	}
	for k := range is {
		if _, ok := was[k]; !ok {
			keys = append(keys, k)
		}
	}
	sort.Slice(keys, func(i, j int) bool {
		return order(keys[i]) < order(keys[j]) || order(keys[i]) == order(keys[j]) && keys[i] < keys[j]
	})
	var out []string
	for _, k := range keys {
		a, b := was[k], is[k]
		if a == b {
			continue
		}
		name := partWords[k]
		if name == "" {
			name = k
		}
		switch k {
		case partCoils:
			out = append(out, name+" changed"+coilChange(a, b))
		case partSteps:
			out = append(out, fmt.Sprintf("%s changed (%s now, %s before)", name, first(b), first(a)))
		default:
			out = append(out, fmt.Sprintf("%s changed from %s to %s", name, orNone(a), orNone(b)))
		}
	}
	return out
}

var partOrder = []string{partPair, partPhases, partLayers, partPaths, partConnection, partRotor, partTurns, partCoils, partSteps, partTests}

func order(k string) int {
	for i, p := range partOrder {
		if p == k {
			return i
		}
	}
	return len(partOrder)
}

func orNone(s string) string {
	if s == "" {
		return "none"
	}
	return s
}

func first(s string) string {
	if i := strings.IndexByte(s, ' '); i >= 0 {
		return s[:i]
	}
	return orNone(s)
}

// coilChange names the first few coils that differ.
func coilChange(was, is string) string {
	a, b := strings.Fields(was), strings.Fields(is)
	if len(a) != len(b) {
		return fmt.Sprintf(" (%d coils now, %d before)", len(b), len(a))
	}
	var diff []string
	for i := range a {
		if a[i] != b[i] {
			diff = append(diff, a[i]+" is now "+b[i])
		}
	}
	if len(diff) > 3 {
		diff = append(diff[:3], fmt.Sprintf("%d more", len(diff)-3))
	}
	if len(diff) == 0 {
		return ""
	}
	return " (" + strings.Join(diff, ", ") + ")"
}
