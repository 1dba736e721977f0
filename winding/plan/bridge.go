package plan

import "math"

// ChargePoint is one point of the charging curve: the mean current and power
// into the DC bus at a speed.
type ChargePoint struct {
	SpeedRPM   float64 `json:"speed_rpm"`
	DCCurrentA float64 `json:"dc_current_a"`
	PowerW     float64 `json:"power_w"` // into the bus: bus voltage × mean current
}

// Bridge is a three-phase star-connected source (EMF, resistance and
// inductance per phase) feeding a six-pulse diode bridge that charges a stiff
// DC voltage (a battery or a large capacitor bank).
type Bridge struct {
	PhaseEMF float64 // rms phase EMF at the speed
	Hz       float64 // electrical frequency
	R, L     float64 // per phase, Ω and H (the synchronous inductance)
	BusV     float64 // the DC voltage the bridge charges
	DiodesV  float64 // forward drop of the two diodes in the current's path
}

// MeanDCCurrent simulates the bridge over whole periods until it repeats and
// returns the mean DC current of the last period. The model is the textbook
// one of a diode rectifier with source inductance (Mohan, Undeland, Robbins,
// Power Electronics, ch. 5, commutation with L_s; from memory), run in time:
// each phase is e − R·i − L·di/dt; a phase whose current is positive is held
// at the + rail, negative at the − rail, and a phase without current floats
// until its terminal passes a rail. The neutral floats so the conducting
// phases' currents sum to zero. Each step solves the phase currents exactly
// for the forcing held over the step (an exponential integrator), so the
// step is stable at any L/R. Diode drops are constant; the diodes have no
// reverse recovery. Current flows only while the peak line EMF √2·√3·E
// exceeds BusV + DiodesV, the peak-conduction cut-in.
func (br Bridge) MeanDCCurrent() float64 {
	var st bridgeState
	return br.run(&st)
}

// bridgeState is the state of the bridge at the start of a period: the phase
// currents and the rail each phase is held at (+1, −1, or 0 floating).
type bridgeState struct {
	i, rail [3]float64
}

// run simulates from st, leaves the state at the end of the last period in
// st (a warm start for a nearby speed), and returns the mean DC current.
func (br Bridge) run(st *bridgeState) float64 {
	vdc := br.BusV + br.DiodesV
	if !(br.PhaseEMF > 0) || !(br.Hz > 0) || !(br.R > 0) || br.L < 0 || math.Sqrt(6)*br.PhaseEMF <= vdc {
		return 0
	}
	const steps = bridgeSteps
	T := 1 / br.Hz
	dt := T / steps
	a := 0.0
	if br.L > 0 {
		a = math.Exp(-br.R * dt / br.L)
	}
	amp := math.Sqrt2 * br.PhaseEMF
	i, rail := &st.i, &st.rail
	var mean float64
	// Run whole periods until the mean DC current of one period differs
	// from the last by less than 1e-4 of it (at most 100 periods).
	for per := 0; per < 100; per++ {
		var q float64 // charge into the + rail over this period
		for s := range steps {
			e := [3]float64{amp * bridgeSin[s], amp * bridgeSin[(s+2*steps/3)%steps], amp * bridgeSin[(s+steps/3)%steps]}
			turnOn(rail, e, vdc)
			vn, n := 0.0, 0
			for k := range 3 {
				if rail[k] != 0 {
					vn += rail[k]*vdc/2 - e[k]
					n++
				}
			}
			if n < 2 {
				continue
			}
			vn /= float64(n)
			for k := range 3 {
				if rail[k] != 0 {
					drive := (e[k] + vn - rail[k]*vdc/2) / br.R // the current it tends to
					i[k] = i[k]*a + (1-a)*drive
				}
			}
			turnOff(rail, i)
			for k := range 3 {
				if rail[k] > 0 {
					q += i[k] * dt
				}
			}
		}
		prev := mean
		mean = q / T
		if per > 0 && math.Abs(mean-prev) <= 1e-4*mean {
			break
		}
	}
	return mean
}

// bridgeSteps is the number of time steps per electrical period (2°; a
// multiple of 3 so the phases fall on the same samples).
const bridgeSteps = 180

// bridgeSin is sin(2π·s/bridgeSteps); phase k reads it 1/3 period later.
var bridgeSin = func() (t [bridgeSteps]float64) {
	for s := range t {
		t[s] = math.Sin(2 * math.Pi * float64(s) / bridgeSteps)
	}
	return t
}()

// turnOff lets a diode whose current has reversed block: its phase floats.
// The currents left still sum to zero; with one phase left, none flows.
func turnOff(rail *[3]float64, i *[3]float64) {
	n := 0
	for k := range 3 {
		if rail[k] != 0 && i[k]*rail[k] < 0 {
			rail[k], i[k] = 0, 0
		}
		if rail[k] != 0 {
			n++
		}
	}
	switch n {
	case 1:
		*rail, *i = [3]float64{}, [3]float64{}
	case 2:
		var a, b int = -1, -1
		for k := range 3 {
			if rail[k] != 0 {
				if a < 0 {
					a = k
				} else {
					b = k
				}
			}
		}
		d := (i[a] - i[b]) / 2
		i[a], i[b] = d, -d
	}
}

// turnOn holds a floating phase at a rail once its terminal (its EMF plus
// the neutral) passes that rail; with nothing conducting, the pair with the
// largest line EMF starts when it exceeds the bus plus the diodes.
func turnOn(rail *[3]float64, e [3]float64, vdc float64) {
	n := 0
	vn := 0.0
	for k := range 3 {
		if rail[k] != 0 {
			vn += rail[k]*vdc/2 - e[k]
			n++
		}
	}
	switch n {
	case 3:
		return
	case 0:
		hi, lo := 0, 0
		for k := range 3 {
			if e[k] > e[hi] {
				hi = k
			}
			if e[k] < e[lo] {
				lo = k
			}
		}
		if e[hi]-e[lo] > vdc {
			rail[hi], rail[lo] = 1, -1
		}
		return
	}
	vn /= float64(n)
	for k := range 3 {
		if rail[k] == 0 {
			switch v := e[k] + vn; {
			case v > vdc/2:
				rail[k] = 1
			case v < -vdc/2:
				rail[k] = -1
			}
		}
	}
}
