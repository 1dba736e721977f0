// Package journal keeps the progress record of one stator: an append-only
// file of JSON lines beside the job file, one line per event at the bench
// (the plan's fingerprint, a step done, a step undone, the turn count of the
// coil in progress, a note, test readings with their verdict).
//
// Model. A record is a sequence of Events. Decode reads a record; what the
// events mean against a plan (which steps are done, which entries no longer
// fit an edited job) is the business of package progress. Steps are the
// 1-based Plan.Steps indices, named again by their Key (what the step is);
// coils are named by their tooth (1..Q).
//
// Durability. Events are written whole and synced, a batch of them with one
// sync, so after a crash or a pulled cable only the last line can be torn. A
// last line that does not decode and lacks its newline is a torn write:
// Decode leaves it out and reports it (TornTail), and Store copies its bytes
// to a side file next to the record before it cuts them. Any other line that
// does not decode, or holds a value beyond the record's bounds (MaxTurns and
// the like), is a *DecodeError naming its line: the record was edited or
// damaged and is not guessed at. Open refuses such a record with a
// *DamagedError (Damaged makes one for other readers), whose message gives the
// line and the two ways on: repair or delete the line, or move the file aside
// for a fresh record. Text fields are cleaned of control
// characters on the way in and on the way out (Clean).
//
// Files. Decode is pure. Store is the only code in the engine that touches
// the file system; its methods may be called from several goroutines. It
// holds the record open from Open on, so that a file put in its place is told
// apart from it even when the file system gives the new file the removed
// one's number. It holds an exclusive lock: a lock file beside the record,
// whose kernel lock (flock) decides who holds it, on the record's path with
// symbolic links resolved (Resolve), so two names for one record share one
// lock; a lock file nobody holds is stale whatever process it names. The
// record file itself is flocked too while it is open, so a second name made
// by a hard link (which no path can resolve) is refused as well. Before
// each write Store checks that the file at the path is still the one it
// holds; a record removed, replaced or cut by another program is written
// again from the events in memory, with a notice (Notices), and whatever
// stood there is kept in a side file. Events that could not be written stay
// in memory until a later Append or Retry writes them. WriteFileAtomic is the
// way every command writes an output file.
//
// The package knows nothing of plans beyond step indices, keys and tooth
// numbers.
package journal
