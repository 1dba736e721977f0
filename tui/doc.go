// Package tui is the bench guide: a terminal screen that leads a person through
// winding, connecting and testing a tooth-coil stator one step at a time.
//
// Model. One root Model holds a screen (guide, overview, help) and a shared
// context — the terminal size, the styles, the key maps, the plan and the
// progress — handed by pointer to a small child model per screen. The guide
// shows a drawing of the stator (teeth in a ring, or a developed strip when
// the ring does not fit), the current step with everything needed to do it,
// and a turn counter. Every change of progress (a turn counted, a step done,
// an undo, a note, a reading) is an event of the progress record, applied at
// once to the one model of progress (winding/progress: the record folded
// against the plan, the same rule for what fits on resume and live) and
// queued for the record; the queue is written by a tea.Cmd, everything
// waiting in one batch with one sync, so events reach the record in order and
// a write error keeps them in memory and retries. A write starts at once when
// the last one started BurstGap (150 ms) ago or more; keys that come faster (a
// held space bar, a burst) gather and go in the next write, so a burst of 60
// turns costs a handful of syncs on any disk. On resume a banner says
// what the model found (a job edited since, entries left out, a torn last
// line kept aside) and, while open, what the store had to do about the file
// (the record removed or replaced under it and written again).
//
// Conventions. Teeth are numbered counter-clockwise seen from the lead end;
// the ring is drawn as seen from the lead end with tooth 1 at the top. A
// tooth shows its coil as a signed token: the upper-case phase letter with
// '+' when the coil is wound clockwise and '-' when counter-clockwise (seen
// from the air gap), '·' for a tooth without a coil; letter case never carries
// meaning. A wound coil carries '#', the tooth of the current step '@', the
// tooth of a step looked at '*', the coils the wire comes from and goes to
// next 'f' and 'n'; colour only repeats what the text says. The legend
// under the drawing never drops "seen from the air gap" (shortened to "(from
// air gap)" on a narrow terminal), and the ring's caption says both views:
// the ring seen from the lead end, the signs seen from the air gap. The ring shows
// no arrows: the only arrows are in the picture of the coil in hand, drawn
// as the winder sees it (facing the tooth from the air gap, lead end up, the
// down and up slots labelled), under the words that name that view.
//
// Layout. A step panel is built of parts with priorities (fitpanel.go): the
// live parts (the tooth, its sense in words, its down and up slots and the
// count; a test's fields, errors and verdict; the note being typed) are
// always shown; the useful ones while they fit; cautions, sources and
// reminders are cut first behind a "more" line that the m key pages through
// (each press shows the next cut lines, then the panel as it was).
// The panel takes the roomiest of a few levels that fits (the count in '#'
// figures that grow with the terminal, down to one line), and the stator
// drawing is dropped before a live part would be. The key line always ends
// with ? and q. The guide works from 60x18 up. The terminal bell rings when
// the count in hand reaches the plan (Options.Bell; the b key turns it off).
//
// Looking. Left/right (or [ and ]) move a look to another step, and enter on
// a line of the overview opens that step: the panel shows it read-only as it
// was recorded, under a banner saying so, and no key changes progress until
// esc, home or enter brings back the step in hand. Undo, or any change of
// progress, ends the look.
//
// The models do no I/O of their own: the progress record is a Recorder given
// by the caller (JournalRecorder over a winding/journal store; Run opens one),
// and every call to it runs inside a tea.Cmd. Readings are typed as the
// meter shows them (readingvalue.go): a metric prefix and the unit are read,
// and a plain number a thousand times the expected value is refused as a
// slipped prefix; a failed test is recorded only with y. It reads plans and never
// changes them. It computes no verdicts of its own beyond a
// plain limit comparison used when no Judge is given.
package tui
