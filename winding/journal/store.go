package journal

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"sync"
	"syscall"
	"time"
)

// PathFor returns where the progress record of a job file lives: beside it,
// with ".progress" added to its name.
func PathFor(jobPath string) string { return jobPath + ".progress" }

// LockPathFor returns the lock file of a record.
func LockPathFor(recordPath string) string { return recordPath + ".lock" }

// Resolve names a record by the file it is, not by how it was written: the
// absolute path with every symbolic link followed (for a record not yet
// written, its folder's). Two paths to one record resolve alike, so they
// share one lock.
func Resolve(path string) string {
	if abs, err := filepath.Abs(path); err == nil {
		path = abs
	}
	if r, err := filepath.EvalSymlinks(path); err == nil {
		return r
	}
	if r, err := filepath.EvalSymlinks(filepath.Dir(path)); err == nil {
		return filepath.Join(r, filepath.Base(path))
	}
	return path
}

// Store appends events to one record file under an exclusive lock. Its
// methods may be called from several goroutines (a guide's last write may
// still run while it closes); they take turns.
//
// Before each write it checks that the file at its path is still the one it
// holds. When the record was removed, replaced or moved by another program
// (an editor, a sync tool, a backup), it writes the record again from the
// events it holds in memory, keeps whatever stood at the path in a side file,
// and says so in a notice (Notices). Bytes it cuts from the end of the record
// (a torn last line, lines appended by another program) are first copied to a
// side file.
type Store struct {
	mu   sync.Mutex
	path string // resolved
	lock *lockFile
	// f is the record, held open from Open (or its first write) on, so that
	// the file at the path can be told apart from it: a file system reuses
	// the number of a removed file at once, so a file not held open cannot
	// be recognised by its number. nil after a failed write, until reopened.
	f       file
	ident   os.FileInfo // the record file as last written or read; nil before it exists
	size    int64       // bytes of good, synced lines
	ownTail bool        // bytes past size are a write of ours cut short
	events  []Event     // every event in the record, in order
	nextSeq int
	pending []Event
	notices []string
	// needNewline: the last good line lacks its newline; written before the next line.
	needNewline bool
	now         func() time.Time
	open        func(path string) (file, error) // replaced in tests to simulate a failing disk
}

// file is what Store needs of an open record.
type file interface {
	io.Writer
	io.ReaderAt
	Sync() error
	Truncate(size int64) error
	Seek(offset int64, whence int) (int64, error)
	Stat() (os.FileInfo, error)
	Close() error
}

func openRecord(path string) (file, error) {
	_, statErr := os.Stat(path)
	f, err := os.OpenFile(path, os.O_RDWR|os.O_CREATE, 0o644)
	if err != nil {
		return nil, err
	}
	if errors.Is(statErr, os.ErrNotExist) {
		// A new file: make its name durable too, or a power cut could
		// leave synced lines in a file no directory points to (fsync(2)).
		if err := syncDir(filepath.Dir(path)); err != nil {
			f.Close()
			return nil, err
		}
	}
	return f, nil
}

// syncDir flushes a directory's entries to disk. Systems that cannot sync a
// directory (it is opened read-only and Sync is refused) are let pass.
func syncDir(dir string) error {
	d, err := os.Open(dir)
	if err != nil {
		return err
	}
	defer d.Close()
	if err := d.Sync(); err != nil && !errors.Is(err, os.ErrInvalid) && !errors.Is(err, syscall.EINVAL) {
		return err
	}
	return nil
}

// WriteError is an event that could not be written. The event is kept in
// memory (Pending) and written first by the next Append or by Retry.
type WriteError struct {
	Path    string
	Pending int // events waiting to be written
	Err     error
}

