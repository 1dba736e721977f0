package plan

import "encoding/json"

// stepJumperJSON writes a jumper in the snake_case keys of the layout
// contract (winding.Jumper itself has no JSON names).
type stepJumperJSON struct {
	FromTooth     int  `json:"from_tooth"`
	ToTooth       int  `json:"to_tooth"`
	Span          int  `json:"span_teeth"`
	ReversesSense bool `json:"reverses_sense"`
}

// MarshalJSON writes a step with its jumper in the contract's key style.
func (s Step) MarshalJSON() ([]byte, error) {
	type plain Step // no methods: avoids recursion
	out := struct {
		plain
		Jumper *stepJumperJSON `json:"jumper,omitempty"`
	}{plain: plain(s)}
	if s.Jumper != nil {
		out.Jumper = &stepJumperJSON{s.Jumper.FromTooth, s.Jumper.ToTooth, s.Jumper.Span, s.Jumper.ReversesSense}
	}
	return json.Marshal(out)
}
