package main

import (
	"bufio"
	"bytes"
	"encoding/json"
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
			if sw.Phases == 0 {
				return badInputf("--phases 0: a winding needs at least 3 phases, e.g. --phases 3")
			}
			if top < 0 {
				return badInputf("--top %d: must be 0 (all) or a positive count", top)
			}
			rows, err := winding.RankPairs(sw, nil)
			if err != nil {
				return badInput(err)
			}
			if top > 0 && len(rows) > top {
				rows = rows[:top]
			}
			w := bufio.NewWriterSize(cmd.OutOrStdout(), 64<<10)
			if asJSON {
				err = writePairsJSON(w, rows)
			} else {
				err = writePairsText(w, rows)
			}
			if err != nil {
				return err
			}
			return w.Flush()
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

// pairJSONOf fills p with the figures of one row; paths is reused from row
// to row.
func pairJSONOf(p *pairJSON, r winding.PairRow, paths []int) []int {
	sm := r.Summary(paths)
	*p = pairJSON{sm.Spec.Slots, sm.Spec.Poles, sm.Spec.Layers, sm.Spec.Phases, sm.Q.String(),
		sm.WindingFactor, sm.Periodicity, sm.LCM, sm.CoggingFactor, sm.RadialForceBalanced, sm.ParallelPaths}
	return sm.ParallelPaths
}

// writePairsJSON writes the rows as one JSON array, the bytes writeJSON
// gives for the whole slice of pairJSON, but one row at a time: each row
// goes through encoding/json on its own into a reused buffer, so a sweep of
// hundreds of thousands of pairs never holds its whole text.
func writePairsJSON(w io.Writer, rows []winding.PairRow) error {
	if len(rows) == 0 {
		_, err := io.WriteString(w, "[]\n")
		return err
	}
	var one bytes.Buffer
	enc := json.NewEncoder(&one)
	enc.SetIndent("  ", "  ")
	var p pairJSON
	var paths []int
	if _, err := io.WriteString(w, "[\n"); err != nil {
		return err
	}
	for i, r := range rows {
		paths = pairJSONOf(&p, r, paths)
		one.Reset()
		one.WriteString("  ")
		if err := enc.Encode(&p); err != nil {
			return err
		}
		b := one.Bytes()
		b = b[:len(b)-1] // Encode ends the value with a newline
		if i < len(rows)-1 {
			b = append(b, ',')
		}
		b = append(b, '\n')
		if _, err := w.Write(b); err != nil {
			return err
		}
	}
	_, err := io.WriteString(w, "]\n")
	return err
}

func writePairsText(w io.Writer, rows []winding.PairRow) error {
	fmt.Fprintf(w, "%d feasible pairs, best first\n", len(rows))
	fmt.Fprintln(w, "     Q   2p  layers  q       k_w     t    LCM  cogging  radial      paths")
	var paths []int
	for _, r := range rows {
		p := r.Summary(paths)
		paths = p.ParallelPaths
		bal := "balanced"
		if !p.RadialForceBalanced {
			bal = "UNBALANCED"
		}
		if _, err := fmt.Fprintf(w, "  %4d %4d  %6d  %-6s  %.4f %4d %6d  %7d  %-10s  %s\n",
			p.Spec.Slots, p.Spec.Poles, p.Spec.Layers, p.Q, p.WindingFactor, p.Periodicity, p.LCM,
			p.CoggingFactor, bal, winding.NumberList(p.ParallelPaths)); err != nil {
			return err
		}
	}
	return nil
}
