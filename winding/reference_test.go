package winding

import (
	"errors"
	"math"
	"testing"
)

// Published fundamental winding factors of tooth-coil windings.
// Source: F. Libert, J. Soulard, "Investigation on pole-slot combinations for
// permanent-magnet machines with concentrated windings", ICEM 2004, and
// F. Meier, "Permanent-magnet synchronous machines with non-overlapping
// concentrated windings for low-speed direct-drive applications", KTH thesis,
// 2008 (values from memory; every one is
// re-derived below by the textbook phase-band formula in property_test.go).
func TestPublishedWindingFactors(t *testing.T) {
	cases := []struct {
		slots, poles, layers int
		want                 float64
	}{
		{3, 2, 2, 0.866}, {6, 4, 2, 0.866}, {9, 6, 2, 0.866}, {12, 8, 2, 0.866},
		{9, 8, 2, 0.945}, {9, 10, 2, 0.945}, {18, 16, 2, 0.945},
		{12, 10, 2, 0.933}, {12, 14, 2, 0.933}, {24, 20, 2, 0.933},
		{15, 14, 2, 0.951},
		{18, 14, 2, 0.902},
		{21, 20, 2, 0.953},
		{24, 22, 2, 0.949}, {24, 26, 2, 0.949},
		{12, 10, 1, 0.966}, {12, 14, 1, 0.966},
		{24, 22, 1, 0.958},
	}
	for _, c := range cases {
		l, err := Design(Spec{Slots: c.slots, Poles: c.poles, Layers: c.layers})
		if err != nil {
			t.Errorf("Design(%d/%d %dL) error %v; want k_w %.3f", c.slots, c.poles, c.layers, err, c.want)
			continue
		}
		// Published to three decimals.
		if math.Abs(l.WindingFactor-c.want) > 0.0005+1e-9 {
			t.Errorf("Design(%d/%d %dL).WindingFactor = %.4f; want %.3f", c.slots, c.poles, c.layers, l.WindingFactor, c.want)
		}
	}
}

// Pairs that no balanced tooth-coil winding exists for, and values that are
// not a winding at all. Balanced double-layer condition Q/(m*t) whole, t =
// gcd(Q, p) (Bianchi et al., IEEE Trans. Ind. Appl. 42(4), 2006).
func TestRefusals(t *testing.T) {
	cases := []struct {
		name  string
		spec  Spec
		field string
		kind  error
	}{
		{"10/8 slots not a multiple of 3", Spec{Slots: 10, Poles: 8}, "slots", ErrInfeasible},
		{"12/12 Q = 2p", Spec{Slots: 12, Poles: 12}, "poles", ErrInfeasible},
		{"9/8 single layer, odd Q", Spec{Slots: 9, Poles: 8, Layers: 1}, "slots", ErrInfeasible},
		{"18/12 Q/(m t) = 1 but t = 6: 18/(3*6)", Spec{Slots: 18, Poles: 12}, "", nil},
		{"12/9 odd poles", Spec{Slots: 12, Poles: 9}, "poles", ErrInvalid},
		{"zero slots", Spec{Slots: 0, Poles: 10}, "slots", ErrInvalid},
		{"negative poles", Spec{Slots: 12, Poles: -10}, "poles", ErrInvalid},
		{"two phases", Spec{Slots: 12, Poles: 10, Phases: 2}, "phases", ErrInvalid},
		{"four phases", Spec{Slots: 12, Poles: 10, Phases: 4}, "phases", ErrInvalid},
		{"three layers", Spec{Slots: 12, Poles: 10, Layers: 3}, "layers", ErrInvalid},
		{"3 paths on 12/10", Spec{Slots: 12, Poles: 10, Paths: 3}, "paths", ErrInfeasible},
		{"12/6 all phasors on one line", Spec{Slots: 12, Poles: 6}, "poles", ErrInfeasible},
		{"huge slots", Spec{Slots: 1 << 40, Poles: 10}, "slots", ErrInvalid},
	}
	for _, c := range cases {
		_, err := Design(c.spec)
		if c.kind == nil {
			if err != nil {
				t.Errorf("%s: Design(%v) = %v; want a layout", c.name, c.spec, err)
			}
			continue
		}
		var se *SpecError
		if !errors.As(err, &se) {
			t.Errorf("%s: Design(%v) error = %v; want *SpecError", c.name, c.spec, err)
			continue
		}
		if se.Field != c.field || !errors.Is(err, c.kind) || se.Reason == "" {
			t.Errorf("%s: Design(%v) = field %q kind %v reason %q; want field %q kind %v", c.name, c.spec, se.Field, errors.Unwrap(err), se.Reason, c.field, c.kind)
		}
		if errors.Is(err, ErrInfeasible) && c.field != "paths" && len(se.Nearest) == 0 {
			t.Errorf("%s: Design(%v) suggests no nearest feasible pair", c.name, c.spec)
		}
		for _, n := range se.Nearest {
			if !Feasible(n) {
				t.Errorf("%s: suggested pair %v is not feasible", c.name, n)
			}
		}
	}
}

