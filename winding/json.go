package winding

import "encoding/json"

// layoutJSON is the contract shape of `layout --json`; "sequence" is the
// developed layout as signed tokens (SequenceTokens), one per tooth.
type layoutJSON struct {
	Slots               int            `json:"slots"`
	Poles               int            `json:"poles"`
	Phases              int            `json:"phases"`
	Layers              int            `json:"layers"`
	PhaseNames          []string       `json:"phase_names"`
	CoilsPerPhase       int            `json:"coils_per_phase"`
	Q                   string         `json:"q"`
	QValue              float64        `json:"q_value"`
	Periodicity         int            `json:"periodicity"`
	Antiperiodic        bool           `json:"antiperiodic"`
	Symmetry            int            `json:"symmetry_order"`
	LCM                 int            `json:"lcm"`
	CoggingFactor       int            `json:"cogging_factor"`
	RadialForceBalanced bool           `json:"radial_force_balanced"`
	WindingFactor       float64        `json:"winding_factor"`
	PitchFactor         float64        `json:"pitch_factor"`
	DistFactor          float64        `json:"distribution_factor"`
	Harmonics           []harmonicJSON `json:"harmonics"`
	ParallelPaths       []int          `json:"parallel_paths"`
	Paths               int            `json:"paths"`
	Sequence            []string       `json:"sequence"`
	Coils               []coilJSON     `json:"coils"`
	Chains              []chainJSON    `json:"chains"`
	Warnings            []Warning      `json:"warnings"`
}

type harmonicJSON struct {
	Order            int     `json:"order"`
	WindingFactor    float64 `json:"winding_factor"`
	MMFWindingFactor float64 `json:"mmf_winding_factor"`
}

type coilJSON struct {
	Tooth     int    `json:"tooth"`
	Phase     string `json:"phase"`
	Direction string `json:"direction"`
	Path      int    `json:"path"`
	Position  int    `json:"position"`
}

type chainJSON struct {
	Phase   string   `json:"phase"`
	Path    int      `json:"path"`
	Start   string   `json:"start"`
	Finish  string   `json:"finish"`
	Teeth   []int    `json:"teeth"`
	Jumpers []Jumper `json:"jumpers"`
}

// MarshalJSON writes the layout in the shape of the `layout --json` contract.
func (l *Layout) MarshalJSON() ([]byte, error) {
	j := layoutJSON{
		Slots: l.Spec.Slots, Poles: l.Spec.Poles, Phases: l.Spec.Phases, Layers: l.Spec.Layers,
		PhaseNames: l.PhaseNames, CoilsPerPhase: l.CoilsPerPhase,
		Q: l.Q.String(), QValue: l.Q.Float(),
		Periodicity: l.Periodicity, Antiperiodic: l.Antiperiodic, Symmetry: l.Symmetry,
		LCM: l.LCM, CoggingFactor: l.CoggingFactor, RadialForceBalanced: l.RadialForceBalanced,
		WindingFactor: l.WindingFactor, PitchFactor: l.PitchFactor, DistFactor: l.DistFactor,
		ParallelPaths: l.ParallelPaths, Paths: l.Spec.Paths, Sequence: l.SequenceTokens(),
		Harmonics: make([]harmonicJSON, len(l.Harmonics)),
		Coils:     make([]coilJSON, len(l.Coils)),
		Chains:    make([]chainJSON, len(l.Chains)),
		Warnings:  l.Warnings,
	}
	if j.Warnings == nil {
		j.Warnings = []Warning{}
	}
	for i, h := range l.Harmonics {
		j.Harmonics[i] = harmonicJSON(h)
	}
	for i, c := range l.Coils {
		j.Coils[i] = coilJSON{c.Tooth, l.PhaseNames[c.Phase], c.Direction.String(), c.Path, c.Position}
	}
	for i, ch := range l.Chains {
		j.Chains[i] = chainJSON{Phase: l.PhaseNames[ch.Phase], Path: ch.Path, Start: ch.Start, Finish: ch.Finish,
			Teeth: ch.Teeth, Jumpers: ch.Jumpers}
	}
	return json.Marshal(j)
}

// MarshalText writes "cw" or "ccw".
func (d Direction) MarshalText() ([]byte, error) { return []byte(d.String()), nil }

// MarshalText writes "star" or "delta".
func (c Connection) MarshalText() ([]byte, error) { return []byte(c.String()), nil }
