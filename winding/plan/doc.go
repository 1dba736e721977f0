// Package plan turns a job into a build plan: the turns (given, or solved from
// an EMF or DC-bus target), the wire and its slot fill, the mean turn length
// and the wire of every coil, path and cut, the expected resistance, the bench
// steps in the order the work is done, and the test plan with its limits and
// sources.
//
// Model. A tooth coil's mean turn is 2·(L + w) + π·b, L the stack length, w the
// tooth width, each grown by the liner on both faces, and b the coil build
// across the slot (round wire taken in square packing over the enamel, common
// practice for a hand-wound coil). The EMF of a phase is E = √2·π·f·N·k_w·Φ
// with f = p·n/60 and N the series turns per phase (textbook; e.g. Pyrhönen et
// al., Design of Rotating Electrical Machines). Resistance is ρ·L/A at 20 °C
// with ρ = 1/58 Ω·mm²/m and the IEC 60028 temperature correction. A DC-bus
// target is met when the peak line EMF √2·V_LL reaches the bus plus the
// diode drops (a diode bridge into a battery conducts only above it); the
// cut-in reported is that of the whole turns built. The copper loss is at the
// working temperature of the thermal class (IEC 60034-1) or the job's own.
//
// Polarity: with DC entering a phase at its start terminal, a tooth whose coil
// is wound clockwise seen from the air gap shows a south pole at its face,
// counter-clockwise a north pole (right-hand rule). The plan lists the pole of
// every wound tooth and puts a polarity test after each phase's last coil and
// before the star point or delta corners.
//
// Resistance is what a meter reads at the ends of the leads. Every path has
// its own start and finish lead, trimmed to the job's lead length; the paths
// of a phase are joined at the lead ends (all starts as X1, all finishes as
// X2), and the star point or delta corners are made there too. So a path
// reads ρ·(path + two leads)/A, a phase is its paths in parallel, and the
// line-to-line readings follow from the connection (LineOhms).
//
// Test vocabulary. Each test of Plan.Tests has a Name (the Test* keys: the
// same string in the plan's JSON, the check's findings, the progress record
// and the print), a typed Unit (SI symbols: Ω, MΩ, V, °C, %, s, rpm) and
// Compare (AtMost, AtLeast, InBand). LimitText writes a limit and
// FormatValue a value (FormatWatts the heat of a test current) the one way
// every screen and page shows them;
// ImbalancePercent is the one balance rule (largest deviation from the mean,
// EASA AR100); ResistanceBand the one band of a correct winding.
//
// Reading schema. Test.Readings lists what the person reads for each test,
// in order, as plain data: a stable Key (lower-case ASCII), a Label, a Unit,
// an optional Preset, and, where the plan knows it, the Expected value as
// the meter shows it at the job's ambient temperature with its window.
// Following the job's phases, paths and connection:
//
//	continuity             one per path: U1–U2, V1–V2, W1–W2 (keys u1_u2 …;
//	                       "path k" and _pk with several paths), expected ρL/A
//	                       of the path and its leads, at most ContinuityFactor×
//	phase_insulation       every pair of phases: U–V, U–W, V–W (u_v …), MΩ
//	resistance             the m adjacent line pairs U–V, V–W, W–U (uv, vw, wu)
//	                       and the winding temperature (temp); expected line
//	                       to line: R_a + R_b for star, R_a·(S − R_a)/S for
//	                       delta, within the resistance band
//	balance                none of its own: ReadingsFrom names the resistance
//	                       test, whose readings it is worked out from
//	                       (Plan.ReadingsFor resolves the reference)
//	insulation_resistance  ir1 (after 1 min), volts, temp, ir10 (optional,
//	                       after 10 min, for the polarization index)
//	hv_withstand           volts applied, seconds held, passed (1 held, 0
//	                       broke down)
//	back_emf               the line voltages (uv, vw, wu) and the speed (rpm)
//
// FormatReadings writes recorded values by that schema ("U–V 285.8 mΩ, …").
// Resolutions states the smallest turn error each test can see on the job
// (Test.Resolution): one turn lengthens a path by a mean turn, and each
// test's limit sets how many turns must be off before it shows.
//
// Conventions follow package winding: teeth 1..Q counter-clockwise from the
// lead end, slot k after tooth k, directions seen from the air gap. Lengths of
// wire are per strand in metres; geometry in mm.
//
// Down and up slots. With the lead end up and facing the tooth from the air
// gap, a clockwise coil goes down the slot on the right and comes up the slot
// on the left, a counter-clockwise coil the other way round. For an outer
// rotor (seen from outside) tooth k's right-hand slot is slot k; for an inner
// rotor (seen from the bore) slot k−1. CoilSlots derives them once; every coil
// step carries them (CoilStep.DownSlot, UpSlot) and SlotWords says them in
// the words every screen and page uses: "down slot 1, up slot 24". A jumper
// (JumperStep, on each jumper step) leaves the up slot of one coil at the lead
// end and enters the down slot of the next, the shorter way round; its length
// is the arc between the two slot centres at mid slot depth plus the slack,
// and JumperStep.Words gives its instruction: "leaves slot 2 at the lead end,
// enters slot 6: 4 slot pitches, counter-clockwise seen from the lead end".
//
// The machine figures (machine.go) are analytical estimates at the rated
// point: the phase inductance as the sum of air-gap (with the harmonic
// leakage of the winding's whole MMF spectrum), slot, tooth-tip and
// end-winding parts; the reactance and voltage under load; the torque and EMF
// constants; the flux densities of teeth and yoke with a saturation warning;
// copper, iron and mechanical losses and the efficiency; and for a DC-bus
// job the charging curve of a time-stepped diode bridge (bridge.go). Inputs
// the job leaves out are named in Machine.Notes, never guessed.
//
// Build does no I/O and keeps no state: a Plan is plain data that screens and
// printouts only read. The plan does not model saturation (it warns of it),
// armature reaction beyond the synchronous reactance, or the losses in the
// magnets and the rotor.
package plan
