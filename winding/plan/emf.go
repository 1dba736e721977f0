package plan

import (
	"fmt"
	"math"

	"coilwright/winding/job"
)

// BridgeFactor is the ratio of the mean DC output of an ideal six-pulse
// diode bridge into a resistive load to its line-to-line rms input:
// 3√2/π ≈ 1.35 (Mohan, Undeland, Robbins, Power Electronics, ch. 5; from
// memory).
var BridgeFactor = 3 * math.Sqrt2 / math.Pi

// CutInLineRMS returns the line-to-line rms EMF at which a three-phase diode
// bridge starts to charge a battery or a capacitor bank of busV, its two
// conducting diodes dropping diodesV: with a stiff voltage on the DC side no
// current flows until the peak of the line voltage, √2·V_LL, exceeds the bus
// plus the drops (peak-conduction of a diode rectifier into a capacitive or
// battery load; Mohan, Undeland, Robbins, Power Electronics, ch. 5, from
// memory). The mean 1.35·V_LL of BridgeFactor is the output into a resistor,
// which a battery is not.
func CutInLineRMS(busV, diodesV float64) float64 { return (busV + diodesV) / math.Sqrt2 }

// ElectricalHz returns the electrical frequency at a mechanical speed:
// f = p·n/60.
func ElectricalHz(poles int, rpm float64) float64 { return float64(poles/2) * rpm / 60 }

// PhaseEMF returns the rms EMF of N series turns with winding factor kw in a
// sinusoidal flux of fundamental amplitude phi (Wb per pole) at f Hz:
// E = √2·π·f·N·k_w·Φ (textbook, e.g. Pyrhönen et al., Design of Rotating
// Electrical Machines).
func PhaseEMF(f, seriesTurns, kw, phi float64) float64 {
	return math.Sqrt2 * math.Pi * f * seriesTurns * kw * phi
}

// FluxFromTestCoil returns the fundamental flux per pole that makes a test coil
// of turns on one tooth read voltsRMS at rpm: the inverse of PhaseEMF with the
// tooth coil's own winding factor, its pitch factor (a single coil has no
// distribution). The reading holds the harmonics of the magnet field too; on
// the near-sinusoidal EMF of a tooth coil they change the rms value little,
// and the same harmonics reach the phase, so the estimate carries over (common
// practice). Read with a true-rms meter at a steady speed.
func FluxFromTestCoil(poles, turns int, rpm, voltsRMS, pitchFactor float64) float64 {
	return voltsRMS / (math.Sqrt2 * math.Pi * ElectricalHz(poles, rpm) * float64(turns) * pitchFactor)
}

// FluxFromAirGap returns the fundamental flux per pole of a rotor with
// flat-topped flux density b (T) under magnets covering arc of the pole pitch:
// the fundamental of the rectangular wave is B1 = (4/π)·B·sin(arc·π/2), and a
// sinusoid of amplitude B1 over a pole pitch τ and stack L carries
// Φ = (2/π)·B1·τ·L (textbook; Pyrhönen et al., from memory). Lengths in mm.
func FluxFromAirGap(b, arc, diameterMM, stackMM float64, poles int) float64 {
	tau := math.Pi * diameterMM / float64(poles) / 1000
	b1 := 4 / math.Pi * b * math.Sin(arc*math.Pi/2)
	return 2 / math.Pi * b1 * tau * stackMM / 1000
}

func (b *builder) flux() error {
	j, l := b.j, b.p.Layout
	fl := j.Flux
	switch {
	case fl.PerPoleWb > 0:
		b.phiWb = fl.PerPoleWb
	case fl.AirGapTesla > 0:
		b.phiWb = FluxFromAirGap(fl.AirGapTesla, fl.MagnetArc, j.Stator.DiameterMM, j.Stator.StackLengthMM, j.Winding.Poles)
	case fl.TestCoil != nil:
		tc := fl.TestCoil
		b.phiWb = FluxFromTestCoil(j.Winding.Poles, tc.Turns, tc.SpeedRPM, tc.VoltsRMS, l.PitchFactor)
	default:
		return nil
	}
	coilsPerPath := float64(l.CoilsPerPhase / j.Winding.Paths)
	// Phase EMF per turn per coil at 1 rpm.
	b.emfPerTurn = PhaseEMF(ElectricalHz(j.Winding.Poles, 1), coilsPerPath, l.WindingFactor, b.phiWb)
	return nil
}

