package winding

import (
	"fmt"
	"testing"
)

// Target (issue): layout and full analysis of a 60-slot / 56-pole pair under
// 50 µs.
func BenchmarkDesign60x56(b *testing.B) {
	s := Spec{Slots: 60, Poles: 56}
	for b.Loop() {
		if _, err := Design(s); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkDesign120x116(b *testing.B) {
	s := Spec{Slots: 120, Poles: 116, Paths: 2}
	for b.Loop() {
		if _, err := Design(s); err != nil {
			b.Fatal(err)
		}
	}
}

// Target (issue): the whole `pairs` sweep Q <= 120, 2p <= 120, both layers,
// under 0.3 s as a process; this is the in-process part.
func BenchmarkPairs120(b *testing.B) {
	sw := Sweep{MaxSlots: 120, MaxPoles: 120, Layers: []int{1, 2}}
	for b.Loop() {
		if _, err := Pairs(sw); err != nil {
			b.Fatal(err)
		}
	}
}

// Target (issue): the sweep at the arithmetic floor with no allocation per
// pair. The rows go into one slice reused from run to run, as a caller that
// sweeps again would pass it back; what is left per run is the workers'
// buffers and job list, not a count per pair.
func BenchmarkRankPairs(b *testing.B) {
	for _, n := range []int{120, 480, 720} {
		b.Run(fmt.Sprintf("N=%d", n), func(b *testing.B) {
			sw := Sweep{MaxSlots: n, MaxPoles: n, Layers: []int{1, 2}}
			rows, err := RankPairs(sw, nil)
			if err != nil {
				b.Fatal(err)
			}
			b.ReportAllocs()
			for b.Loop() {
				if rows, err = RankPairs(sw, rows[:0]); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(float64(len(rows)), "pairs")
		})
	}
}
