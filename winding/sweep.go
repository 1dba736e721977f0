package winding

import (
	"math"
	"runtime"
	"slices"
	"sync"
	"sync/atomic"
)

// sweepAll appends the rows of every (layers, slot count) of the sweep to
// dst, in sweep order: layers as listed, then slots, then poles. The slot
// counts run on every core, each worker on its own buffers; each slot count
// fills its own stretch of dst, as long as its pole counts, and the
// stretches are closed up at the end.
func sweepAll(req Sweep, dst []PairRow) []PairRow {
	type job struct{ layers, slots int }
	var jobs []job
	for _, ly := range req.Layers {
		for q := req.Phases; q <= req.MaxSlots; q++ {
			// The coil count must be a multiple of the phase count
			// (checkRange says so with a message; skip it unformatted).
			if (ly == 1 && q%2 != 0) || (q/(3-ly))%req.Phases != 0 {
				continue
			}
			jobs = append(jobs, job{ly, q})
		}
	}
	per := req.MaxPoles / 2
	base := len(dst)
	dst = slices.Grow(dst, len(jobs)*per)[:base+len(jobs)*per]
	stretch := dst[base:]
	found := make([]int, len(jobs))
	workers := min(runtime.GOMAXPROCS(0), max(len(jobs), 1))
	var next atomic.Int64
	var wg sync.WaitGroup
	for range workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			sw := newSweeper(req.Phases, req.MaxSlots)
			for {
				i := int(next.Add(1) - 1)
				if i >= len(jobs) {
					return
				}
				own := stretch[i*per : i*per : (i+1)*per]
				found[i] = len(sw.slots(req, jobs[i].layers, jobs[i].slots, own))
			}
		}()
	}
	wg.Wait()
	n := base
	for i, k := range found {
		n += copy(dst[n:], stretch[i*per:i*per+k])
	}
	return dst[:n]
}

// The sweep lays out every pole count for one slot count with the same rules
// as Design (star.go, symmetry.go, paths.go), on buffers kept from one pair to
// the next: no allocation per pair, no division per coil.
//
// Per slot count a table gives, for each tooth position k (the coil phasor at
// k*360/Q degrees, k = 0..Q-1), the nearest phase axis, the coil's sense, its
// signed phasor angle and that angle's cosine and sine. For 2p poles tooth
// index i lies at k = -p*i mod Q, so from one wound tooth to the next k moves
// by a fixed step: the angle is carried along, never divided.

// axisEntry is what the table holds for one tooth position.
type axisEntry struct {
	cos, sin float64 // of the signed phasor angle
	angle    int32   // signed phasor angle, in steps of 180/Q degrees (0..2Q-1)
	phase    uint8
	code     uint8 // coilCode(phase, reversed)
}

// sweeper holds one worker's buffers; they are sized for the largest slot
// count it has met and reused.
type sweeper struct {
	m        int
	turns    *turns
	q        int // slot count the table is for
	trig     trigTable
	table    []axisEntry
	divisors []int // of q, below q, ascending
	re, im   []float64
	counts   []int
	perAngle []int32 // coils per signed phasor angle (2Q); zero between pairs
	codes    []byte  // coil codes in tooth order
	options  []uint8 // options[g]: number of divisors of g (g <= MaxSlots)
}

// newSweeper makes the buffers of m phases and up to maxQ slots.
func newSweeper(m, maxQ int) *sweeper {
	sw := &sweeper{m: m, turns: phaseTurns(m),
		re: make([]float64, m), im: make([]float64, m), counts: make([]int, m),
		trig:  trigTable{cos: make([]float64, 2*maxQ), sin: make([]float64, 2*maxQ)},
		table: make([]axisEntry, maxQ), divisors: make([]int, 0, maxQ),
		perAngle: make([]int32, 2*maxQ), codes: make([]byte, maxQ),
		options: make([]uint8, MaxSlots+1)}
	for a := 1; a <= MaxSlots; a++ {
		for b := a; b <= MaxSlots; b += a {
			sw.options[b]++
		}
	}
	return sw
}

