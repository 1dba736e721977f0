// Package journal keeps the progress record of one stator: an append-only
// file of JSON lines beside the job file, one line per event at the bench
// (a step done, a step undone, the turn count of the coil in progress, a note,
// test readings with their verdict).
//
// Model. A record is a sequence of Events. Decode reads a record and Replay
// folds the events into a State: which plan steps are done, the first step not
// done, the turns counted on a coil in progress, the actual turns of every
// finished coil, the notes and the latest readings of each test. Steps are the
// 1-based Plan.Steps indices; coils are named by their tooth (1..Q).
//
// Durability. Every line is written whole and then synced, so after a crash
// or a pulled cable only the last line can be torn; Decode tolerates and
// reports a torn or garbled last line (TornTail) and Store truncates it before
// it appends. A garbled line anywhere else is an error naming the line: the
// record has been edited or damaged and is not guessed at.
//
// Files. Decode and Replay are pure. Store is the only code in the engine that
// touches the file system: it holds an exclusive lock (a lock file created
// with O_EXCL, naming the holder, pid, host and time, plus flock where the
// platform has it) so two bench sessions never write one record, and it keeps
// events that could not be written in memory until a later Append or Retry
// writes them.
//
// The package knows nothing of plans beyond step indices and tooth numbers: it
// does not check that a step exists or that a coil belongs to a step.
package journal
