package plan

import (
	"fmt"
	"math"
	"sort"

	"coilwright/winding"
	"coilwright/winding/job"
)

// Machine is what the wound machine does at its rated point: the phase
// inductance as the sum of its parts, the reactance and the voltage under
// load, the torque and EMF constants, the flux densities in the iron, the
// losses and the efficiency, and, for a battery-charging job, the charging
// curve. Every part that needs an input the job does not give is left out
// and named in Notes.
type Machine struct {
	Operation           string  `json:"operation"`              // "generator" or "motor"
	SeriesTurnsPerPhase float64 `json:"series_turns_per_phase"` // turns of one path: coils per phase × turns / paths

	Inductance        *Inductance `json:"inductance,omitempty"`
	PhaseInductanceMH float64     `json:"phase_inductance_mh,omitempty"` // the sum of Inductance's parts

	RatedSpeedRPM float64 `json:"rated_speed_rpm,omitempty"`
	ElectricalHz  float64 `json:"electrical_hz,omitempty"` // at the rated speed
	PhaseCurrentA float64 `json:"phase_current_a"`
	// PhaseResistanceOhm is the plan's hot phase resistance (at
	// copper_loss_temperature_c), the R of every figure here.
	PhaseResistanceOhm float64 `json:"phase_resistance_ohm"`
	ReactanceOhm       float64 `json:"reactance_ohm,omitempty"` // ω·L at the rated speed
	PhaseEMFV          float64 `json:"phase_emf_v,omitempty"`   // open circuit at the rated speed
	// Voltage at the terminals at the rated speed and current, the current
	// in phase with the terminal voltage (generator) or with the EMF (motor).
	PhaseVoltageLoadV float64 `json:"phase_voltage_under_load_v,omitempty"`
	LineVoltageLoadV  float64 `json:"line_voltage_under_load_v,omitempty"`

	TorqueConstant   float64 `json:"torque_constant_nm_per_a,omitempty"`     // m·E_ph/ω_m, N·m per A rms of phase current
	EMFConstant      float64 `json:"emf_constant_v_s_per_rad,omitempty"`     // phase rms EMF per rad/s of the shaft
	EMFConstantLine  float64 `json:"emf_constant_line_v_per_krpm,omitempty"` // line rms EMF per 1000 rpm
	ToothFluxDensity float64 `json:"tooth_flux_density_t,omitempty"`         // peak, in the tooth body
	YokeFluxDensity  float64 `json:"yoke_flux_density_t,omitempty"`          // peak, in the yoke behind the slots

	Iron   *Iron   `json:"iron,omitempty"`
	Losses *Losses `json:"losses_w,omitempty"`
	// MechanicalAllowance is true when the mechanical loss is the stated
	// allowance (job.DefaultMechanicalPercent of the rated power) rather
	// than the job's figure.
	MechanicalAllowance bool    `json:"mechanical_loss_is_allowance,omitempty"`
	InputW              float64 `json:"input_w,omitempty"`
	OutputW             float64 `json:"output_w,omitempty"`
	Efficiency          float64 `json:"efficiency,omitempty"`

	LoadCurve    []ChargePoint  `json:"load_curve,omitempty"`             // DC-bus jobs
	VoltageCurve []VoltagePoint `json:"terminal_voltage_curve,omitempty"` // EMF targets and given turns

	Notes []string `json:"notes"` // what could not be estimated, and why
}

// Iron is the lamination stack as the loss model sees it.
type Iron struct {
	Grade        string  `json:"grade,omitempty"`
	LossWPerKg   float64 `json:"loss_w_per_kg_1t5_50hz"`
	TeethKg      float64 `json:"teeth_kg"` // bodies and tips
	YokeKg       float64 `json:"yoke_kg"`
	BuildFactor  float64 `json:"build_factor"`
	TeethWPerKg  float64 `json:"teeth_w_per_kg"` // at the rated point, before the build factor
	YokeWPerKg   float64 `json:"yoke_w_per_kg"`
	HysteresisAt float64 `json:"hysteresis_share_at_50hz"`
}

