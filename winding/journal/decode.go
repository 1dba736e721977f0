package journal

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
)

// TornTail describes a last line that was cut short: it lacks its newline
// and does not decode, as a write interrupted by a crash or a power cut leaves
// it. Everything before Offset is good.
type TornTail struct {
	Line   int    // 1-based line number of the torn line
	Offset int64  // byte offset where the torn line starts
	Bytes  int    // its length in bytes
	Reason string // why it could not be read
}

func (t *TornTail) String() string {
	return fmt.Sprintf("line %d (%d bytes at offset %d): %s", t.Line, t.Bytes, t.Offset, t.Reason)
}

// DecodeError is a line that cannot be read and was not cut short by a
// crash (it is not the last, or it ends in a newline): the record is damaged
// or was edited, and it is not guessed at.
type DecodeError struct {
	Line   int
	Offset int64
	Err    error
}

func (e *DecodeError) Error() string {
	return fmt.Sprintf("journal: line %d (offset %d) is not a record event: %v; the record was edited or damaged, repair or move that line", e.Line, e.Offset, e.Err)
}

func (e *DecodeError) Unwrap() error { return e.Err }

// DamagedError is a record that cannot be used as it is: one of its lines
// (not a torn last line) does not decode. It is what Open returns, and what a
// reader of a record should say (Damaged): which line, that the file was left
// as it is, and the two ways to go on.
type DamagedError struct {
	Path  string // the record
	Lines int    // lines in the record
	*DecodeError
}

// Damaged names the record in a *DecodeError returned by Decode of data read
// from path; any other error is returned as it is.
func Damaged(path string, data []byte, err error) error {
	var de *DecodeError
	if !errors.As(err, &de) {
		return err
	}
	lines := bytes.Count(data, []byte{'\n'})
	if len(data) > 0 && data[len(data)-1] != '\n' {
		lines++
	}
	return &DamagedError{Path: path, Lines: lines, DecodeError: de}
}

func (e *DamagedError) Error() string {
	where := fmt.Sprintf("line %d of %d,", e.Line, e.Lines)
	if e.Line == e.Lines {
		where = fmt.Sprintf("its last line, %d,", e.Line)
	}
	return fmt.Sprintf("the progress record %s is damaged at %s byte %d (%v). It was not used, and it is kept exactly as it is. "+
		"To go on, either repair or delete line %d in a text editor (one entry per line) and start again, "+
		"or move the file aside (rename it, e.g. to %s.damaged): a fresh, empty record then starts, and the old file stays for reference",
		e.Path, where, e.Offset, e.Err, e.Line, e.Path)
}

func (e *DamagedError) Unwrap() error { return e.DecodeError }

// Decode reads a record. Blank lines are skipped. A last line without its
// newline that does not decode is a torn write: it is left out and reported
// in torn. Any other line that does not decode, or holds a value beyond the
// record's bounds, is a *DecodeError naming it. A last line that decodes but
// lacks its newline is kept (the write finished but for the newline). Text
// fields come back cleaned of control characters, and each event carries its
// line number.
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
		if len(bytes.TrimSpace(text)) > 0 {
			e, perr := parseLine(text)
			if perr != nil {
				if n < 0 {
					return events, &TornTail{Line: line, Offset: off, Bytes: size, Reason: perr.Error()}, nil
				}
				return events, nil, &DecodeError{Line: line, Offset: off, Err: perr}
			}
			e.Line = line
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
	e = e.cleaned()
	if err := e.Validate(); err != nil {
		return Event{}, err
	}
	return e, nil
}
