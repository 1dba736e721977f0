package winding

import "fmt"

// Thresholds for the warnings on a feasible but poor pair.
const (
	// MinGoodWindingFactor: below it the machine needs noticeably more turns
	// or magnet for its EMF (common practice: tooth-coil designs are usually
	// chosen at 0.85 or above).
	MinGoodWindingFactor = 0.85
	// MinGoodQ and MaxGoodQ bound the slots per pole and phase of a good
	// tooth-coil winding: outside 1/4..1/2 the winding factor falls or the
	// space harmonics grow (Bianchi et al. 2006; common practice).
	MinGoodQ = 0.25
	MaxGoodQ = 0.5
	// SubHarmonicLimit: a spatial order below p whose winding factor exceeds
	// this fraction of the working one is flagged; sub-harmonics turn with the
	// rotor at other speeds and heat magnets and back iron (Bianchi et al.
	// 2006). The value 0.25 is this project's choice, stated here.
	SubHarmonicLimit = 0.25
)

// Warning is a caution about a feasible layout.
type Warning struct {
	Code    string `json:"code"` // stable key: low-winding-factor, q-out-of-range, sub-harmonic, unbalanced-pull
	Message string `json:"message"`
}

func warningsFor(l *Layout) []Warning {
	var w []Warning
	if l.WindingFactor < MinGoodWindingFactor {
		w = append(w, Warning{"low-winding-factor", fmt.Sprintf(
			"fundamental winding factor %.3f is below %.2f: more turns or magnet are needed for the same EMF", l.WindingFactor, MinGoodWindingFactor)})
	}
	if q := l.Q.Float(); q < MinGoodQ || q > MaxGoodQ {
		w = append(w, Warning{"q-out-of-range", fmt.Sprintf(
			"q = %s = %.3f slots per pole and phase is outside %.2f..%.2f, the usual range of tooth-coil windings", l.Q, q, MinGoodQ, MaxGoodQ)})
	}
	p := l.Spec.PolePairs()
	worst, worstOrder := 0.0, 0
	for _, h := range l.Harmonics {
		if h.Order >= p {
			break
		}
		if h.MMFWindingFactor > worst {
			worst, worstOrder = h.MMFWindingFactor, h.Order
		}
	}
	if l.WindingFactor > 0 && worst > SubHarmonicLimit*l.WindingFactor {
		msg := fmt.Sprintf(
			"MMF sub-harmonic of order %d (below the working order %d) has winding factor %.3f, %.0f %% of the working one: it turns at another speed than the rotor and drives eddy currents in magnets and back iron, which grow with the square of the electrical frequency; segment the magnets if the machine runs fast",
			worstOrder, p, worst, 100*worst/l.WindingFactor)
		if worstOrder == l.Spec.Slots-p {
			msg += fmt.Sprintf(" (order Q - p = %d: usual when 2p > Q)", worstOrder)
		}
		w = append(w, Warning{"sub-harmonic", msg})
	}
	if !l.RadialForceBalanced {
		w = append(w, Warning{"unbalanced-pull", "no rotation maps the machine onto itself: the magnetic forces on the rotor do not cancel (unbalanced radial pull, vibration, bearing load)"})
	}
	return w
}