// Losses are the losses at the rated point by kind, in W.
type Losses struct {
	Copper float64 `json:"copper"` // the plan's copper loss, hot
	// Iron is the loss of teeth and yoke; absent (not 0) when the job does
	// not give what it needs (Machine.Iron nil, said in Machine.Notes), and
	// Total is then a lower bound.
	Iron       float64 `json:"iron,omitempty"`
	IronTeeth  float64 `json:"iron_teeth,omitempty"`
	IronYoke   float64 `json:"iron_yoke,omitempty"`
	Mechanical float64 `json:"mechanical"`
	Total      float64 `json:"total"`
}

// VoltagePoint is the terminal voltage at a load current at the rated speed.
type VoltagePoint struct {
	CurrentA float64 `json:"current_a"`
	PhaseV   float64 `json:"phase_v"`
	LineV    float64 `json:"line_v"`
}

// Figures of the iron model.
const (
	// SaturationT: the B–H curve of non-oriented electrical steel bends near
	// 1.5–1.7 T and the field needed grows steeply beyond about 1.8 T
	// (EN 10106 grades reach about 1.6 T at 2500 A/m and 1.7 T at 5000 A/m;
	// Pyrhönen et al., ch. 3 and its table of usual flux densities, teeth
	// 1.4–2.1 T and yokes up to about 1.5–1.7 T in small machines; from memory).
	SaturationT = 1.8
	// LaminationDensity of silicon electrical steel, kg/m³ (EN 10106
	// conventional density of M400-50A, 7650–7700; from memory).
	LaminationDensity = 7650
	// HysteresisShare of the loss of a 0.5 mm lamination at 1.5 T, 50 Hz;
	// the rest is eddy-current loss (two-term loss separation, Bertotti's
	// model without the excess term; 0.6–0.8 for 0.5 mm grades, from memory).
	HysteresisShare = 0.7
	// IronBuildFactor: punching, stacking and the rotating field raise the
	// loss of a built core over the Epstein figure by 1.5–2 (Pyrhönen et al.,
	// ch. 3, from memory); the lower end is taken.
	IronBuildFactor = 1.5
)

// SpecificIronLoss scales the specific loss p15 of a lamination at 1.5 T,
// 50 Hz to a peak flux density b (T) at f (Hz) by the two-term model: the
// hysteresis loss per cycle grows as B², the eddy-current loss as (f·B)²:
// p = p15·[h·(f/50)·(B/1.5)² + (1−h)·(f/50)²·(B/1.5)²] (the two-term loss
// separation of hysteresis and classical eddy-current loss; Steinmetz's
// hysteresis exponent, 1.6 in his law and nearer 2 at the flux densities of
// machine teeth, is taken as 2, as Pyrhönen et al., ch. 3, scale the loss
// figure with B²; from memory).
func SpecificIronLoss(p15, h, b, f float64) float64 {
	x, y := f/50, (b/1.5)*(b/1.5)
	return p15 * (h*x*y + (1-h)*x*x*y)
}

