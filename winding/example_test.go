package winding_test

import (
	"errors"
	"fmt"

	"coilwright/winding"
)

func ExampleDesign() {
	l, err := winding.Design(winding.Spec{Slots: 12, Poles: 10})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(l.Sequence())
	fmt.Printf("k_w = %.3f, q = %s, t = %d, LCM = %d, paths %v\n",
		l.WindingFactor, l.Q, l.Periodicity, l.LCM, l.ParallelPaths)
	// Output:
	// +U -U -V +V +W -W -U +U +V -V -W +W
	// k_w = 0.933, q = 2/5, t = 1, LCM = 60, paths [1 2]
}

func ExampleDesign_refused() {
	_, err := winding.Design(winding.Spec{Slots: 12, Poles: 12})
	fmt.Println(errors.Is(err, winding.ErrInfeasible))
	fmt.Println(err)
	// Output:
	// true
	// winding: poles = 12: no balanced double-layer winding exists for 12 slots and 12 poles (Q/(m*t) = 12/(3*6) is not a whole number, t = gcd(Q, p)); nearest feasible pairs: 12/10, 12/14, 9/12, 12/8
}

func ExampleLayout_ChainOf() {
	l, _ := winding.Design(winding.Spec{Slots: 24, Poles: 28, Paths: 2})
	ch, _ := l.ChainOf(0, 1)
	fmt.Println(ch.Start, ch.Teeth, ch.Finish)
	for _, j := range ch.Jumpers {
		fmt.Printf("tooth %d -> %d spans %d\n", j.FromTooth, j.ToTooth, j.Span)
	}
	// Output:
	// U1 [1 2 7 8] U2
	// tooth 1 -> 2 spans 1
	// tooth 2 -> 7 spans 5
	// tooth 7 -> 8 spans 1
}

func ExamplePairs() {
	ps, _ := winding.Pairs(winding.Sweep{MaxSlots: 12, MaxPoles: 14, Layers: []int{2}, BalancedOnly: true})
	for _, p := range ps[:3] {
		fmt.Printf("%d/%d k_w %.3f cogging %d\n", p.Spec.Slots, p.Spec.Poles, p.WindingFactor, p.CoggingFactor)
	}
	// Output:
	// 12/10 k_w 0.933 cogging 2
	// 12/14 k_w 0.933 cogging 2
	// 6/4 k_w 0.866 cogging 2
}

func ExampleJoints() {
	for _, j := range winding.Joints(winding.Delta, []string{"U", "V", "W"}) {
		fmt.Println(j.Marks, "->", j.Line)
	}
	// Output:
	// [U2 V1] -> V
	// [V2 W1] -> W
	// [W2 U1] -> U
}