// setSlots builds the per-slot-count table.
func (sw *sweeper) setSlots(q int) {
	if sw.q == q {
		return
	}
	sw.q = q
	sw.trig = trigTable{cos: grow(sw.trig.cos, 2*q), sin: grow(sw.trig.sin, 2*q)}.fill(q)
	sw.table = grow(sw.table, q)
	for k := range sw.table {
		ph, neg := nearestAxis(k, q, sw.m)
		a := (2*k + neg*q) % (2 * q)
		sw.table[k] = axisEntry{cos: sw.trig.cos[a], sin: sw.trig.sin[a], angle: int32(a),
			phase: uint8(ph), code: coilCode(ph, neg == 1)}
	}
	sw.divisors = sw.divisors[:0]
	for s := 1; s < q; s++ {
		if q%s == 0 {
			sw.divisors = append(sw.divisors, s)
		}
	}
	sw.perAngle = grow(sw.perAngle, 2*q)
	sw.codes = grow(sw.codes, q)
}

// grow returns xs with length n, reusing its storage when it is large enough.
func grow[T any](xs []T, n int) []T {
	if cap(xs) < n {
		return make([]T, n)
	}
	return xs[:n]
}

// slots appends to dst the row of every pole count 2..maxPoles for which a
// balanced winding of q slots and the given layers exists and passes the
// sweep's filters, in ascending pole count.
func (sw *sweeper) slots(req Sweep, layers, q int, dst []PairRow) []PairRow {
	sw.setSlots(q)
	m := sw.m
	step := 3 - layers
	n := q / step // coils
	q2 := 2 * q
	table := sw.table[:q]
	codes := sw.codes[:n]
	perAngle := sw.perAngle[:q2]
	re, im, counts := sw.re[:m], sw.im[:m], sw.counts[:m]
	for poles := 2; poles <= req.MaxPoles; poles += 2 {
		p := poles / 2
		d := q - (p*step)%q // k moves by -p*step per wound tooth
		if d == q {
			d = 0
		}
		clear(re)
		clear(im)
		clear(counts)
		k := 0
		for i := range codes {
			e := &table[k]
			re[e.phase] += e.cos
			im[e.phase] += e.sin
			counts[e.phase]++
			perAngle[e.angle]++
			codes[i] = e.code
			k += d
			if k >= q {
				k -= q
			}
		}
		if !balancedSums(re, im, counts, sw.turns) {
			clear(perAngle)
			continue
		}
		// Design numbers the teeth from the start of a run of U coils
		// (renumberFromRunStart) and takes the distribution factor of
		// phase U in that numbering; sum it in the same order and at the
		// same angles, so the figure is the same to the last bit.
		start := 0
		for i := range codes {
			prev := i - 1
			if prev < 0 {
				prev = n - 1
			}
			if codes[i]>>1 == 0 && codes[prev]>>1 != 0 {
				start = i
				break
			}
		}
		k = start * d % q
		a0 := table[k].angle // the start coil's angle becomes 0 (CW)
		var uRe, uIm float64
		g := 0
		for range codes {
			e := &table[k]
			if c := perAngle[e.angle]; c != 0 {
				g = gcdStep(g, int(c))
				perAngle[e.angle] = 0
			}
			if e.phase == 0 {
				a := e.angle - a0
				if a < 0 {
					a += int32(q2)
				}
				uRe += sw.trig.cos[a]
				uIm += sw.trig.sin[a]
			}
			k += d
			if k >= q {
				k -= q
			}
		}
		pitch := snap(math.Abs(sw.trig.sin[p%q2]))
		wf := snap(pitch * snap(math.Hypot(uRe, uIm)/float64(counts[0])))
		if wf < req.MinWindingFactor {
			continue
		}
		rs := rotations{q: q, p: p, step: step, codes: codes}
		balanced := false
		for _, s := range sw.divisors {
			if rs.maps(s) {
				balanced = true
				break
			}
		}
		if req.BalancedOnly && !balanced {
			continue
		}
		gp := gcd(g, counts[0])
		dst = append(dst, newPairRow(q, poles, m, layers, wf, balanced, gp, int(sw.options[gp])))
	}
	return dst
}
