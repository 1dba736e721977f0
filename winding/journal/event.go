package journal

import (
	"encoding/json"
	"fmt"
	"math"
	"strings"
	"time"
	"unicode"
)

// Kind says what an event records.
type Kind string

const (
	// Done: plan step Step was completed; for a coil step Tooth and Turns give
	// the coil and the turns actually wound.
	Done Kind = "done"
	// Undo: the last completed step is no longer done (Step, when set, names it).
	Undo Kind = "undo"
	// Turns: the turn count of the coil in progress (Step, Tooth), so a resume
	// restores it.
	Turns Kind = "turns"
	// Note: free text attached to a step or a coil.
	Note Kind = "note"
	// Reading: test readings of test Test with the check verdict.
	Reading Kind = "reading"
	// Plan: the fingerprint of the plan the events after it were recorded
	// against (Plan holds its parts), so a reader can say what changed.
	Plan Kind = "plan"
)

// Bounds of the values a record may hold. A line beyond them was not written
// by coilwright and is refused with its line number.
const (
	MaxTurns    = 99_999    // turns of one coil
	MaxStep     = 1_000_000 // plan step index
	MaxTooth    = 100_000   // tooth number
	MaxSeq      = 1 << 40   // sequence number
	MaxReading  = 1e15      // magnitude of a reading
	MaxNoteRune = 4000      // length of a note
)

// Event is one line of the record. Fields a kind does not use stay empty.
type Event struct {
	Seq   int       `json:"seq"`  // 1, 2, ... in the order written
	Time  time.Time `json:"time"` // when it happened
	Kind  Kind      `json:"kind"`
	Step  int       `json:"step,omitempty"`  // 1-based plan step index
	Tooth int       `json:"tooth,omitempty"` // the coil's tooth, for coil steps
	// Key names the step by what it is, not where it stands in the plan
	// ("coil 4 -V", "jumper 1>4 U", "test resistance"), so an entry can be
	// matched to its step after the plan changed.
	Key   string `json:"key,omitempty"`
	Turns int    `json:"turns,omitempty"` // actual turns (done) or turns so far (turns)
	Note  string `json:"note,omitempty"`

	// Reading events.
	Test     string             `json:"test,omitempty"`     // the plan test's name
	Readings map[string]float64 `json:"readings,omitempty"` // named values as measured (ohm, °C, MΩ, V, rpm)
	Verdict  string             `json:"verdict,omitempty"`  // "pass", "warn" or "fail"
	// Skipped marks a Done of an optional test left out on purpose.
	Skipped  bool     `json:"skipped,omitempty"`
	Findings []string `json:"findings,omitempty"` // the findings in words

	// Plan events: the parts of the plan's fingerprint, by name.
	Plan map[string]string `json:"plan,omitempty"`

	// Line is the 1-based line of the record the event was read from (0 for
	// an event not read from a record). It is not written.
	Line int `json:"-"`
}

// EventError says why an event cannot be written.
type EventError struct {
	Field  string
	Reason string
}

func (e *EventError) Error() string {
	return fmt.Sprintf("journal: event %s: %s", e.Field, e.Reason)
}

// Validate reports whether the event can be written and read back.
func (e Event) Validate() error {
	switch {
	case e.Kind == "":
		return &EventError{"kind", "empty; use done, undo, turns, note, reading or plan"}
	case e.Seq < 0 || e.Seq > MaxSeq:
		return &EventError{"seq", fmt.Sprintf("%d is outside 0..%d", e.Seq, MaxSeq)}
	case e.Step < 0 || e.Step > MaxStep:
		return &EventError{"step", fmt.Sprintf("%d is outside 1..%d; steps count from 1", e.Step, MaxStep)}
	case e.Tooth < 0 || e.Tooth > MaxTooth:
		return &EventError{"tooth", fmt.Sprintf("%d is outside 1..%d; teeth count from 1", e.Tooth, MaxTooth)}
	case e.Turns < 0:
		return &EventError{"turns", fmt.Sprintf("%d is below 0; a count of turns is 0..%d", e.Turns, MaxTurns)}
	case e.Turns > MaxTurns:
		return &EventError{"turns", fmt.Sprintf("%d is outside 0..%d, more than any coil holds", e.Turns, MaxTurns)}
	case len([]rune(e.Note)) > MaxNoteRune:
		return &EventError{"note", fmt.Sprintf("%d characters; at most %d", len([]rune(e.Note)), MaxNoteRune)}
	}
	for k, v := range e.Readings {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return &EventError{"readings." + k, fmt.Sprintf("%v cannot be stored; record an open circuit as a note", v)}
		}
		if math.Abs(v) > MaxReading {
			return &EventError{"readings." + k, fmt.Sprintf("%g is beyond any meter's range (at most %g)", v, MaxReading)}
		}
	}
	return nil
}

// Clean strips control characters (escape sequences, carriage returns, bells)
// from text of the record; line breaks and tabs become spaces. Notes pass
// through it on the way into a record and on the way out, so nothing typed or
// edited into a record can drive the terminal that shows it.
func Clean(s string) string {
	ok := true
	for _, r := range s {
		if unicode.IsControl(r) {
			ok = false
			break
		}
	}
	if ok {
		return s
	}
	var b strings.Builder
	for _, r := range s {
		switch {
		case r == '\n' || r == '\t' || r == '\r':
			b.WriteByte(' ')
		case unicode.IsControl(r):
		default:
			b.WriteRune(r)
		}
	}
	return b.String()
}

// cleaned returns the event with every text field passed through Clean.
func (e Event) cleaned() Event {
	e.Note = Clean(e.Note)
	e.Key = Clean(e.Key)
	e.Test = Clean(e.Test)
	e.Verdict = Clean(e.Verdict)
	if len(e.Findings) > 0 {
		fs := make([]string, len(e.Findings))
		for i, f := range e.Findings {
			fs[i] = Clean(f)
		}
		e.Findings = fs
	}
	if len(e.Plan) > 0 {
		pl := make(map[string]string, len(e.Plan))
		for k, v := range e.Plan {
			pl[Clean(k)] = Clean(v)
		}
		e.Plan = pl
	}
	if len(e.Readings) > 0 {
		rs := make(map[string]float64, len(e.Readings))
		for k, v := range e.Readings {
			rs[Clean(k)] = v
		}
		e.Readings = rs
	}
	return e
}

// Line encodes one event as a record line, with its final newline. Text
// fields are cleaned of control characters first.
func Line(e Event) ([]byte, error) {
	e = e.cleaned()
	if err := e.Validate(); err != nil {
		return nil, err
	}
	b, err := json.Marshal(e)
	if err != nil {
		return nil, fmt.Errorf("journal: encode event %d: %w", e.Seq, err)
	}
	return append(b, '\n'), nil
}
