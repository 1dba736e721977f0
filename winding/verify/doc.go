// Package verify proves a finished stator against its plan: it takes the
// readings a person makes with a meter, an insulation tester and a
// voltmeter, and says pass, warn or fail, with findings that name the phase and
// the likely cause with numbers.
//
// Model. Resistances are in ohm, temperatures in °C, insulation resistance in
// MΩ, voltages in V rms (DC for insulation tests), speed in rpm. Phases are
// named as in the layout (U, V, W). Line-to-line readings of a star winding
// give the phases by R_U = (R_UV + R_WU − R_VW)/2 and rotations; a delta needs
// its exact inverse (see DeltaPhases). In a delta, phase U lies between lines
// U and V, phase V between V and W, phase W between W and U (U2–V1, V2–W1,
// W2–U1 corners, winding.Joints). A resistance of +Inf is an open circuit (the
// meter reads over range).
//
// Polarity: the pole a compass shows at each wound tooth face with DC into
// its phase at X1 is compared with the plan's (plan.Poles, right-hand rule);
// a tooth showing the other pole names its coil, and the pattern of reversed
// teeth says whether it fits one coil, a jumper taken to the wrong tooth or
// swapped leads.
//
// Sources. Copper temperature correction: IEC 60028 (α20 = 0.00393/K,
// R_T = R_20·(234.5 + T)/254.5). The band about the plan's value: the IEC 60317
// diameter tolerance (R ∝ 1/d²) and a stated length-estimate uncertainty.
// Balance: EASA AR100, the largest deviation of a phase from the mean of the
// phases within 2 % of the mean (plan.ImbalancePercent, the same rule for the
// back-EMF lines). Insulation: IEEE 43-2013 (minimum IR after 1 min at 40 °C;
// the polarization index judged for machines in its scope, a warning below
// it, where the index may not apply). Withstand: against the plan's test
// voltage (IEC 60034-1 clause 9.2, plan.HVTestVolts), not the EMF; below the
// 80 % of a repeat test it does not pass.
//
// Test names in findings are the plan's (plan.TestResistance ...); the
// readings of a test map to and from its reading schema by ValuesOf and
// ReadingsOf. The report states what each judged test can see on the job
// (plan.Plan.Resolutions). When the resistance readings have proven the
// connection, a back-EMF √3 off the prediction points at the flux estimate,
// not at star and delta confused.
//
// The package is pure: no files, no screens. It does not decide what the
// person does next; the bench guide and the check command show the findings.
// It does not model skin effect, thermocouple errors or magnet temperature.
package verify