// Error puts the cause first (no space left on device, read-only file
// system), so a status line cut to the screen's width still shows it.
func (e *WriteError) Error() string {
	cause := e.Err
	var pe *os.PathError
	if errors.As(cause, &pe) && (pe.Path == e.Path || filepath.Dir(pe.Path) == filepath.Dir(e.Path)) {
		cause = pe.Err // the path is said once, below
	}
	return fmt.Sprintf("%v writing the progress record %s; %d event(s) kept in memory, not yet saved: free space or fix the disk or folder, and it is written again", cause, e.Path, e.Pending)
}

func (e *WriteError) Unwrap() error { return e.Err }

// Open locks the record at path for holder (a short name for who writes:
// "bench", "check") and reads it. A missing record is an empty one; the file is
// created by the first Append. A torn last line (cut short, without its
// newline) is reported; before anything is appended its bytes are copied to
// a side file, named in a notice (Notices), and cut off. Any other line that
// does not decode refuses the record with a *DamagedError, which says how to
// go on; the file is left as it is. A record locked by a running
// program is refused with a *LockedError; a lock file nobody holds is stale
// and taken, whatever process it names.
func Open(path, holder string) (*Store, []Event, *TornTail, error) {
	path = Resolve(path)
	lk, err := acquire(LockPathFor(path), holder)
	if err != nil {
		return nil, nil, nil, err
	}
	f, data, err := openExisting(path)
	if err != nil {
		lk.release()
		return nil, nil, nil, fmt.Errorf("journal: read %s: %w", path, err)
	}
	if f != nil {
		if err := lockRecordFile(f); err != nil {
			f.Close()
			lk.release()
			return nil, nil, nil, err
		}
	}
	events, torn, err := Decode(data)
	if err != nil {
		if f != nil {
			f.Close()
		}
		lk.release()
		return nil, nil, nil, Damaged(path, data, err)
	}
	s := &Store{path: path, lock: lk, size: int64(len(data)), now: time.Now, open: openRecord, events: events}
	if f != nil {
		s.f = f
		if fi, err := f.Stat(); err == nil {
			s.ident = fi
		}
	} else if fi, err := os.Stat(path); err == nil {
		s.ident = fi // read-only: it cannot be written anyway
	}
	if old := lk.stale; old != nil {
		s.notices = append(s.notices, fmt.Sprintf("The record's lock named %q (pid %d on %s since %s), which no longer held it: that program stopped without releasing it, so the lock was taken.",
			old.Holder, old.PID, old.Host, old.Since.Format(time.RFC3339)))
	}
	switch n := len(data); {
	case torn != nil:
		s.size = torn.Offset // kept aside and cut off by the first write
	case n > 0 && data[n-1] != '\n':
		s.needNewline = true // the last event is whole but its newline was lost
	}
	for _, e := range events {
		s.nextSeq = max(s.nextSeq, e.Seq)
	}
	s.nextSeq++
	return s, events, torn, nil
}

// Path returns the record's path, symbolic links resolved.
func (s *Store) Path() string { return s.path }

// Append writes events and syncs them once. Seq and Time are filled when
// zero. An invalid event is refused with an *EventError and none of the
// events is kept. When the write fails the events are kept as pending and a
// *WriteError is returned; pending events are written, in order, before the
// next ones.
func (s *Store) Append(events ...Event) error {
	s.mu.Lock()
	defer s.mu.Unlock()
	batch := make([]Event, 0, len(events))
	seq := s.nextSeq
	for _, e := range events {
		if e.Seq == 0 {
			e.Seq = seq
		}
		if e.Time.IsZero() {
			e.Time = s.now()
		}
		e = e.cleaned()
		if _, err := Line(e); err != nil {
			return err
		}
		seq = max(seq, e.Seq) + 1
		batch = append(batch, e)
	}
	s.nextSeq = seq
	s.pending = append(s.pending, batch...)
	return s.flush()
}

// Retry writes the pending events. It returns nil when none are left.
func (s *Store) Retry() error {
	s.mu.Lock()
	defer s.mu.Unlock()
	return s.flush()
}

// Pending returns the events kept in memory, not yet written.
func (s *Store) Pending() []Event {
	s.mu.Lock()
	defer s.mu.Unlock()
	return append([]Event(nil), s.pending...)
}

