package winding

import "testing"

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