// turns takes the turns as given or solves the smallest whole number that
// reaches the target.
func (b *builder) turns() error {
	j, p := b.j, b.p
	t := j.Turns
	if !t.Solved() {
		p.TurnsPerCoil = t.PerCoil
	} else {
		var phaseV float64
		var what string
		switch t.Target {
		case job.TargetPhaseEMF:
			phaseV = t.Volts
			what = fmt.Sprintf("phase EMF %g V rms at %g rpm", t.Volts, t.SpeedRPM)
		case job.TargetLineEMF:
			phaseV = t.Volts / b.lineFactor
			what = fmt.Sprintf("line EMF %g V rms at %g rpm", t.Volts, t.SpeedRPM)
		case job.TargetDCBus:
			phaseV = CutInLineRMS(t.Volts, t.BridgeDropV) / b.lineFactor
			what = fmt.Sprintf("charging a %g V DC bus from %g rpm (cut-in) through a three-phase diode bridge", t.Volts, t.SpeedRPM)
			if t.BridgeDropV > 0 {
				what += fmt.Sprintf(" dropping %g V", t.BridgeDropV)
			}
		}
		perTurn := b.emfPerTurn * t.SpeedRPM
		if !(perTurn > 0) || math.IsInf(perTurn, 0) {
			return j.Fail("flux", "", "the flux source gives no usable EMF", "check the flux values")
		}
		n := math.Ceil(phaseV/perTurn - 1e-9)
		if n > 100000 || math.IsNaN(n) {
			return j.Fail("turns.target", fmt.Sprintf("%q", t.Target),
				fmt.Sprintf("the target needs %.0f turns per coil, far beyond any hand-wound coil", n), "check the target voltage, the speed and the flux source")
		}
		p.TurnsPerCoil = int(max(1, n))
		p.TurnsSolved = true
		defer func() {
			if p.EMF != nil {
				p.EMF.Target = what
			}
		}()
	}
	if b.phiWb == 0 {
		return nil
	}
	n := float64(p.TurnsPerCoil)
	e := &EMF{FluxPerPoleWb: b.phiWb, VoltsPerRPMPhase: b.emfPerTurn * n}
	rated := j.Rating.SpeedRPM
	if rated == 0 && t.Solved() && t.Target != job.TargetDCBus {
		rated = t.SpeedRPM
	}
	if rated > 0 {
		e.RatedSpeedRPM = rated
		e.PhaseRMSAtRated = e.VoltsPerRPMPhase * rated
		e.LineRMSAtRated = e.PhaseRMSAtRated * b.lineFactor
	}
	if t.Solved() {
		e.TargetV = t.Volts
		e.TargetSpeedRPM = t.SpeedRPM
		ph := e.VoltsPerRPMPhase * t.SpeedRPM
		switch t.Target {
		case job.TargetPhaseEMF:
			e.AtTargetV = ph
		case job.TargetLineEMF:
			e.AtTargetV = ph * b.lineFactor
		case job.TargetDCBus:
			// The built winding (whole turns, rounded up) reaches the
			// cut-in line voltage below the target speed.
			e.LineRMSAtCutIn = CutInLineRMS(t.Volts, t.BridgeDropV)
			e.PeakLineAtCutIn = math.Sqrt2 * e.LineRMSAtCutIn
			e.CutInSpeedRPM = e.LineRMSAtCutIn / (e.VoltsPerRPMPhase * b.lineFactor)
			e.AtTargetV = math.Sqrt2*ph*b.lineFactor - t.BridgeDropV
		}
	}
	p.EMF = e
	return nil
}