// Notices returns what the store had to do about the file since the last
// call (a record written again after it was removed or replaced, bytes kept
// in a side file), in words, and forgets them.
func (s *Store) Notices() []string {
	s.mu.Lock()
	defer s.mu.Unlock()
	n := s.notices
	s.notices = nil
	return n
}

// Close writes what is pending, closes the record and releases the lock. A
// record removed, replaced or cut by another program since the last write is
// written again from memory first, with a notice (Notices may be called after
// Close). The lock is released even when events could not be written; the
// error then says how many were lost.
func (s *Store) Close() error {
	s.mu.Lock()
	defer s.mu.Unlock()
	err := s.flush()
	if err == nil && s.lock != nil && len(s.events) > 0 {
		// A record removed, replaced or cut since the last write would
		// otherwise be lost with this store's memory.
		if how, cerr := s.changedUnderUs(); cerr == nil && how != "" {
			if rerr := s.rewrite(how); rerr != nil {
				err = &WriteError{Path: s.path, Pending: len(s.events), Err: rerr}
			}
		}
	}
	s.drop()
	if s.lock != nil {
		s.lock.release()
		s.lock = nil
	}
	return err
}

func (s *Store) flush() error {
	if len(s.pending) == 0 {
		return nil
	}
	if s.lock == nil {
		return &WriteError{Path: s.path, Pending: len(s.pending), Err: errors.New("the store is closed")}
	}
	if gone, err := s.changedUnderUs(); err != nil {
		return &WriteError{Path: s.path, Pending: len(s.pending), Err: err}
	} else if gone != "" {
		if err := s.rewrite(gone); err != nil {
			return &WriteError{Path: s.path, Pending: len(s.pending), Err: err}
		}
		return nil
	}
	if err := s.reopen(); err != nil {
		s.drop()
		return &WriteError{Path: s.path, Pending: len(s.pending), Err: err}
	}
	var buf bytes.Buffer
	for _, e := range s.pending {
		line, err := Line(e)
		if err != nil {
			return &WriteError{Path: s.path, Pending: len(s.pending), Err: err}
		}
		buf.Write(line)
	}
	_, err := s.f.Write(buf.Bytes())
	if err == nil {
		err = s.f.Sync()
	}
	if err != nil {
		s.drop() // a partial write of ours is cut off when the file is reopened
		s.ownTail = true
		return &WriteError{Path: s.path, Pending: len(s.pending), Err: err}
	}
	s.size += int64(buf.Len())
	s.events = append(s.events, s.pending...)
	s.pending = nil
	if fi, err := s.f.Stat(); err == nil {
		s.ident = fi
	}
	return nil
}

// changedUnderUs says, in words, how the file at the path is no longer the
// record this store holds ("" when it still is).
func (s *Store) changedUnderUs() (string, error) {
	if s.f != nil {
		if fi, err := s.f.Stat(); err == nil {
			s.ident = fi // the file held open: its number cannot be reused
		}
	}
	at, err := os.Stat(s.path)
	switch {
	case errors.Is(err, os.ErrNotExist):
		if s.ident == nil {
			return "", nil // not written yet
		}
		return "was removed or moved away", nil
	case err != nil:
		return "", err
	case s.ident == nil:
		return "was created by another program", nil
	case !os.SameFile(s.ident, at):
		return "was replaced by another file", nil
	case at.Size() < s.size:
		return fmt.Sprintf("was cut to %d bytes by another program (it had %d)", at.Size(), s.size), nil
	}
	return "", nil
}