// 12/10 double layer: the classic developed sequence (Bianchi et al. 2006,
// figure of the 12-slot 10-pole star; from memory), written in the signed form
// "+A -A -B +B +C -C -A +A +B -B -C +C" with U, V, W for A, B, C, and its MMF space harmonics: orders 1, 5, 7, 11,
// 13... (k_w 0.067 at the sub-harmonic 1, 0.933 at 5 and 7; Meier 2008,
// from memory).
func TestTwelveTenLayout(t *testing.T) {
	l, err := Design(Spec{Slots: 12, Poles: 10})
	if err != nil {
		t.Fatal(err)
	}
	if got, want := l.Sequence(), "+U -U -V +V +W -W -U +U +V -V -W +W"; got != want {
		t.Errorf("Sequence() = %q; want %q", got, want)
	}
	want := map[int]float64{1: 0.067, 5: 0.933, 7: 0.933, 11: 0.067, 13: 0.067, 3: 0, 9: 0, 2: 0, 4: 0}
	for order, k := range want {
		got := l.Harmonics[order-1].MMFWindingFactor
		if math.Abs(got-k) > 0.0005 {
			t.Errorf("12/10 MMF k_w at order %d = %.4f; want %.3f", order, got, k)
		}
	}
	if !l.Antiperiodic || l.Symmetry != 2 || !l.RadialForceBalanced {
		t.Errorf("12/10: antiperiodic %v symmetry %d balanced %v; want true 2 true", l.Antiperiodic, l.Symmetry, l.RadialForceBalanced)
	}
	if got := l.ParallelPaths; len(got) != 2 || got[0] != 1 || got[1] != 2 {
		t.Errorf("12/10 ParallelPaths = %v; want [1 2]", got)
	}
}

// 9/8 has no rotational symmetry and so an unbalanced magnetic pull (Zhu,
// Ishak, Howe, Chen, IEEE Trans. Ind. Appl. 2007).
func TestNineEightUnbalanced(t *testing.T) {
	l, err := Design(Spec{Slots: 9, Poles: 8})
	if err != nil {
		t.Fatal(err)
	}
	if l.RadialForceBalanced || l.Symmetry != 1 {
		t.Errorf("9/8: balanced %v symmetry %d; want false 1", l.RadialForceBalanced, l.Symmetry)
	}
	if got, want := l.Sequence(), "+U -U +U +V -V +V +W -W +W"; got != want {
		t.Errorf("9/8 Sequence() = %q; want %q", got, want)
	}
	found := false
	for _, w := range l.Warnings {
		found = found || w.Code == "unbalanced-pull"
	}
	if !found {
		t.Errorf("9/8 warnings %v; want unbalanced-pull", l.Warnings)
	}
}

// Zhu & Howe, IEEE Trans. Energy Convers. 15(4), 2000: cogging periods per
// revolution LCM(Q, 2p), cogging factor 2pQ/LCM = gcd(Q, 2p). Worked by hand:
// 12/10: LCM 60, factor 2; 24/28: LCM 168, factor 4; 9/8: LCM 72, factor 1.
func TestCogging(t *testing.T) {
	cases := []struct{ q, p2, lcm, ct int }{{12, 10, 60, 2}, {24, 28, 168, 4}, {9, 8, 72, 1}, {36, 42, 252, 6}}
	for _, c := range cases {
		l, err := Design(Spec{Slots: c.q, Poles: c.p2})
		if err != nil {
			t.Fatal(err)
		}
		if l.LCM != c.lcm || l.CoggingFactor != c.ct {
			t.Errorf("%d/%d: LCM %d cogging %d; want %d %d", c.q, c.p2, l.LCM, l.CoggingFactor, c.lcm, c.ct)
		}
	}
}

// A five-phase winding: 20 slots, 18 poles. Phase band formula (textbook,
// e.g. Pyrhönen et al., Design of Rotating Electrical Machines, ch. 2):
// Q/t = 20 is even, so the folded star has 10 directions 18 degrees apart and
// each phase takes 2 of them: k_d = sin(2*9)/(2*sin 9) = 0.98769; the coil
// spans one slot pitch: k_p = sin(9*180/20) = 0.98769; k_w = 0.97553.
func TestFivePhase(t *testing.T) {
	l, err := Design(Spec{Slots: 20, Poles: 18, Phases: 5})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(l.WindingFactor-0.97553) > 5e-5 {
		t.Errorf("20/18 m=5 WindingFactor = %.5f; want 0.97553", l.WindingFactor)
	}
	if len(l.PhaseNames) != 5 || l.PhaseNames[4] != "E" || l.CoilsPerPhase != 4 {
		t.Errorf("20/18 m=5: names %v coils per phase %d; want A..E, 4", l.PhaseNames, l.CoilsPerPhase)
	}
	checkBalanceAndSequence(t, l)
}
