package journal

import (
	"encoding/json"
	"fmt"
	"math"
	"time"
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
)

// Event is one line of the record. Fields a kind does not use stay empty.
type Event struct {
	Seq   int       `json:"seq"`  // 1, 2, ... in the order written
	Time  time.Time `json:"time"` // when it happened
	Kind  Kind      `json:"kind"`
	Step  int       `json:"step,omitempty"`  // 1-based plan step index
	Tooth int       `json:"tooth,omitempty"` // the coil's tooth, for coil steps
	Turns int       `json:"turns,omitempty"` // actual turns (done) or turns so far (turns)
	Note  string    `json:"note,omitempty"`

	// Reading events.
	Test     string             `json:"test,omitempty"`     // the plan test's name, or "check"
	Readings map[string]float64 `json:"readings,omitempty"` // named values as measured (ohm, °C, MΩ, V, rpm)
	Verdict  string             `json:"verdict,omitempty"`  // "pass", "warn" or "fail"
	Findings []string           `json:"findings,omitempty"` // the findings in words
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
		return &EventError{"kind", "empty; use done, undo, turns, note or reading"}
	case e.Step < 0:
		return &EventError{"step", fmt.Sprintf("%d is negative; steps count from 1", e.Step)}
	case e.Tooth < 0:
		return &EventError{"tooth", fmt.Sprintf("%d is negative; teeth count from 1", e.Tooth)}
	case e.Turns < 0:
		return &EventError{"turns", fmt.Sprintf("%d is negative", e.Turns)}
	}
	for k, v := range e.Readings {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return &EventError{"readings." + k, fmt.Sprintf("%v cannot be stored; record an open circuit as a note", v)}
		}
	}
	return nil
}

// Line encodes one event as a record line, with its final newline.
func Line(e Event) ([]byte, error) {
	if err := e.Validate(); err != nil {
		return nil, err
	}
	b, err := json.Marshal(e)
	if err != nil {
		return nil, fmt.Errorf("journal: encode event %d: %w", e.Seq, err)
	}
	return append(b, '\n'), nil
}