// machine estimates what the wound machine does at its rated point.
func (b *builder) machine() error {
	p, j := b.p, b.j
	jm := j.Machine
	l := p.Layout
	m := len(l.PhaseNames)
	mc := &Machine{Operation: jm.Operation, Notes: []string{}}
	p.Machine = mc
	note := func(format string, a ...any) { mc.Notes = append(mc.Notes, fmt.Sprintf(format, a...)) }
	paths := float64(j.Winding.Paths)
	mc.SeriesTurnsPerPhase = float64(p.TurnsPerCoil*l.CoilsPerPhase) / paths
	mc.PhaseCurrentA = p.PhaseCurrentA
	mc.PhaseResistanceOhm = p.PhaseResistanceHot

	// Inductance.
	var missing []string
	if jm.AirGapMM == 0 {
		missing = append(missing, "machine.air_gap_mm")
	}
	if jm.MagnetThicknessMM == 0 {
		missing = append(missing, "machine.magnet_thickness_mm")
	}
	if jm.ToothTipHeightMM == 0 {
		missing = append(missing, "machine.tooth_tip_height_mm")
	}
	if len(missing) > 0 {
		note("inductance, reactance, voltage under load and charging curve not estimated: give %s", joinAnd(missing))
	} else {
		ind := b.inductance()
		if t := ind.Total(); t > 0 && !math.IsInf(t, 0) && !math.IsNaN(t) {
			mc.Inductance = &ind
			mc.PhaseInductanceMH = t
		} else {
			note("inductance not estimated: the slot opening (%g mm) leaves no tooth face within the slot pitch (%.2f mm)", j.Stator.Slot.OpeningMM, math.Pi*j.Stator.DiameterMM/float64(j.Winding.Slots))
		}
	}

	e := p.EMF
	if e == nil {
		note("EMF, torque constant, flux densities, iron loss and efficiency not estimated: the job gives no flux source ([flux])")
		return nil
	}
	// Flux densities: the peak flux through a tooth is the fundamental flux
	// per pole times the pitch factor of a coil round one tooth, the flux a
	// test coil on the tooth links (so for the test-coil source it is read
	// straight from the coil: Φ_t = √2·V/(2π·f·N_t)); the yoke carries half
	// the flux of a pole (textbook magnetic circuit). A flat-topped air-gap
	// density B under magnets of width b_m = arc·τ_p is used as it is: a
	// tooth under a magnet gathers the gap flux over its slot pitch τ_s or
	// the magnet's width, whichever is less, Φ_t = B·l·min(τ_s, b_m), and the
	// yoke half a magnet's flux, B·b_m·l/2 (the apparent tooth flux density
	// of Pyrhönen et al., ch. 3, from memory); the fundamental alone would
	// read a flat top about 5 % low.
	stack := j.Stator.StackLengthMM / 1000 * jm.StackingFactor
	toothFlux := b.phiWb * l.PitchFactor
	yokeFlux := b.phiWb / 2
	if fl := j.Flux; fl.PerPoleWb == 0 && fl.AirGapTesla > 0 {
		tauS := math.Pi * j.Stator.DiameterMM / float64(j.Winding.Slots) / 1000
		bm := fl.MagnetArc * math.Pi * j.Stator.DiameterMM / float64(j.Winding.Poles) / 1000
		toothFlux = fl.AirGapTesla * j.Stator.StackLengthMM / 1000 * math.Min(tauS, bm)
		yokeFlux = fl.AirGapTesla * j.Stator.StackLengthMM / 1000 * bm / 2
	}
	mc.ToothFluxDensity = toothFlux / (stack * j.Stator.ToothWidthMM / 1000)
	if mc.ToothFluxDensity > SaturationT {
		b.warn("iron: the tooth flux density is %.2f T, above the %.1f T where electrical steel saturates; the EMF will fall short of the plan and the iron will run hot. Check the flux source first (a misread test coil, or one read at another speed, gives this), then the tooth width", mc.ToothFluxDensity, SaturationT)
	}
	if jm.YokeThicknessMM > 0 {
		mc.YokeFluxDensity = yokeFlux / (stack * jm.YokeThicknessMM / 1000)
		if mc.YokeFluxDensity > SaturationT {
			b.warn("iron: the yoke flux density is %.2f T, above the %.1f T where electrical steel saturates; check the flux source and machine.yoke_thickness_mm", mc.YokeFluxDensity, SaturationT)
		}
	}

	if e.RatedSpeedRPM == 0 {
		note("nothing at the rated point (torque constant, losses, efficiency, curves): the job gives no rating.speed_rpm")
		return nil
	}
	n := e.RatedSpeedRPM
	mc.RatedSpeedRPM = n
	mc.ElectricalHz = ElectricalHz(j.Winding.Poles, n)
	mc.PhaseEMFV = e.PhaseRMSAtRated
	wm := 2 * math.Pi * n / 60
	mc.EMFConstant = mc.PhaseEMFV / wm
	mc.TorqueConstant = float64(m) * mc.EMFConstant
	mc.EMFConstantLine = e.LineRMSAtRated / n * 1000

	r, i := mc.PhaseResistanceOhm, mc.PhaseCurrentA
	if mc.Inductance != nil {
		mc.ReactanceOhm = 2 * math.Pi * mc.ElectricalHz * mc.PhaseInductanceMH / 1000
		mc.PhaseVoltageLoadV = terminalVoltage(mc.PhaseEMFV, r, mc.ReactanceOhm, i, jm.Operation)
		mc.LineVoltageLoadV = mc.PhaseVoltageLoadV * b.lineFactor
		if jm.Operation == job.OperationGenerator && mc.PhaseVoltageLoadV <= 0 {
			b.warn("machine: at %g rpm the winding's own impedance (R %.3f Ω, X %.3f Ω) takes the whole EMF before the rated current flows", n, r, mc.ReactanceOhm)
		}
	}

	// Losses at the rated point.
	iron := b.iron(mc)
	ls := &Losses{Copper: p.CopperLossW}
	if iron == nil {
		note("iron loss and efficiency not estimated: give machine.yoke_thickness_mm (the yoke's mass and flux density need it)")
	} else {
		mc.Iron = iron
		ls.IronTeeth = iron.TeethKg * iron.TeethWPerKg * iron.BuildFactor
		ls.IronYoke = iron.YokeKg * iron.YokeWPerKg * iron.BuildFactor
		ls.Iron = ls.IronTeeth + ls.IronYoke
	}
	ls.Mechanical = jm.MechanicalLossW
	if ls.Mechanical == 0 {
		ls.Mechanical = job.DefaultMechanicalPercent / 100 * p.RatedPowerW
		mc.MechanicalAllowance = true
	}
	ls.Total = ls.Copper + ls.Iron + ls.Mechanical
	mc.Losses = ls
	if iron != nil {
		// P is the rated power: the electrical output of a generator, the
		// shaft output of a motor (IEC 60034-1 rated output); either way the
		// input is P + Σ losses and η = P/(P + Σ losses).
		mc.OutputW = p.RatedPowerW
		mc.InputW = p.RatedPowerW + ls.Total
		mc.Efficiency = mc.OutputW / mc.InputW
	}

	// Curves.
	if mc.Inductance == nil {
		return nil
	}
	lH := mc.PhaseInductanceMH / 1000
	if j.Turns.Target == job.TargetDCBus {
		mc.LoadCurve = b.loadCurve(e, r, lH)
		if at := curveAt(mc.LoadCurve, n); at > 0 {
			if irms := math.Sqrt(2.0/3) * at; irms > 1.2*j.Rating.CurrentA {
				b.warn("charging: at %g rpm the bridge would draw about %.1f A DC (%.1f A rms line, rectangular-wave estimate), above the rated %.1f A: the winding limits the current only through R and ωL, so the turbine must be loaded down, or a charge controller must limit the current", n, at, irms, j.Rating.CurrentA)
			}
		}
	} else {
		for k := 0; k <= 6; k++ {
			ia := 1.5 * i * float64(k) / 6
			v := terminalVoltage(mc.PhaseEMFV, r, mc.ReactanceOhm, ia, jm.Operation)
			mc.VoltageCurve = append(mc.VoltageCurve, VoltagePoint{CurrentA: ia, PhaseV: v, LineV: v * b.lineFactor})
		}
	}
	return nil
}

