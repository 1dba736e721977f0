package main

import (
	"fmt"
	"io"
	"strings"

	"github.com/spf13/cobra"

	"coilwright/winding"
)

func init() { register(newLayoutCmd) }

func newLayoutCmd() *cobra.Command {
	var s winding.Spec
	var asJSON bool
	c := &cobra.Command{
		Use:   "layout --slots Q --poles 2P [--phases 3] [--layers 2] [--paths A]",
		Short: "Lay out and analyse the tooth-coil winding of one slot/pole pair",
		Long: `layout finds the balanced tooth-coil winding of highest fundamental winding
factor for Q slots and 2p poles by the star of slots, and reports the phase and
direction of every coil, the parallel paths, the order in which each path is
wound, and the figures: winding factors by spatial order, q, periodicity,
LCM(Q, 2p), cogging factor and radial-force balance.

Teeth are numbered 1..Q counter-clockwise seen from the lead end. In the
developed sequence each tooth shows its phase letter with a sign: "+U" a coil of
phase U wound clockwise (seen from the air gap, following the path from its start
terminal), "-U" counter-clockwise, and "0" an unwound tooth of a single-layer
winding. The --json "sequence" field holds the same tokens as an array.`,
		Example: `  coilwright layout --slots 12 --poles 10
  coilwright layout --slots 24 --poles 28 --paths 2 --json
  coilwright layout --slots 24 --poles 22 --layers 1`,
		Args: exactArgs(0),
		RunE: func(cmd *cobra.Command, _ []string) error {
			for _, f := range []string{"slots", "poles"} {
				if !cmd.Flags().Changed(f) {
					return badInputf("--%s is required (e.g. --slots 12 --poles 10)", f)
				}
			}
			// A zero given on the command line is refused, not taken as the
			// default (winding.Spec reads 0 as "not given").
			for _, z := range []struct {
				name, want string
				v          int
			}{{"phases", "an odd number, 3 or more, e.g. --phases 3", s.Phases},
				{"layers", "1 (alternate teeth wound) or 2 (every tooth wound)", s.Layers},
				{"paths", "1 or more parallel paths per phase, e.g. --paths 1", s.Paths}} {
				if cmd.Flags().Changed(z.name) && z.v == 0 {
					return badInputf("--%s 0: give %s", z.name, z.want)
				}
			}
			l, err := winding.Design(s)
			if err != nil {
				return badInput(err)
			}
			if asJSON {
				return writeJSON(cmd.OutOrStdout(), l)
			}
			writeLayoutText(cmd.OutOrStdout(), l)
			return nil
		},
	}
	f := c.Flags()
	f.IntVar(&s.Slots, "slots", 0, "number of slots Q (= teeth)")
	f.IntVar(&s.Poles, "poles", 0, "number of rotor poles 2p (even)")
	f.IntVar(&s.Phases, "phases", 3, "number of phases m (odd, 3 or more)")
	f.IntVar(&s.Layers, "layers", 2, "2: every tooth wound; 1: alternate teeth wound")
	f.IntVar(&s.Paths, "paths", 1, "parallel paths per phase")
	f.BoolVar(&asJSON, "json", false, "print the layout as JSON")
	return c
}

