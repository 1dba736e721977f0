// Package progress is the one model of where the work on a stator stands:
// the events of its progress record (package journal) folded against the
// build plan.
//
// Model. Fold reads the events in record order and gives a State: which plan
// steps are done and when, the turns counted on each coil (in progress or
// wound), the note and the latest readings of each step, the readings of
// each test, the notes of no step, and every entry it left out with its line
// number and why. The bench guide applies its live events through the same
// State.Apply, so a resume shows exactly what was on the screen.
//
// Fitting the plan. An entry counts for a step only when it names that step
// by what the step is (its Key): a coil by tooth, phase and sense, a jumper by
// the teeth it joins, a separator by its slot, a test by its name, any other
// step by its kind and title. An entry is never placed by its step number
// alone; an entry written before keys existed fits a coil step by its tooth,
// and other steps only while the plan is the one the record was written
// against. Turn counts beyond what the slot could hold are left out.
//
// Fingerprint. The record carries the plan's fingerprint (Fingerprint: the
// pair, layers, paths, connection, turns per coil, the coils in order, the
// steps and tests). When the job was edited between sessions, Changes says in
// words what changed and the State's Summary what was done with each kind of
// entry; the guide and the printed pack show the same lines.
//
// The package is pure: it reads no file and knows no screen.
package progress