// rewrite writes the whole record again from memory, after what stood at
// the path is kept aside: into a temporary file in the same folder, synced,
// then renamed over the path.
func (s *Store) rewrite(how string) error {
	s.drop()
	kept := ""
	if _, err := os.Stat(s.path); err == nil {
		side, err := sideName(s.path, "replaced")
		if err != nil {
			return err
		}
		if err := os.Rename(s.path, side); err != nil {
			return fmt.Errorf("the record %s; keeping that file aside failed: %w", how, err)
		}
		kept = side
	}
	all := append(append([]Event(nil), s.events...), s.pending...)
	var buf bytes.Buffer
	for _, e := range all {
		line, err := Line(e)
		if err != nil {
			return err
		}
		buf.Write(line)
	}
	if err := WriteFileAtomic(s.path, buf.Bytes(), 0o644); err != nil {
		return fmt.Errorf("the record %s; writing it again failed: %w", how, err)
	}
	f, err := s.open(s.path)
	if err != nil {
		return fmt.Errorf("the record %s; it was written again but cannot be opened: %w", how, err)
	}
	lockRecordFile(f) // a file just made has no other name to be held under
	fi, err := f.Stat()
	if err != nil {
		f.Close()
		return err
	}
	s.f = f
	s.ident, s.size, s.needNewline, s.ownTail = fi, int64(buf.Len()), false, false
	s.events, s.pending = all, nil
	msg := fmt.Sprintf("The progress record %s %s while open; it was written again from the work in memory (%d entries)", s.path, how, len(all))
	if kept != "" {
		msg += "; the file that stood there is kept as " + kept
	}
	s.notices = append(s.notices, msg+".")
	return nil
}

// reopen makes sure the record is open, holds only good lines, and is
// positioned at its end. Bytes past the good lines that are not a write of
// ours cut short are copied to a side file before they are cut.
func (s *Store) reopen() error {
	if s.f == nil {
		f, err := s.open(s.path)
		if err != nil {
			return err
		}
		if err := lockRecordFile(f); err != nil {
			f.Close()
			return err
		}
		s.f = f
	}
	fi, err := s.f.Stat()
	if err != nil {
		return err
	}
	if fi.Size() < s.size {
		return fmt.Errorf("the record is %d bytes, shorter than the %d already written: another program changed it", fi.Size(), s.size)
	}
	if fi.Size() > s.size {
		if !s.ownTail {
			extra := make([]byte, fi.Size()-s.size)
			if _, err := s.f.ReadAt(extra, s.size); err != nil && !errors.Is(err, io.EOF) {
				return err
			}
			side, err := keepAside(s.path, "cut", extra)
			if err != nil {
				return fmt.Errorf("%d bytes at the end of the record are not whole entries and could not be kept aside before cutting them: %w", len(extra), err)
			}
			s.notices = append(s.notices, fmt.Sprintf("%d bytes at the end of the progress record that were not whole entries (a line cut short, or lines another program added) were cut from it and kept in %s.", len(extra), side))
		}
		if err := s.f.Truncate(s.size); err != nil {
			return err
		}
		if err := s.f.Sync(); err != nil {
			return err
		}
	}
	s.ownTail = false
	if _, err := s.f.Seek(s.size, io.SeekStart); err != nil {
		return err
	}
	if s.needNewline {
		if _, err := s.f.Write([]byte{'\n'}); err != nil {
			return err
		}
		s.size++
		s.needNewline = false
	}
	return nil
}

// openExisting opens the record at path for reading and writing and reads it
// whole; a record that does not exist yet is (nil, nil, nil).
func openExisting(path string) (file, []byte, error) {
	f, err := os.OpenFile(path, os.O_RDWR, 0)
	switch {
	case errors.Is(err, os.ErrNotExist):
		return nil, nil, nil
	case errors.Is(err, os.ErrPermission) || errors.Is(err, syscall.EROFS):
		// Readable but not writable: read it; the first write says why it fails.
		data, err := os.ReadFile(path)
		return nil, data, err
	case err != nil:
		return nil, nil, err
	}
	data, err := io.ReadAll(f)
	if err != nil {
		f.Close()
		return nil, nil, err
	}
	return f, data, nil
}

func (s *Store) drop() {
	if s.f != nil {
		s.f.Close()
		s.f = nil
	}
}
