package job

import (
	"errors"
	"fmt"
	"strings"
)

// ErrInvalid marks a job file that cannot be used as written (syntax, type,
// range, an impossible value). ErrUnsupported marks one that is well formed
// but asks for what this tool does not do. Test with errors.Is.
var (
	ErrInvalid     = errors.New("invalid job")
	ErrUnsupported = errors.New("unsupported job")
)

// FieldError explains why a field of a job was refused: where it is, its value,
// why, and what would work.
type FieldError struct {
	File   string // file name as given to Parse; may be empty
	Field  string // dotted key, e.g. "winding.poles"
	Value  string // the value as written, or "" when missing
	Reason string
	Hint   string // what would work; may be empty
	Line   int    // 0 when not known (a missing key, a Job built in code)
	Col    int

	Unsupported bool // valid but not supported, rather than invalid
}

func (e *FieldError) Error() string {
	var b strings.Builder
	b.WriteString("job: ")
	if e.File != "" {
		b.WriteString(e.File)
		if e.Line > 0 {
			fmt.Fprintf(&b, ":%d:%d", e.Line, e.Col)
		}
		b.WriteString(": ")
	} else if e.Line > 0 {
		fmt.Fprintf(&b, "line %d column %d: ", e.Line, e.Col)
	}
	b.WriteString(e.Field)
	if e.Value != "" {
		fmt.Fprintf(&b, " = %s", e.Value)
	}
	b.WriteString(": ")
	b.WriteString(e.Reason)
	if e.Hint != "" {
		b.WriteString("; ")
		b.WriteString(e.Hint)
	}
	return b.String()
}

// Unwrap lets errors.Is tell ErrInvalid from ErrUnsupported.
func (e *FieldError) Unwrap() error {
	if e.Unsupported {
		return ErrUnsupported
	}
	return ErrInvalid
}

// Fail returns a FieldError for a field of this job, with its position in the
// file when the job was parsed. Package plan uses it so its refusals name the
// line too.
func (j *Job) Fail(field, value, reason, hint string) *FieldError {
	e := &FieldError{Field: field, Value: value, Reason: reason, Hint: hint}
	if j != nil {
		e.File = j.file
		if p, ok := j.pos[field]; ok {
			e.Line, e.Col = p.Line, p.Col
		} else if p, ok := j.pos[tableOf(field)]; ok {
			e.Line, e.Col = p.Line, p.Col
		}
	}
	return e
}

// tableOf returns the table part of a dotted key ("winding" for "winding.slots").
func tableOf(key string) string {
	if i := strings.LastIndexByte(key, '.'); i >= 0 {
		return key[:i]
	}
	return ""
}

func num(v float64) string { return fmt.Sprintf("%g", v) }
