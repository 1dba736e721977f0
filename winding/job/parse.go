package job

import (
	"bytes"
	"errors"
	"fmt"
	"os"
	"reflect"
	"regexp"
	"sort"
	"strings"
	"time"

	"github.com/pelletier/go-toml/v2"
)

// MaxFileSize bounds a job file; real ones are a few kilobytes.
const MaxFileSize = 1 << 20

// Parse reads a job from TOML, fills the defaults and validates every field.
// name is used in messages (a file name, or "" ). Errors are *FieldError
// naming the field, its line and column, why, and what would work.
func Parse(data []byte, name string) (*Job, error) {
	if len(data) > MaxFileSize {
		return nil, &FieldError{File: name, Field: "(file)", Value: fmt.Sprintf("%d bytes", len(data)),
			Reason: "too large for a job file", Hint: fmt.Sprintf("a job file is a few kilobytes; the limit is %d bytes", MaxFileSize)}
	}
	// A UTF-8 byte-order mark, as some editors write at the start of a file,
	// is not part of the TOML: read past it. UTF-16 is refused saying so.
	data = bytes.TrimPrefix(data, []byte("\xef\xbb\xbf"))
	if bytes.HasPrefix(data, []byte("\xff\xfe")) || bytes.HasPrefix(data, []byte("\xfe\xff")) {
		return nil, &FieldError{File: name, Field: "(file)", Reason: "is UTF-16 text (it starts with a UTF-16 byte-order mark); a job file is UTF-8",
			Hint: "save the file as UTF-8 in the editor"}
	}
	if len(bytes.TrimSpace(data)) == 0 {
		return nil, &FieldError{File: name, Field: "(file)", Reason: "is empty",
			Hint: "`coilwright new -o FILE` writes a commented job file to start from"}
	}
	j := &Job{}
	dec := toml.NewDecoder(bytes.NewReader(data)).DisallowUnknownFields()
	if err := dec.Decode(j); err != nil {
		return nil, decodeError(err, name)
	}
	j.file = name
	j.pos = positions(data)
	if !j.Date.IsZero() {
		y, m, d := j.Date.Date()
		j.Date = time.Date(y, m, d, 0, 0, 0, 0, time.UTC)
	}
	j.Normalize()
	if err := j.Validate(); err != nil {
		return nil, err
	}
	return j, nil
}

// Load reads and parses one job file.
func Load(path string) (*Job, error) {
	st, err := os.Stat(path)
	if err != nil {
		return nil, &FieldError{File: path, Field: "(file)", Reason: "cannot read the job file: " + pathReason(err),
			Hint: "give the path of a job file; `coilwright new -o FILE` writes one"}
	}
	if st.IsDir() {
		return nil, &FieldError{File: path, Field: "(file)", Reason: "is a directory, not a job file"}
	}
	if st.Size() > MaxFileSize {
		return nil, &FieldError{File: path, Field: "(file)", Value: fmt.Sprintf("%d bytes", st.Size()),
			Reason: "too large for a job file", Hint: fmt.Sprintf("the limit is %d bytes", MaxFileSize)}
	}
	data, err := os.ReadFile(path)
	if err != nil {
		return nil, &FieldError{File: path, Field: "(file)", Reason: "cannot read the job file: " + pathReason(err)}
	}
	return Parse(data, path)
}

func pathReason(err error) string {
	var pe *os.PathError
	if errors.As(err, &pe) {
		return pe.Err.Error()
	}
	return err.Error()
}

// decodeError turns a go-toml error into a FieldError with the key and place.
func decodeError(err error, name string) error {
	var sm *toml.StrictMissingError
	if errors.As(err, &sm) && len(sm.Errors) > 0 {
		de := sm.Errors[0]
		line, col := de.Position()
		key := strings.Join(de.Key(), ".")
		table := tableOf(key)
		where := "at the top level"
		if table != "" {
			where = "in [" + table + "]"
		}
		fe := &FieldError{File: name, Field: key, Line: line, Col: col,
			Reason: fmt.Sprintf("unknown key %q %s", lastPart(key), where)}
		if known := knownKeys(table); len(known) > 0 {
			fe.Hint = "known keys there: " + strings.Join(known, ", ")
		}
		if len(sm.Errors) > 1 {
			fe.Reason += fmt.Sprintf(" (and %d more unknown keys)", len(sm.Errors)-1)
		}
		return fe
	}
	var de *toml.DecodeError
	if errors.As(err, &de) {
		line, col := de.Position()
		key := strings.Join(de.Key(), ".")
		msg := friendlyType(strings.TrimPrefix(de.Error(), "toml: "))
		fe := &FieldError{File: name, Field: key, Line: line, Col: col, Reason: msg}
		if key == "date" {
			fe.Reason = "must be a TOML date"
			fe.Hint = "write it without quotes, e.g. date = 2026-11-20"
		}
		if key == "" {
			fe.Field = "(syntax)"
			fe.Hint = "the file is not valid TOML there: each line is `key = value`, tables are `[name]`, text is in double quotes"
		}
		return fe
	}
	// Type mismatches come as plain errors mentioning the Go field; keep the
	// words and say it is the type.
	return &FieldError{File: name, Field: "(file)", Reason: strings.TrimPrefix(err.Error(), "toml: "),
		Hint: "check that numbers are written without quotes and text with quotes"}
}

func lastPart(key string) string {
	if i := strings.LastIndexByte(key, '.'); i >= 0 {
		return key[i+1:]
	}
	return key
}

// knownKeys lists the TOML keys of the table at a dotted path of Job.
func knownKeys(table string) []string {
	t := reflect.TypeOf(Job{})
	if table != "" {
		for _, part := range strings.Split(table, ".") {
			f, ok := fieldByTag(t, part)
			if !ok {
				return nil
			}
			t = f.Type
			for t.Kind() == reflect.Pointer {
				t = t.Elem()
			}
			if t.Kind() != reflect.Struct {
				return nil
			}
		}
	}
	var out []string
	for i := 0; i < t.NumField(); i++ {
		if tag := t.Field(i).Tag.Get("toml"); tag != "" {
			out = append(out, tag)
		}
	}
	sort.Strings(out)
	return out
}

func fieldByTag(t reflect.Type, tag string) (reflect.StructField, bool) {
	for i := 0; i < t.NumField(); i++ {
		if t.Field(i).Tag.Get("toml") == tag {
			return t.Field(i), true
		}
	}
	return reflect.StructField{}, false
}

// typeWords are the plain names of the Go types of Job fields.
var typeWords = map[string]string{
	"int": "a whole number", "float64": "a number", "string": "text in double quotes",
	"bool": "true or false", "time.Time": "a date (YYYY-MM-DD)", "*int": "a whole number",
	"*float64": "a number",
}

var decodeTypeRE = regexp.MustCompile(`^cannot decode TOML (\w[\w ]*?) into struct field \S+ of type (\S+)$`)

// friendlyType rewords go-toml's type mismatch in the user's terms.
func friendlyType(msg string) string {
	m := decodeTypeRE.FindStringSubmatch(msg)
	if m == nil {
		return msg
	}
	want, ok := typeWords[m[2]]
	if !ok {
		want = "a table"
	}
	return fmt.Sprintf("the value is a TOML %s, but %s is needed here", m[1], want)
}