// terminalVoltage returns the phase voltage at the terminals carrying i with
// EMF e behind R and X: a generator feeding a load at unity power factor,
// E² = (V + R·I)² + (X·I)², so V = √(E² − (X·I)²) − R·I (0 when the
// impedance takes it all); a motor driven with its current in phase with the
// EMF, V = √((E + R·I)² + (X·I)²) (phasor diagram of the non-salient
// synchronous machine, Pyrhönen et al., ch. 7; from memory).
func terminalVoltage(e, r, x, i float64, op string) float64 {
	if op == job.OperationMotor {
		return math.Hypot(e+r*i, x*i)
	}
	d := e*e - x*i*x*i
	if d <= 0 {
		return 0
	}
	return math.Max(0, math.Sqrt(d)-r*i)
}

// inductance computes the parts of the phase inductance.
func (b *builder) inductance() Inductance {
	p, j := b.p, b.j
	jm, st := j.Machine, j.Stator
	l := p.Layout
	m := l.Spec.Phases
	q := float64(l.Spec.Slots)
	paths := float64(j.Winding.Paths)
	nc := float64(p.TurnsPerCoil)
	ns := nc * float64(l.CoilsPerPhase) / paths
	d := st.DiameterMM / 1000
	stack := st.StackLengthMM / 1000
	var ind Inductance

	// Air gap: the magnets' recoil permeability near 1 makes them part of
	// the gap; Carter's factor for the slot openings.
	gMag := jm.AirGapMM + jm.MagnetThicknessMM/jm.MagnetRecoilPermeability
	tauS := math.Pi * st.DiameterMM / q
	ind.CarterFactor = CarterFactor(tauS, st.Slot.OpeningMM, gMag)
	ind.EffectiveAirGapMM = ind.CarterFactor * gMag
	total, working := mmfSum(l)
	base := AirGapInductance(m, ns, 1, 1, d, stack, ind.EffectiveAirGapMM/1000)
	ind.MagnetisingMH = base * working * 1000
	ind.HarmonicLeakageMH = base * (total - working) * 1000
	if working > 0 {
		ind.HarmonicLeakageFactor = total/working - 1
	}

	// Slot and tooth-tip leakage: μ0·l·N_c²·λ per coil side, times the
	// coupling of the currents sharing its slot, the paths in parallel
	// dividing by their number squared (Pyrhönen et al., ch. 4: slot
	// leakage permeance of the conductor region from the slot's own shape
	// (SlotPermeance; h/(3b) for parallel sides), h1/b1 of the opening, and
	// the tooth-tip leakage 5(δ/b1)/(5 + 4δ/b1); from memory). The field
	// crosses the slot from iron to iron, liners included; the conductors
	// start above the liner at the bottom. A slot given by its area alone is
	// taken as parallel-sided.
	depth := p.Slot.DepthMM - st.LinerMM
	top, bottom := p.Slot.MeanWidthMM, p.Slot.MeanWidthMM
	if st.Slot.Parametric() {
		top, bottom = st.Slot.WidthTopMM, st.Slot.WidthBottomMM
		// The liner at the bottom lifts the conductors: their region
		// starts where the slot is already a little wider or narrower.
		bottom += (top - bottom) * st.LinerMM / p.Slot.DepthMM
	}
	ind.SlotPermeance = SlotPermeance(depth, top, bottom)
	b0 := st.Slot.OpeningMM
	ind.ToothTipPermeance = jm.ToothTipHeightMM/b0 + 5*(gMag/b0)/(5+4*gMag/b0)
	ind.SlotCoupling = slotCoupling(l, 0)
	side := Mu0 * stack * nc * nc * ind.SlotCoupling / (paths * paths) * 1000
	ind.SlotLeakageMH = side * ind.SlotPermeance
	ind.ToothTipLeakageMH = side * ind.ToothTipPermeance

	// End winding: each coil's two end turns, the mean turn less the two
	// runs through the stack, with a permeance factor per metre; coupling
	// between the end turns of neighbouring coils is left out.
	lew := (p.MeanTurnLengthMM - 2*st.StackLengthMM) / 1000
	ind.EndWindingPermeance = EndWindingPermeance
	ind.EndWindingLeakageMH = Mu0 * nc * nc * lew * EndWindingPermeance * float64(l.CoilsPerPhase) / (paths * paths) * 1000
	return ind
}

