// Package printout lays out and renders the shop pack of a winding plan: the
// slot map with the plan's warnings and its title block (and, for a stator
// whose labels would collide on one ring, sector sheets drawn large enough
// for every tooth's number, phase mark and sense), the developed layout, the connection sheet,
// the machine sheet where the plan has machine figures (machine.go: inductance, losses,
// the charging curve), the cut list and materials, the winding checklist, the polarity
// sheet (the pole every tooth must show, to tick) and the test record.
//
// Model. Build turns a *plan.Plan into a Pack: pages of plain shapes (lines,
// boxes, arcs, polylines, text runs) in mm from the top left corner of the
// sheet, y pointing down, angles in degrees counter-clockwise as a reader
// sees the page. Every text run carries its measured width (from the Go
// fonts' own advance widths), so layouts are tested on the model without a
// PDF. Render is a thin pass that draws the model with fpdf; it does no
// layout. Fonts are the Go fonts (goregular, gobold, gomono) embedded as
// subsets; runes they lack are printed as '?' (the tests fail on any). No
// word is set below 7 pt (sizeMin). Glyphs the fonts lack and the
// pack needs (the circular arrows of winding sense, the conductor cross and
// dot, the warning triangle) are vector shapes.
//
// Conventions. Teeth are numbered 1..Q counter-clockwise seen from the
// connection end, tooth 1 at the top of the slot map; slot k lies between
// tooth k and tooth k+1 (package winding conventions). A sense arrow shows the way round the
// tooth seen from the air gap facing the tooth, following the path from its
// start terminal. A jumper on the connection sheet is labelled slot to slot
// from the engine's values (plan.JumperStep): the slot it leaves and the
// slot it enters ("s2→s6"), the slot pitches and the way round seen from
// the lead end ("4 ccw"), as the checklist's jumper rows say in words. In
// the developed layout a cross marks a coil side whose
// current (from the start terminal) runs into the stack, away from the
// connection end, and a dot one running out towards it; sideIntoStack
// derives this from the sense and the rotor side. Phase colours follow IEC
// 60445 (brown, black, grey for L1, L2, L3) and every colour is doubled by
// the phase letter and a line pattern (solid, dashed, dotted) so the pack
// reads on a monochrome printer; a fourth and fifth phase take orange and
// violet with dash-dot patterns (this project's choice: IEC 60445 names no
// further phase colours and reserves blue and green-and-yellow). Output is
// deterministic: the PDF dates come from Options.Date or the plan's Date,
// resources are sorted, so two renders of one plan are byte-identical.
//
// Progress. Printed after or during winding the pack is the stator's
// record: with Options.Progress the checklist ticks the steps done (a
// stroked tick, not a glyph) with their dates, writes the turns counted on
// each done coil (a count that differs from the plan white on black, the
// plan's under it), prints the notes under their rows and sums up the record
// at the top; the test record prints the readings with their dates and the
// results the check (winding/verify) works out from them. A test worked out
// from another's readings (plan.Test.ReadingsFrom: the balance from the
// resistance readings) asks for nothing to be read: it names that test and
// gives one computed cell. An optional test left out prints as skipped,
// in the checklist and on the record. Entries
// naming a step or tooth the plan no longer has there are left out and
// counted. Rows not done stay blank, to fill in by hand.
//
// What it does not do. It reads plans and never changes them, computes no
// winding quantity of its own beyond drawing geometry, reads no files (the
// progress record arrives replayed, as plain data in Options.Progress and
// Options.Readings) and prints nothing but A4 and US Letter portrait sheets.
package printout
