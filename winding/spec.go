package winding

import (
	"errors"
	"fmt"
	"strings"
)

// Limits on a Spec. They keep every computation small and bounded; they are far
// above any hand-wound stator (common practice: hand-wound tooth-coil stators
// rarely exceed a few hundred teeth).
const (
	MaxSlots  = 1200
	MaxPoles  = 1200
	MaxPhases = 15
)

// Spec is a slot/pole pair and the winding options asked of it.
type Spec struct {
	Slots  int // Q, number of slots (= number of teeth)
	Poles  int // 2p, number of rotor poles
	Phases int // m, odd, at least 3
	Layers int // 2: every tooth wound; 1: alternate teeth wound
	Paths  int // parallel paths per phase; 0 means 1
}

// PolePairs returns p.
func (s Spec) PolePairs() int { return s.Poles / 2 }

// String gives the pair in the trade's short form, e.g. "12/10 2L".
func (s Spec) String() string {
	return fmt.Sprintf("%d/%d %dL", s.Slots, s.Poles, s.Layers)
}

// ErrInvalid marks a Spec whose values are out of range (a zero slot count, an
// odd pole count...). ErrInfeasible marks a Spec that is well formed but has no
// balanced winding. Test with errors.Is.
var (
	ErrInvalid    = errors.New("invalid winding request")
	ErrInfeasible = errors.New("no balanced winding")
)

// SpecError explains why a Spec was refused: the field and its value, the
// reason, and the nearest feasible pairs where they help.
type SpecError struct {
	Field   string // "slots", "poles", "phases", "layers" or "paths"
	Value   int
	Reason  string
	Nearest []Spec // nearest feasible pairs, closest first (may be empty)
	kind    error  // ErrInvalid or ErrInfeasible
}

func (e *SpecError) Error() string {
	var b strings.Builder
	fmt.Fprintf(&b, "winding: %s = %d: %s", e.Field, e.Value, e.Reason)
	if len(e.Nearest) > 0 {
		b.WriteString("; nearest feasible pairs:")
		for i, n := range e.Nearest {
			if i > 0 {
				b.WriteString(",")
			}
			fmt.Fprintf(&b, " %d/%d", n.Slots, n.Poles)
		}
	}
	return b.String()
}

// Unwrap lets errors.Is tell ErrInvalid from ErrInfeasible.
func (e *SpecError) Unwrap() error { return e.kind }

func invalid(field string, v int, format string, a ...any) *SpecError {
	return &SpecError{Field: field, Value: v, Reason: fmt.Sprintf(format, a...), kind: ErrInvalid}
}

func infeasible(field string, v int, format string, a ...any) *SpecError {
	return &SpecError{Field: field, Value: v, Reason: fmt.Sprintf(format, a...), kind: ErrInfeasible}
}

// Normalize fills defaults: 3 phases, 2 layers, 1 path.
func (s Spec) Normalize() Spec {
	if s.Phases == 0 {
		s.Phases = 3
	}
	if s.Layers == 0 {
		s.Layers = 2
	}
	if s.Paths == 0 {
		s.Paths = 1
	}
	return s
}

// checkRange refuses values that no winding can have. It does not look for a
// balanced layout; Design does that.
func (s Spec) checkRange() error {
	switch {
	case s.Phases < 3:
		return invalid("phases", s.Phases, "a polyphase winding needs at least 3 phases; use 3 (or 5, 7...)")
	case s.Phases%2 == 0:
		return invalid("phases", s.Phases, "only odd phase counts are supported (even counts split into odd systems); use %d or %d", s.Phases-1, s.Phases+1)
	case s.Phases > MaxPhases:
		return invalid("phases", s.Phases, "more than %d phases is outside this tool's range", MaxPhases)
	case s.Layers != 1 && s.Layers != 2:
		return invalid("layers", s.Layers, "layers must be 1 (alternate teeth wound) or 2 (every tooth wound)")
	case s.Slots <= 0:
		return invalid("slots", s.Slots, "the slot count must be a positive whole number")
	case s.Slots > MaxSlots:
		return invalid("slots", s.Slots, "more than %d slots is outside this tool's range", MaxSlots)
	case s.Poles <= 0:
		return invalid("poles", s.Poles, "the pole count 2p must be a positive even number")
	case s.Poles%2 != 0:
		return invalid("poles", s.Poles, "2p must be even (poles come in north-south pairs); try %d or %d", s.Poles-1, s.Poles+1)
	case s.Poles > MaxPoles:
		return invalid("poles", s.Poles, "more than %d poles is outside this tool's range", MaxPoles)
	case s.Paths < 1:
		return invalid("paths", s.Paths, "the number of parallel paths must be at least 1")
	}
	if s.Layers == 1 && s.Slots%2 != 0 {
		return infeasible("slots", s.Slots, "a single-layer winding winds alternate teeth, so it needs an even slot count")
	}
	coils := s.Slots / (3 - s.Layers)
	if coils%s.Phases != 0 {
		if s.Layers == 1 {
			return infeasible("slots", s.Slots, "a single-layer winding has Q/2 = %d coils, which must be a multiple of the phase count %d", coils, s.Phases)
		}
		return infeasible("slots", s.Slots, "slots must be a multiple of the phase count %d", s.Phases)
	}
	return nil
}
