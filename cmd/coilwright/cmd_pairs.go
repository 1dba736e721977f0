package main

import (
	"fmt"
	"io"
	"strconv"
	"strings"

	"github.com/spf13/cobra"

	"coilwright/winding"
)

func init() { register(newPairsCmd) }

func newPairsCmd() *cobra.Command {
	var sw winding.Sweep
	var layers string
	var asJSON bool
	var top int
	c := &cobra.Command{
		Use:   "pairs --max-slots N --max-poles M [--layers 1,2] [--phases 3]",
		Short: "List every feasible slot/pole pair in a range, best first",
		Long: `pairs lays out every slot/pole pair with Q <= N and 2p <= M for the given
layer counts and keeps those with a balanced winding.

Ranking, best first: higher fundamental winding factor; then lower cogging
factor 2pQ/LCM(Q,2p) (Zhu & Howe: more, smaller cogging periods); then
radially balanced before unbalanced; then more parallel-path options; then
fewer slots, fewer poles, two layers before one.`,
		Example: `  coilwright pairs --max-slots 36 --max-poles 40
  coilwright pairs --max-slots 120 --max-poles 120 --balanced-only --min-winding-factor 0.93 --json`,
		Args: exactArgs(0),
		RunE: func(cmd *cobra.Command, _ []string) error {
			for _, f := range []string{"max-slots", "max-poles"} {
				if !cmd.Flags().Changed(f) {
					return badInputf("--%s is required (e.g. --max-slots 36 --max-poles 40)", f)
				}
			}
			ls, err := parseLayers(layers)
			if err != nil {
				return badInput(err)
			}
			sw.Layers = ls
			if sw.MinWindingFactor < 0 || sw.MinWindingFactor > 1 {
				return badInputf("--min-winding-factor %g: a winding factor lies between 0 and 1", sw.MinWindingFactor)
			}
			if top < 0 {
				return badInputf("--top %d: must be 0 (all) or a positive count", top)
			}
			ps, err := winding.Pairs(sw)
			if err != nil {
				return badInput(err)
			}
			if top > 0 && len(ps) > top {
				ps = ps[:top]
			}
			if asJSON {
				_, err := cmd.OutOrStdout().Write(appendPairsJSON(nil, pairsJSON(ps)))
				return err
			}
			writePairsText(cmd.OutOrStdout(), ps)
			return nil
		},
	}
	f := c.Flags()
	f.IntVar(&sw.MaxSlots, "max-slots", 0, "largest slot count Q")
	f.IntVar(&sw.MaxPoles, "max-poles", 0, "largest pole count 2p")
	f.IntVar(&sw.Phases, "phases", 3, "number of phases (odd)")
	f.StringVar(&layers, "layers", "1,2", "layer counts to include: 1, 2 or 1,2")
	f.Float64Var(&sw.MinWindingFactor, "min-winding-factor", 0, "keep pairs with at least this fundamental winding factor")
	f.BoolVar(&sw.BalancedOnly, "balanced-only", false, "keep only pairs whose radial forces cancel")
	f.IntVar(&top, "top", 0, "show only the best N (0: all)")
	f.BoolVar(&asJSON, "json", false, "print the pairs as a JSON array")
	return c
}

func parseLayers(s string) ([]int, error) {
	var out []int
	for _, part := range strings.Split(s, ",") {
		part = strings.TrimSpace(part)
		n, err := strconv.Atoi(part)
		if err != nil || (n != 1 && n != 2) {
			return nil, fmt.Errorf("--layers %q: each entry must be 1 or 2, e.g. --layers 1,2", s)
		}
		if !contains(out, n) {
			out = append(out, n)
		}
	}
	return out, nil
}

func contains(xs []int, v int) bool {
	for _, x := range xs {
		if x == v {
			return true
		}
	}
	return false
}

type pairJSON struct {
	Slots               int     `json:"slots"`
	Poles               int     `json:"poles"`
	Layers              int     `json:"layers"`
	Phases              int     `json:"phases"`
	Q                   string  `json:"q"`
	WindingFactor       float64 `json:"winding_factor"`
	Periodicity         int     `json:"periodicity"`
	LCM                 int     `json:"lcm"`
	CoggingFactor       int     `json:"cogging_factor"`
	RadialForceBalanced bool    `json:"radial_force_balanced"`
	ParallelPaths       []int   `json:"parallel_paths"`
}

