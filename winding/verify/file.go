package verify

import (
	"bytes"
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/pelletier/go-toml/v2"
)

// readingsFile is the measurements file: TOML with the same names as the
// check command's flags (underscores for dashes). An open circuit is written
// "OL" as the meter shows it (or "open", or inf).
type readingsFile struct {
	Temp     *float64 `toml:"temp"`
	UV       any      `toml:"uv"`
	VW       any      `toml:"vw"`
	WU       any      `toml:"wu"`
	PerPhase []any    `toml:"per_phase"`
	LeadOhm  float64  `toml:"lead_ohm"`
	FourWire bool     `toml:"four_wire"`

	Insulation *struct {
		IR1   float64 `toml:"ir1"`
		IR10  float64 `toml:"ir10"`
		Volts float64 `toml:"volts"`
	} `toml:"insulation"`
	Withstand *struct {
		Passed *bool   `toml:"passed"`
		Volts  float64 `toml:"volts"`
	} `toml:"withstand"`
	// Polarity: the pole seen at each tooth, per phase: U = "1S 2N 7N 8S".
	Polarity map[string]string `toml:"polarity"`
	EMF      *struct {
		UV  float64 `toml:"uv"`
		VW  float64 `toml:"vw"`
		WU  float64 `toml:"wu"`
		RPM float64 `toml:"rpm"`
	} `toml:"emf"`
}

// FileError is a measurements file that cannot be read.
type FileError struct {
	Line   int // 0 when not known
	Reason string
}

func (e *FileError) Error() string {
	if e.Line > 0 {
		return fmt.Sprintf("verify: measurements file line %d: %s", e.Line, e.Reason)
	}
	return "verify: measurements file: " + e.Reason
}

// ParseReadings reads a measurements file. Polarity observations go in a
// [polarity] table, one key per phase: U = "1S 2N 7N 8S". Unknown keys are refused (a
// misspelt key must not pass unnoticed). The second result says whether the
// file gave the temperature. Readings are not validated here: call
// Readings.Validate (Check does).
func ParseReadings(data []byte) (Readings, bool, error) {
	var f readingsFile
	data = bytes.TrimPrefix(data, []byte("\xef\xbb\xbf")) // a UTF-8 byte-order mark is not part of the TOML
	dec := toml.NewDecoder(bytes.NewReader(data)).DisallowUnknownFields()
	if err := dec.Decode(&f); err != nil {
		return Readings{}, false, fileDecodeError(data, err)
	}
	r := Readings{LeadOhm: f.LeadOhm, FourWire: f.FourWire}
	for _, x := range []struct {
		key string
		v   any
		dst *float64
	}{{"uv", f.UV, &r.UV}, {"vw", f.VW, &r.VW}, {"wu", f.WU, &r.WU}} {
		v, err := fileOhm(x.key, x.v)
		if err != nil {
			return Readings{}, false, err
		}
		*x.dst = v
	}
	for i, x := range f.PerPhase {
		v, err := fileOhm(fmt.Sprintf("per_phase[%d]", i+1), x)
		if err != nil {
			return Readings{}, false, err
		}
		r.PerPhase = append(r.PerPhase, v)
	}
	if f.Temp != nil {
		r.TempC = *f.Temp
	}
	if in := f.Insulation; in != nil {
		r.Insulation = &Insulation{IR1MOhm: in.IR1, IR10MOhm: in.IR10, Volts: in.Volts}
	}
	if w := f.Withstand; w != nil {
		if w.Passed == nil {
			return Readings{}, false, &FileError{Reason: "[withstand] needs passed = true or false"}
		}
		r.Withstand = &Withstand{Passed: *w.Passed, Volts: w.Volts}
	}
	if e := f.EMF; e != nil {
		r.EMF = &BackEMF{UV: e.UV, VW: e.VW, WU: e.WU, RPM: e.RPM}
	}
	phases := make([]string, 0, len(f.Polarity))
	for ph := range f.Polarity {
		phases = append(phases, ph)
	}
	sort.Strings(phases)
	for _, ph := range phases {
		obs, err := ParsePhasePoles(ph, f.Polarity[ph])
		if err != nil {
			return Readings{}, false, err
		}
		r.Polarity = append(r.Polarity, obs...)
	}
	return r, f.Temp != nil, nil
}

// fileOhm reads a resistance from the file: a number, or "OL" / "open" for
// an open circuit (+Inf), as the meter shows it and as the flags take it.
func fileOhm(key string, v any) (float64, error) {
	switch x := v.(type) {
	case nil:
		return 0, nil
	case float64:
		return x, nil
	case int64:
		return float64(x), nil
	case string:
		if strings.EqualFold(strings.TrimSpace(x), "ol") || strings.EqualFold(strings.TrimSpace(x), "open") {
			return math.Inf(1), nil
		}
		return 0, &FileError{Reason: fmt.Sprintf("%s = %q: not a resistance; write ohm as a number, or \"OL\" for an open circuit", key, x)}
	}
	return 0, &FileError{Reason: fmt.Sprintf("%s = %v: not a resistance; write ohm as a number, or \"OL\" for an open circuit", key, v)}
}

// FileKey names a reading by its key in the measurements file, for errors
// about a value the file gave: the Field of an InputError ("hv-volts",
// "per-phase U") becomes "[withstand] volts", "per_phase" and so on.
func FileKey(field string) string {
	switch field {
	case "ir1", "ir10":
		return "[insulation] " + field
	case "ir-volts":
		return "[insulation] volts"
	case "hv-volts":
		return "[withstand] volts"
	case "emf-uv", "emf-vw", "emf-wu":
		return "[emf] " + strings.TrimPrefix(field, "emf-")
	case "rpm":
		return "[emf] rpm"
	}
	if rest, ok := strings.CutPrefix(field, "per-phase"); ok {
		return "per_phase" + rest
	}
	return strings.ReplaceAll(field, "-", "_")
}
