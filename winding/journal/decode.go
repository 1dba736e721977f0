package journal

import (
	"bytes"
	"encoding/json"
	"fmt"
)

// TornTail describes a last line that could not be read: a write cut short
// by a crash or power loss, or a garbled end. Everything before Offset is good.
type TornTail struct {
	Line   int    // 1-based line number of the torn line
	Offset int64  // byte offset where the torn line starts
	Bytes  int    // its length in bytes, newline included if there was one
	Reason string // why it could not be read
}

func (t *TornTail) String() string {
	return fmt.Sprintf("line %d (%d bytes at offset %d): %s", t.Line, t.Bytes, t.Offset, t.Reason)
}

// DecodeError is a garbled line that is not the last: the record is damaged
// and is not guessed at.
type DecodeError struct {
	Line   int
	Offset int64
	Err    error
}

func (e *DecodeError) Error() string {
	return fmt.Sprintf("journal: line %d (offset %d) is not a record event: %v; the record was edited or damaged, repair or move that line", e.Line, e.Offset, e.Err)
}

func (e *DecodeError) Unwrap() error { return e.Err }

// Decode reads a record. Blank lines are skipped. A last line that does not
// decode (torn or garbled) is left out and reported in torn; a bad line before
// the last is a *DecodeError. A last line that decodes but lacks its newline is
// kept (the write finished but for the newline).
func Decode(data []byte) (events []Event, torn *TornTail, err error) {
	var off int64
	line := 0
	for len(data) > 0 {
		line++
		n := bytes.IndexByte(data, '\n')
		var text []byte
		size := n + 1
		if n < 0 {
			text, size = data, len(data)
		} else {
			text = data[:n]
		}
		last := size == len(data)
		if len(bytes.TrimSpace(text)) > 0 {
			e, perr := parseLine(text)
			if perr != nil {
				if last {
					return events, &TornTail{Line: line, Offset: off, Bytes: size, Reason: perr.Error()}, nil
				}
				return events, nil, &DecodeError{Line: line, Offset: off, Err: perr}
			}
			events = append(events, e)
		}
		data = data[size:]
		off += int64(size)
	}
	return events, nil, nil
}

func parseLine(text []byte) (Event, error) {
	var e Event
	if err := json.Unmarshal(text, &e); err != nil {
		return Event{}, err
	}
	if err := e.Validate(); err != nil {
		return Event{}, err
	}
	return e, nil
}
