package winding

import "sort"

// nearestFeasible lists up to four feasible pairs close to a refused Spec, with
// the same phases and layers, nearest first (distance |dQ| + |d2p|).
func nearestFeasible(s Spec) []Spec {
	type cand struct {
		sp   Spec
		dist int
	}
	var cs []cand
	const reach = 6
	for dq := -reach; dq <= reach; dq++ {
		for dp := -reach; dp <= reach; dp += 2 {
			q, poles := s.Slots+dq, s.Poles+dp
			if poles%2 != 0 {
				poles++
			}
			if q < 1 || poles < 2 || q > MaxSlots || poles > MaxPoles || (dq == 0 && dp == 0) {
				continue
			}
			c := Spec{Slots: q, Poles: poles, Phases: s.Phases, Layers: s.Layers, Paths: 1}
			if c.Phases < 3 || c.Phases%2 == 0 || c.Phases > MaxPhases || (c.Layers != 1 && c.Layers != 2) {
				return nil
			}
			if !Feasible(c) {
				continue
			}
			cs = append(cs, cand{c, abs(dq) + abs(poles-s.Poles)})
		}
	}
	sort.SliceStable(cs, func(i, j int) bool {
		if cs[i].dist != cs[j].dist {
			return cs[i].dist < cs[j].dist
		}
		return cs[i].sp.Slots < cs[j].sp.Slots
	})
	var out []Spec
	seen := map[[2]int]bool{}
	for _, c := range cs {
		k := [2]int{c.sp.Slots, c.sp.Poles}
		if seen[k] {
			continue
		}
		seen[k] = true
		out = append(out, c.sp)
		if len(out) == 4 {
			break
		}
	}
	return out
}

// Feasible reports whether a balanced winding exists for the pair (paths are
// not considered).
func Feasible(s Spec) bool {
	s = s.Normalize()
	s.Paths = 1
	if s.checkRange() != nil {
		return false
	}
	return newStar(s, newTrigTable(s.Slots)).assign()
}

func abs(x int) int {
	if x < 0 {
		return -x
	}
	return x
}