func writeLayoutText(w io.Writer, l *winding.Layout) {
	s := l.Spec
	layers := "double layer (every tooth wound)"
	if s.Layers == 1 {
		layers = "single layer (odd teeth wound)"
	}
	fmt.Fprintf(w, "%d slots / %d poles, %d phases, %s, %d path(s) per phase\n\n", s.Slots, s.Poles, s.Phases, layers, s.Paths)
	fmt.Fprintf(w, "Developed, tooth 1 to %d:\n  %s\n  %s\n\n", s.Slots, l.Sequence(), winding.SenseLegend)

	fmt.Fprintln(w, "Figures")
	row := func(k, v string) { fmt.Fprintf(w, "  %-28s %s\n", k, v) }
	row("winding factor (order p)", fmt.Sprintf("%.4f  (pitch %.4f x distribution %.4f)", l.WindingFactor, l.PitchFactor, l.DistFactor))
	row("q = Q/(2p m)", fmt.Sprintf("%s = %.4f", l.Q, l.Q.Float()))
	row("coils per phase", fmt.Sprint(l.CoilsPerPhase))
	row("periodicity t = gcd(Q,p)", fmt.Sprintf("%d%s", l.Periodicity, map[bool]string{true: ", antiperiodic", false: ""}[l.Antiperiodic]))
	row("rotational symmetry", fmt.Sprintf("order %d", l.Symmetry))
	row("radial forces", map[bool]string{true: "balanced", false: "UNBALANCED (no rotational symmetry)"}[l.RadialForceBalanced])
	row("LCM(Q, 2p)", fmt.Sprintf("%d cogging periods per revolution", l.LCM))
	row("cogging factor 2pQ/LCM", fmt.Sprintf("%d  (lower is better)", l.CoggingFactor))
	row("feasible parallel paths", winding.NumberList(l.ParallelPaths))
	fmt.Fprintln(w)

	fmt.Fprintln(w, "Strongest MMF orders (spatial order = pole pairs of the wave)")
	fmt.Fprintln(w, "  order  phase k_w  MMF k_w")
	for _, h := range strongestHarmonics(l, 8) {
		mark := ""
		switch {
		case h.Order == s.PolePairs():
			mark = "  working"
		case h.Order < s.PolePairs():
			mark = "  sub-harmonic"
		}
		fmt.Fprintf(w, "  %5d  %9.4f  %7.4f%s\n", h.Order, h.WindingFactor, h.MMFWindingFactor, mark)
	}
	fmt.Fprintln(w)

	fmt.Fprintln(w, "Coils")
	fmt.Fprintln(w, "  tooth  phase  dir  path  position")
	for _, c := range l.Coils {
		fmt.Fprintf(w, "  %5d  %5s  %-3s  %4d  %8d\n", c.Tooth, l.PhaseNames[c.Phase], c.Direction, c.Path, c.Position)
	}
	fmt.Fprintln(w)

	fmt.Fprintln(w, "Winding order (one continuous wire per path, jumpers at the lead end)")
	for _, ch := range l.Chains {
		var b strings.Builder
		for i, t := range ch.Teeth {
			c, _ := l.CoilOn(t)
			if i > 0 {
				fmt.Fprintf(&b, " -(%d)-> ", ch.Jumpers[i-1].Span)
			}
			fmt.Fprintf(&b, "%d%s", t, c.Direction)
		}
		fmt.Fprintf(w, "  %s path %d: %s  %s  %s\n", l.PhaseNames[ch.Phase], ch.Path, ch.Start, b.String(), ch.Finish)
	}
	fmt.Fprintln(w, "  (-(n)-> is a jumper spanning n teeth)")
	fmt.Fprintln(w)
	fmt.Fprintln(w, "Terminals (parallel paths joined first: all path starts at X1, all finishes at X2)")
	for _, c := range []winding.Connection{winding.Star, winding.Delta} {
		var parts []string
		for _, j := range winding.Joints(c, l.PhaseNames) {
			parts = append(parts, strings.Join(j.Marks, "+"))
		}
		line := "star point " + parts[0] + ", line leads " + strings.Join(startMarks(l.PhaseNames), " ")
		if c == winding.Delta {
			line = "corners " + strings.Join(parts, ", ") + ", each a line lead"
		}
		fmt.Fprintf(w, "  %-6s %s\n", c, line)
	}
	if len(l.Warnings) > 0 {
		fmt.Fprintln(w)
		fmt.Fprintln(w, "Warnings")
		for _, wr := range l.Warnings {
			fmt.Fprintf(w, "  ! %s\n", wr.Message)
		}
	}
}

func startMarks(names []string) []string {
	out := make([]string, len(names))
	for i, n := range names {
		out[i] = n + "1"
	}
	return out
}

// strongestHarmonics returns the n orders of largest MMF winding factor, in
// order of spatial order.
func strongestHarmonics(l *winding.Layout, n int) []winding.Harmonic {
	hs := append([]winding.Harmonic(nil), l.Harmonics...)
	// selection of the n largest, stable by order
	var out []winding.Harmonic
	for len(out) < n {
		best := -1
		for i, h := range hs {
			if h.MMFWindingFactor <= 1e-9 {
				continue
			}
			if best < 0 || h.MMFWindingFactor > hs[best].MMFWindingFactor+1e-12 {
				best = i
			}
		}
		if best < 0 {
			break
		}
		out = append(out, hs[best])
		hs[best].MMFWindingFactor = 0
	}
	for i := 1; i < len(out); i++ {
		for j := i; j > 0 && out[j].Order < out[j-1].Order; j-- {
			out[j], out[j-1] = out[j-1], out[j]
		}
	}
	return out
}
