package verify

import (
	"math"

	"coilwright/winding/plan"
)

// ValuesOf gives the readings that belong to one test of the plan under the
// keys of that test's reading schema (plan.Test.Readings): what a check
// records on the test's step, and what the bench guide and the printed
// record show by name and unit. Open readings (+Inf) and readings not taken
// are left out.
func ValuesOf(p *plan.Plan, t plan.Test, r Readings) map[string]float64 {
	out := map[string]float64{}
	put := func(k string, v float64) {
		if !math.IsInf(v, 0) && !math.IsNaN(v) {
			out[k] = v
		}
	}
	rs := p.ReadingsFor(t) // the balance is judged from the resistance test's readings
	lines := func(vals [3]float64) {
		for i, v := range vals {
			if i < len(rs) {
				put(rs[i].Key, v)
			}
		}
	}
	switch t.Name {
	case plan.TestResistance, plan.TestBalance:
		if !r.HasResistance() {
			return out
		}
		if len(r.PerPhase) == 3 && p != nil && p.Layout != nil {
			for i, n := range p.Layout.PhaseNames[:3] {
				put(plan.PhaseKey(n), r.PerPhase[i])
			}
		} else {
			lines([3]float64{r.UV, r.VW, r.WU})
		}
		put(plan.KeyTemp, r.TempC)
	case plan.TestInsulation:
		if in := r.Insulation; in != nil {
			put(plan.KeyIR1, in.IR1MOhm)
			if in.IR10MOhm > 0 {
				put(plan.KeyIR10, in.IR10MOhm)
			}
			put(plan.KeyVolts, in.Volts)
			put(plan.KeyTemp, r.TempC)
		}
	case plan.TestHighVoltage:
		if w := r.Withstand; w != nil {
			put(plan.KeyVolts, w.Volts)
			put(plan.KeyPassed, map[bool]float64{true: 1, false: 0}[w.Passed])
		}
	case plan.TestPolarity:
		for _, o := range r.Polarity {
			put(plan.PoleKey(o.Tooth), o.Pole.Value())
		}
	case plan.TestBackEMF:
		if e := r.EMF; e != nil {
			lines([3]float64{e.UV, e.VW, e.WU})
			put(plan.KeyRPM, e.RPM)
		}
	}
	return out
}

// ReadingsOf is the other way round: the readings of one test of the plan
// from values under that test's reading keys, as the bench guide records
// them. A withstand test passed when it held (passed = 1; a schema without
// that reading: when seconds were given) for the test's time (seconds at
// least the limit, where given). The second result is
// false for a test the check does not judge.
func ReadingsOf(p *plan.Plan, t plan.Test, v map[string]float64) (Readings, bool) {
	rs := p.ReadingsFor(t)
	at := func(i int) float64 {
		if i < len(rs) {
			return v[rs[i].Key]
		}
		return 0
	}
	ambient := 0.0
	if p != nil {
		ambient = p.AmbientC
	}
	switch t.Name {
	case plan.TestResistance, plan.TestBalance:
		return Readings{UV: at(0), VW: at(1), WU: at(2), TempC: v[plan.KeyTemp]}, true
	case plan.TestInsulation:
		return Readings{TempC: v[plan.KeyTemp], Insulation: &Insulation{IR1MOhm: v[plan.KeyIR1], IR10MOhm: v[plan.KeyIR10], Volts: v[plan.KeyVolts]}}, true
	case plan.TestHighVoltage:
		pv, hasP := v[plan.KeyPassed]
		sec, hasS := v[plan.KeySeconds]
		held := (hasP && pv >= 1 || !hasP && hasS) && (!hasS || sec >= t.Limit)
		return Readings{TempC: ambient, Withstand: &Withstand{Volts: v[plan.KeyVolts], Passed: held}}, true
	case plan.TestBackEMF:
		return Readings{TempC: ambient, EMF: &BackEMF{UV: at(0), VW: at(1), WU: at(2), RPM: v[plan.KeyRPM]}}, true
	case plan.TestPolarity:
		// Poles under the test's keys (+1 N, -1 S); unsure (0) and teeth
		// not read are left out.
		var r Readings
		if p != nil {
			for _, tp := range p.Polarity {
				if pole, ok := plan.PoleFromValue(v[plan.PoleKey(tp.Tooth)]); ok {
					r.Polarity = append(r.Polarity, PoleReading{Phase: tp.Phase, Tooth: tp.Tooth, Pole: pole})
				}
			}
		}
		return r, len(r.Polarity) > 0
	}
	return Readings{}, false
}
