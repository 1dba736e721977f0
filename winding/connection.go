package winding

import "fmt"

// Connection is how the phases join: star (wye) or delta (mesh).
type Connection int

const (
	Star Connection = iota
	Delta
)

func (c Connection) String() string {
	if c == Delta {
		return "delta"
	}
	return "star"
}

// ParseConnection reads "star" or "delta" (also "wye", "y", "mesh", "d").
func ParseConnection(s string) (Connection, error) {
	switch s {
	case "star", "wye", "y", "Y":
		return Star, nil
	case "delta", "mesh", "d", "D":
		return Delta, nil
	}
	return Star, fmt.Errorf("winding: connection %q: must be \"star\" or \"delta\"", s)
}

// Joint is one connection made at the terminals: the marks joined together,
// and the line lead (if any) taken out from it.
type Joint struct {
	Marks []string // e.g. ["U2", "V2", "W2"] for a star point
	Line  string   // line lead name for a delta corner ("U" for U1+W2), "" for the star point
	What  string   // plain words
}

// Joints lists the joints a connection needs for the given phase names
// (IEC 60034-8 marks: X1 is a phase's start, X2 its finish). Parallel paths are
// joined first at each mark: all path starts at X1, all finishes at X2.
//
// Star: X1 of every phase is a line lead; every X2 joins at the star point.
// Delta: the finish of each phase joins the start of the next in sequence
// (U2-V1, V2-W1, W2-U1), and each joint is a line lead.
func Joints(c Connection, names []string) []Joint {
	m := len(names)
	if c == Star {
		marks := make([]string, m)
		for i, n := range names {
			marks[i] = n + "2"
		}
		return []Joint{{Marks: marks, What: "star point: join all phase finishes; insulate; not brought out"}}
	}
	out := make([]Joint, m)
	for i, n := range names {
		next := names[(i+1)%m]
		out[i] = Joint{Marks: []string{n + "2", next + "1"}, Line: next,
			What: fmt.Sprintf("delta corner: join %s2 to %s1 and take out line lead %s", n, next, next)}
	}
	return out
}
