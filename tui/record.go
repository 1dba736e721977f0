package tui

import (
	"errors"
	"time"

	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/journal"
)

// Entry is one change of progress, in the order it happened: an event of
// the progress record. The guide names the step by its 1-based Step.Index
// and the kind, turns, note, readings and verdict; record stamps the time
// and what the step is.
type Entry = journal.Event

// The kinds of entry the guide makes.
const (
	EntryTurns   = journal.Turns   // the turn count of a coil in progress
	EntryDone    = journal.Done    // a step completed (coil steps carry the turns wound)
	EntryUndo    = journal.Undo    // the last completed step taken back
	EntryNote    = journal.Note    // a note attached to a step
	EntryReading = journal.Reading // readings of a test step and their verdict
)

// Recorder is the progress record the guide writes to. Append hands entries
// over, all that waited since the last write, and returns nil once they are
// durable (written together and synced once). On an error the recorder keeps
// them (and any after) and writes them, in order, before the next ones or at
// Retry, which returns nil once nothing waits. The guide calls the recorder
// only from tea.Cmds, one call at a time, never from Update or View.
type Recorder interface {
	Append(...Entry) error
	Retry() error
}

// noticer is a recorder that can say what it had to do about its file
// (the record was removed or replaced and written again).
type noticer interface{ Notices() []string }

// savedMsg reports a write: err is nil when everything handed over is
// durable; held is how many entries the recorder still keeps unwritten.
type savedMsg struct {
	err     error
	held    int
	notices []string
}

// retryMsg asks the writer to try again after a failure.
type retryMsg struct{}

// retryAfter is the wait before a failed write is tried again. It is the only
// timer in the guide, and it runs only while a write is failing.
const retryAfter = 2 * time.Second

// retryTick starts the retry timer; tests replace it to fire the retry by
// hand.
var retryTick = tea.Tick

// BurstGap is the shortest time between the starts of two writes in the
// bench guide. A key pressed when the last write started longer ago than
// this is written at once; keys that come faster (a held space bar, keys
// sent in a burst) are gathered and written together when the gap is up,
// with one fsync. At a turn a second nothing waits; a burst of 60 turns costs
// a handful of fsyncs whatever the disk, and at most 150 ms of counting is
// ever not yet on the disk.
const BurstGap = 150 * time.Millisecond

// gatherMsg says the gap after the last write is up: write what gathered.
type gatherMsg struct{}

// gatherTick starts the gathering timer; tests replace it to fire it by
// hand.
var gatherTick = tea.Tick

// heldCounter is implemented by errors that say how many entries wait.
type heldCounter interface{ HeldEntries() int }

// writer hands entries to the recorder in order, one command at a time.
type writer struct {
	rec      Recorder
	queue    []Entry // not yet handed over
	inflight bool
	waiting  bool  // a retry timer is running
	err      error // last write error, nil once everything is durable
	held     int   // entries the recorder keeps unwritten
	failures int
	sent     int // writes started (Append or Retry calls handed to commands)

	gap       time.Duration    // shortest time between starts of writes; 0 writes every key at once
	clock     func() time.Time // for the gap
	lastStart time.Time        // when the last write started
	gathering bool             // a gather timer is running
}

// push queues an entry.
func (w *writer) push(e Entry) { w.queue = append(w.queue, e) }

// pending is how many entries are not yet durable.
func (w *writer) pending() int { return len(w.queue) + w.held }

// settled reports that nothing waits and nothing is being written.
func (w *writer) settled() bool { return w.pending() == 0 && !w.inflight }

// kick hands the queued entries over unless a write runs, a retry is
// waiting, or there is nothing to write.
func (w *writer) kick() tea.Cmd {
	if w.rec == nil || w.inflight || w.waiting || w.gathering || len(w.queue) == 0 {
		if w.rec == nil {
			w.queue = nil
		}
		return nil
	}
	if w.gap > 0 {
		now := w.clock()
		if wait := w.gap - now.Sub(w.lastStart); !w.lastStart.IsZero() && wait > 0 {
			w.gathering = true
			return gatherTick(wait, func(time.Time) tea.Msg { return gatherMsg{} })
		}
		w.lastStart = now
	}
	w.inflight = true
	w.sent++
	batch := w.queue
	w.queue = nil
	rec := w.rec
	held := w.held
	return func() tea.Msg {
		err := rec.Append(batch...)
		return savedMsg{err: err, held: heldAfter(err, held+len(batch)), notices: noticesOf(rec)}
	}
}

func noticesOf(rec Recorder) []string {
	if n, ok := rec.(noticer); ok {
		return n.Notices()
	}
	return nil
}

// heldAfter is how many entries wait after a write that ended with err.
func heldAfter(err error, upTo int) int {
	if err == nil {
		return 0
	}
	var hc heldCounter
	if errors.As(err, &hc) {
		return hc.HeldEntries()
	}
	return upTo
}

// saved takes the result of a write and returns the next command: another
// write, a retry timer after a failure, or nil.
func (w *writer) saved(msg savedMsg) tea.Cmd {
	w.inflight = false
	w.held = msg.held
	if msg.err != nil {
		w.err = msg.err
		w.failures++
		w.waiting = true
		return retryTick(retryAfter, func(time.Time) tea.Msg { return retryMsg{} })
	}
	w.err, w.held, w.failures = nil, 0, 0
	return w.kick()
}

// gather writes what gathered while the gap after the last write ran.
func (w *writer) gather() tea.Cmd {
	w.gathering = false
	return w.kick()
}

// retry asks the recorder to write what it keeps; the error stays shown
// until a write succeeds.
func (w *writer) retry() tea.Cmd {
	w.waiting = false
	if w.rec == nil || w.inflight {
		return nil
	}
	if w.held == 0 {
		return w.kick()
	}
	w.inflight = true
	w.sent++
	rec := w.rec
	held := w.held
	return func() tea.Msg {
		err := rec.Retry()
		return savedMsg{err: err, held: heldAfter(err, held), notices: noticesOf(rec)}
	}
}
