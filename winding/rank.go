package winding

import (
	"cmp"
	"slices"
)

// better is the ranking of Pairs: higher fundamental winding factor first
// (compared to 1e-9); then lower cogging factor; then radially balanced
// before unbalanced; then more parallel-path options; then fewer slots,
// fewer poles, two layers before one.
func better(a, b PairRow) bool {
	if d := a.WindingFactor - b.WindingFactor; d > 1e-9 || d < -1e-9 {
		return d > 0
	}
	if a.CoggingFactor() != b.CoggingFactor() {
		return a.CoggingFactor() < b.CoggingFactor()
	}
	if a.RadialForceBalanced() != b.RadialForceBalanced() {
		return a.RadialForceBalanced()
	}
	if a.pathOptions() != b.pathOptions() {
		return a.pathOptions() > b.pathOptions()
	}
	sa, sb := a.Spec(), b.Spec()
	if sa.Slots != sb.Slots {
		return sa.Slots < sb.Slots
	}
	if sa.Poles != sb.Poles {
		return sa.Poles < sb.Poles
	}
	return sa.Layers > sb.Layers
}

// rankRows sorts rows, given in sweep order (by layers as listed, slots,
// poles), best first by better: the order a stable sort by better gives.
//
// better compares winding factors to 1e-9, which is not an order in general
// (a can tie with b and b with c while a beats c). rankRows sorts by the
// exact factor, then the key, and looks for runs of distinct factors each
// within 1e-9 of the next. Where a run spans at most 1e-9 from end to end,
// better ties every two of its rows on the factor and beats every other row
// on it: it is then an order, the run is one class ranked by the key, and
// any sort gives the one ranking. Only a wider run leaves no order; then
// rankRows puts the rows back in sweep order and sorts stably by better
// itself.
func rankRows(rows []PairRow, layers []int) {
	slices.SortFunc(rows, func(a, b PairRow) int {
		if a.WindingFactor != b.WindingFactor {
			if a.WindingFactor > b.WindingFactor {
				return -1
			}
			return 1
		}
		return cmp.Compare(a.key, b.key)
	})
	byKey := func(a, b PairRow) int { return cmp.Compare(a.key, b.key) }
	for i := 0; i < len(rows); {
		// rows[i:j] is a run of factors each within 1e-9 of the next
		j := i + 1
		for j < len(rows) && rows[j-1].WindingFactor-rows[j].WindingFactor <= 1e-9 {
			j++
		}
		if rows[i].WindingFactor != rows[j-1].WindingFactor {
			if rows[i].WindingFactor-rows[j-1].WindingFactor > 1e-9 {
				rankTolerant(rows, layers)
				return
			}
			slices.SortFunc(rows[i:j], byKey)
		}
		i = j
	}
}

// rankTolerant restores sweep order and sorts stably by better.
func rankTolerant(rows []PairRow, layers []int) {
	slices.SortFunc(rows, func(a, b PairRow) int {
		sa, sb := a.Spec(), b.Spec()
		if c := cmp.Compare(slices.Index(layers, sa.Layers), slices.Index(layers, sb.Layers)); c != 0 {
			return c
		}
		if c := cmp.Compare(sa.Slots, sb.Slots); c != 0 {
			return c
		}
		return cmp.Compare(sa.Poles, sb.Poles)
	})
	sortStableBy(rows, better)
}

// sortStableBy sorts s stably, a before b where better(a, b); elements
// neither of which is better than the other keep their order.
func sortStableBy[T any](s []T, better func(a, b T) bool) {
	slices.SortStableFunc(s, func(a, b T) int {
		switch {
		case better(a, b):
			return -1
		case better(b, a):
			return 1
		}
		return 0
	})
}