// iron works out the masses and the specific losses of teeth and yoke at the
// rated point; nil without the yoke thickness.
func (b *builder) iron(mc *Machine) *Iron {
	j := b.j
	jm, st := j.Machine, j.Stator
	if jm.YokeThicknessMM == 0 {
		return nil
	}
	q := float64(j.Winding.Slots)
	kfe := jm.StackingFactor
	stack := st.StackLengthMM
	depth := b.p.Slot.DepthMM
	tip := jm.ToothTipHeightMM
	tauS := math.Pi * st.DiameterMM / q
	teethMM3 := q * (st.ToothWidthMM*depth + (tauS-st.Slot.OpeningMM)*tip) * stack * kfe
	// The yoke ring lies beyond the teeth: inside them for an outer rotor,
	// outside for an inner one.
	rIn := st.DiameterMM/2 + tip + depth
	if st.Rotor == job.RotorOuter {
		rIn = st.DiameterMM/2 - tip - depth - jm.YokeThicknessMM
	}
	yokeMM3 := math.Pi * (2*rIn + jm.YokeThicknessMM) * jm.YokeThicknessMM * stack * kfe
	if rIn <= 0 {
		yokeMM3 = 0
		b.warn("iron: the teeth (%.1f mm with the tips) and the yoke (%.1f mm) are deeper than the stator's radius; check machine.yoke_thickness_mm", tip+depth, jm.YokeThicknessMM)
	}
	ir := &Iron{Grade: jm.LaminationGrade, LossWPerKg: jm.LaminationLossWPerKg, BuildFactor: IronBuildFactor, HysteresisAt: HysteresisShare}
	ir.TeethKg = teethMM3 * 1e-9 * LaminationDensity
	ir.YokeKg = yokeMM3 * 1e-9 * LaminationDensity
	ir.TeethWPerKg = SpecificIronLoss(ir.LossWPerKg, HysteresisShare, mc.ToothFluxDensity, mc.ElectricalHz)
	ir.YokeWPerKg = SpecificIronLoss(ir.LossWPerKg, HysteresisShare, mc.YokeFluxDensity, mc.ElectricalHz)
	return ir
}

