package journal

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"syscall"
	"time"
)

// PathFor returns where the progress record of a job file lives: beside it,
// with ".progress" added to its name.
func PathFor(jobPath string) string { return jobPath + ".progress" }

// LockPathFor returns the lock file of a record.
func LockPathFor(recordPath string) string { return recordPath + ".lock" }

// Store appends events to one record file under an exclusive lock. It is not
// safe for concurrent use by several goroutines.
type Store struct {
	path    string
	lock    *lockFile
	f       file  // nil when the file must be (re)opened
	size    int64 // bytes of good, synced lines
	nextSeq int
	pending []Event
	// needNewline: the last good line lacks its newline; written before the next line.
	needNewline bool
	now         func() time.Time
	open        func(path string) (file, error) // replaced in tests to simulate a failing disk
}

// file is what Store needs of an open record.
type file interface {
	io.Writer
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

func (e *WriteError) Error() string {
	return fmt.Sprintf("journal: %s: %v; %d event(s) kept in memory, not yet saved: fix the disk or folder and retry", e.Path, e.Err, e.Pending)
}

func (e *WriteError) Unwrap() error { return e.Err }

// Open locks the record at path for holder (a short name for who writes:
// "bench", "check") and reads it. A missing record is an empty one; the file is
// created by the first Append. A torn last line is reported and cut off before
// anything is appended. A record locked by a live holder is refused with a
// *LockedError; a lock left by a dead process on this host is taken over.
func Open(path, holder string) (*Store, []Event, *TornTail, error) {
	lk, err := acquire(LockPathFor(path), holder)
	if err != nil {
		return nil, nil, nil, err
	}
	data, err := os.ReadFile(path)
	if err != nil && !errors.Is(err, os.ErrNotExist) {
		lk.release()
		return nil, nil, nil, fmt.Errorf("journal: read %s: %w", path, err)
	}
	events, torn, err := Decode(data)
	if err != nil {
		lk.release()
		return nil, nil, nil, fmt.Errorf("journal: %s: %w", path, err)
	}
	s := &Store{path: path, lock: lk, size: int64(len(data)), now: time.Now, open: openRecord}
	switch n := len(data); {
	case torn != nil:
		s.size = torn.Offset // cut off by the first write
	case n > 0 && data[n-1] != '\n':
		s.needNewline = true // the last event is whole but its newline was lost
	}
	for _, e := range events {
		s.nextSeq = max(s.nextSeq, e.Seq)
	}
	s.nextSeq++
	return s, events, torn, nil
}

// Path returns the record's path.
func (s *Store) Path() string { return s.path }

// Append writes one event and syncs it. Seq and Time are filled when zero.
// An invalid event is refused with an *EventError and not kept. When the
// write fails the event is kept as pending and a *WriteError is returned;
// pending events are written, in order, before the next one.
func (s *Store) Append(e Event) error {
	if e.Seq == 0 {
		e.Seq = s.nextSeq
	}
	if e.Time.IsZero() {
		e.Time = s.now()
	}
	if _, err := Line(e); err != nil {
		return err
	}
	s.nextSeq = max(s.nextSeq, e.Seq) + 1
	s.pending = append(s.pending, e)
	return s.flush()
}

// Retry writes the pending events. It returns nil when none are left.
func (s *Store) Retry() error { return s.flush() }

// Pending returns the events kept in memory, not yet written.
func (s *Store) Pending() []Event { return append([]Event(nil), s.pending...) }

// Close writes what is pending, closes the record and releases the lock. The
// lock is released even when pending events could not be written; the error
// then says how many were lost.
func (s *Store) Close() error {
	err := s.flush()
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
	if err := s.reopen(); err != nil {
		s.drop()
		return &WriteError{Path: s.path, Pending: len(s.pending), Err: err}
	}
	for len(s.pending) > 0 {
		line, err := Line(s.pending[0])
		if err == nil {
			_, err = s.f.Write(line)
		}
		if err == nil {
			err = s.f.Sync()
		}
		if err != nil {
			s.drop() // a partial line is cut off when the file is reopened
			return &WriteError{Path: s.path, Pending: len(s.pending), Err: err}
		}
		s.size += int64(len(line))
		s.pending = s.pending[1:]
	}
	return nil
}

// reopen makes sure the record is open, holds only good lines, and is
// positioned at its end.
func (s *Store) reopen() error {
	if s.f == nil {
		f, err := s.open(s.path)
		if err != nil {
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
		if err := s.f.Truncate(s.size); err != nil {
			return err
		}
		if err := s.f.Sync(); err != nil {
			return err
		}
	}
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

func (s *Store) drop() {
	if s.f != nil {
		s.f.Close()
		s.f = nil
	}
}
