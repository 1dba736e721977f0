package verify

import (
	"bytes"
	"errors"
	"fmt"
	"strings"

	"github.com/pelletier/go-toml/v2"
)

// fileKeys are the keys of the measurements file, by table ("" is the top of
// the file), as its errors list them.
var fileKeys = map[string][]string{
	"":           {"temp", "uv", "vw", "wu", "per_phase", "lead_ohm", "four_wire"},
	"insulation": {"ir1", "ir10", "volts"},
	"withstand":  {"passed", "volts"},
	"emf":        {"uv", "vw", "wu", "rpm"},
	"polarity":   {"one key per phase, e.g. U = \"1S 2N 7N 8S\""},
}

// fileKeyWants says what a key of the measurements file takes.
var fileKeyWants = map[string]string{
	"uv": "ohm as a number, or \"OL\" for an open circuit", "vw": "ohm as a number, or \"OL\" for an open circuit",
	"wu": "ohm as a number, or \"OL\" for an open circuit", "per_phase": "three resistances in ohm, e.g. [0.143, 0.143, \"OL\"]",
	"temp": "the winding temperature in °C as a number", "lead_ohm": "the meter leads' resistance in ohm as a number",
	"four_wire": "true or false", "[insulation] ir1": "MΩ as a number", "[insulation] ir10": "MΩ as a number",
	"[insulation] volts": "the test voltage in V DC as a number", "[withstand] passed": "true or false",
	"[withstand] volts": "the test voltage in V AC as a number", "[emf] uv": "V rms as a number",
	"[emf] vw": "V rms as a number", "[emf] wu": "V rms as a number", "[emf] rpm": "the speed in rpm as a number",
}

// fileDecodeError says what is wrong with a measurements file in the file's
// own words: the key as written, its table and line, and what would work,
// never the program's field names or types.
func fileDecodeError(data []byte, err error) *FileError {
	var sm *toml.StrictMissingError
	if errors.As(err, &sm) && len(sm.Errors) > 0 {
		e := sm.Errors[0]
		line, _ := e.Position()
		key := e.Key()
		table, where := "", "at the top of the file"
		if len(key) > 1 {
			table = strings.Join(key[:len(key)-1], ".")
			where = "in [" + table + "]"
		}
		name := ""
		if len(key) > 0 {
			name = key[len(key)-1]
		}
		reason := fmt.Sprintf("unknown key %q %s", name, where)
		if known := fileKeys[table]; len(known) > 0 {
			reason += "; the keys there: " + strings.Join(known, ", ")
		}
		if len(sm.Errors) > 1 {
			reason += fmt.Sprintf(" (and %d more unknown keys)", len(sm.Errors)-1)
		}
		return &FileError{Line: line, Reason: reason}
	}
	var de *toml.DecodeError
	if errors.As(err, &de) {
		line, _ := de.Position()
		msg := strings.TrimPrefix(de.Error(), "toml: ")
		if strings.Contains(msg, "cannot decode") || strings.Contains(msg, "struct field") {
			// a value of the wrong kind: name the key as the line writes it
			key, table := keyOnLine(data, line)
			full := key
			if table != "" {
				full = "[" + table + "] " + key
			}
			msg = fmt.Sprintf("%s: not the kind of value it takes", full)
			if want := fileKeyWants[full]; want != "" {
				msg = fmt.Sprintf("%s takes %s", full, want)
			}
		}
		return &FileError{Line: line, Reason: msg}
	}
	return &FileError{Reason: strings.TrimPrefix(err.Error(), "toml: ")}
}

// keyOnLine finds the key written on line n (1-based) of a TOML file and the
// table it stands in.
func keyOnLine(data []byte, n int) (key, table string) {
	for i, l := range bytes.Split(data, []byte("\n")) {
		t := strings.TrimSpace(string(l))
		if strings.HasPrefix(t, "[") && strings.HasSuffix(t, "]") {
			table = strings.TrimSpace(strings.Trim(t, "[]"))
		}
		if i+1 == n {
			k, _, _ := strings.Cut(t, "=")
			return strings.TrimSpace(k), table
		}
	}
	return "", ""
}
