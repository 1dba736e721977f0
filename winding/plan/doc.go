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
// Build does no I/O and keeps no state: a Plan is plain data that screens and
// printouts only read. The plan does not model saturation, armature reaction,
// the voltage drop under load or the losses in iron and magnets: the EMFs are
// open-circuit values.
package plan