// loadCurve runs the bridge from below the cut-in to 1.5 times the rated
// speed: 16 speeds evenly spaced, with the cut-in and the rated speed among
// them. A delta winding feeds the bridge as its equivalent star: the line
// EMF over √3, a third of the phase impedance (delta–star transformation of
// a balanced source).
func (b *builder) loadCurve(e *EMF, r, lH float64) []ChargePoint {
	t := b.j.Turns
	emfPerRPM := e.VoltsPerRPMPhase
	if b.p.Connection == winding.Delta {
		emfPerRPM /= math.Sqrt(3)
		r, lH = r/3, lH/3
	}
	lo, hi := 0.8*e.CutInSpeedRPM, 1.5*e.RatedSpeedRPM
	speeds := []float64{e.CutInSpeedRPM, e.RatedSpeedRPM}
	for k := 0; k <= 13; k++ {
		speeds = append(speeds, lo+(hi-lo)*float64(k)/13)
	}
	sort.Float64s(speeds)
	var out []ChargePoint
	var st bridgeState // carried from speed to speed: each run starts near its steady state
	for _, n := range speeds {
		if len(out) > 0 && n-out[len(out)-1].SpeedRPM < 1e-6*hi {
			continue
		}
		br := Bridge{PhaseEMF: emfPerRPM * n, Hz: ElectricalHz(b.j.Winding.Poles, n), R: r, L: lH, BusV: t.Volts, DiodesV: t.BridgeDropV}
		idc := br.run(&st)
		out = append(out, ChargePoint{SpeedRPM: n, DCCurrentA: idc, PowerW: idc * t.Volts})
	}
	return out
}

// curveAt returns the DC current of the curve at speed n (a point of it).
func curveAt(c []ChargePoint, n float64) float64 {
	for _, pt := range c {
		if math.Abs(pt.SpeedRPM-n) < 1e-9*n {
			return pt.DCCurrentA
		}
	}
	return 0
}

func joinAnd(s []string) string {
	switch len(s) {
	case 0:
		return ""
	case 1:
		return s[0]
	}
	out := s[0]
	for _, x := range s[1 : len(s)-1] {
		out += ", " + x
	}
	return out + " and " + s[len(s)-1]
}