func pairsJSON(ps []winding.Summary) []pairJSON {
	out := make([]pairJSON, len(ps))
	for i, p := range ps {
		out[i] = pairJSON{p.Spec.Slots, p.Spec.Poles, p.Spec.Layers, p.Spec.Phases, p.Q.String(),
			p.WindingFactor, p.Periodicity, p.LCM, p.CoggingFactor, p.RadialForceBalanced, p.ParallelPaths}
	}
	return out
}

// appendPairsJSON writes the pairs exactly as encoding/json with a two-space
// indent would (a test holds it to that), several times faster: a full sweep
// lists thousands of pairs and the encoding was half the command's time.
func appendPairsJSON(b []byte, ps []pairJSON) []byte {
	if len(ps) == 0 {
		return append(b, "[]\n"...)
	}
	b = append(b, "[\n"...)
	for i, p := range ps {
		b = append(b, "  {\n"...)
		b = appendIntField(b, "slots", p.Slots)
		b = appendIntField(b, "poles", p.Poles)
		b = appendIntField(b, "layers", p.Layers)
		b = appendIntField(b, "phases", p.Phases)
		b = append(b, `    "q": `...)
		b = strconv.AppendQuote(b, p.Q)
		b = append(b, ",\n"...)
		b = append(b, `    "winding_factor": `...)
		b = appendJSONFloat(b, p.WindingFactor)
		b = append(b, ",\n"...)
		b = appendIntField(b, "periodicity", p.Periodicity)
		b = appendIntField(b, "lcm", p.LCM)
		b = appendIntField(b, "cogging_factor", p.CoggingFactor)
		b = append(b, `    "radial_force_balanced": `...)
		b = strconv.AppendBool(b, p.RadialForceBalanced)
		b = append(b, ",\n"...)
		b = append(b, `    "parallel_paths": `...)
		switch {
		case p.ParallelPaths == nil:
			b = append(b, "null"...)
		case len(p.ParallelPaths) == 0:
			b = append(b, "[]"...)
		default:
			b = append(b, "[\n"...)
			for k, a := range p.ParallelPaths {
				b = append(b, "      "...)
				b = strconv.AppendInt(b, int64(a), 10)
				if k < len(p.ParallelPaths)-1 {
					b = append(b, ',')
				}
				b = append(b, '\n')
			}
			b = append(b, "    ]"...)
		}
		b = append(b, "\n  }"...)
		if i < len(ps)-1 {
			b = append(b, ',')
		}
		b = append(b, '\n')
	}
	return append(b, "]\n"...)
}

func appendIntField(b []byte, name string, v int) []byte {
	b = append(b, `    "`...)
	b = append(b, name...)
	b = append(b, `": `...)
	b = strconv.AppendInt(b, int64(v), 10)
	return append(b, ",\n"...)
}

// appendJSONFloat formats a float64 as encoding/json does: the shortest
// representation, in exponent form below 1e-6 and from 1e21.
func appendJSONFloat(b []byte, f float64) []byte {
	abs := f
	if abs < 0 {
		abs = -abs
	}
	fmtByte := byte('f')
	if abs != 0 && (abs < 1e-6 || abs >= 1e21) {
		fmtByte = 'e'
	}
	b = strconv.AppendFloat(b, f, fmtByte, -1, 64)
	if fmtByte == 'e' {
		// clean up e-09 to e-9, as encoding/json does
		n := len(b)
		if n >= 4 && b[n-4] == 'e' && b[n-3] == '-' && b[n-2] == '0' {
			b[n-2] = b[n-1]
			b = b[:n-1]
		}
	}
	return b
}

func writePairsText(w io.Writer, ps []winding.Summary) {
	fmt.Fprintf(w, "%d feasible pairs, best first\n", len(ps))
	fmt.Fprintln(w, "     Q   2p  layers  q       k_w     t    LCM  cogging  radial      paths")
	for _, p := range ps {
		bal := "balanced"
		if !p.RadialForceBalanced {
			bal = "UNBALANCED"
		}
		fmt.Fprintf(w, "  %4d %4d  %6d  %-6s  %.4f %4d %6d  %7d  %-10s  %s\n",
			p.Spec.Slots, p.Spec.Poles, p.Spec.Layers, p.Q, p.WindingFactor, p.Periodicity, p.LCM,
			p.CoggingFactor, bal, winding.NumberList(p.ParallelPaths))
	}
}
