package journal

import (
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"os"
	"time"
)

// LockInfo is what a lock file holds: who holds the record.
type LockInfo struct {
	Holder string    `json:"holder"`
	PID    int       `json:"pid"`
	Host   string    `json:"host"`
	Since  time.Time `json:"since"`
}

// LockedError refuses a record that another running program holds.
type LockedError struct {
	Path string   // the lock file
	Info LockInfo // its holder; empty when the lock file could not be read
	// other: the record file itself is held, under another name.
	other bool
}

func (e *LockedError) Error() string {
	if e.other {
		return "journal: " + ErrOtherName.Error()
	}
	i := e.Info
	if i.Holder == "" && i.PID == 0 {
		return fmt.Sprintf("journal: the record is in use by another program (it holds %s); close that program first", e.Path)
	}
	return fmt.Sprintf("journal: the record is in use by %q (pid %d on %s since %s); close that first",
		i.Holder, i.PID, i.Host, i.Since.Format(time.RFC3339))
}

// ErrLocked matches every *LockedError with errors.Is.
var ErrLocked = errors.New("journal: record locked")

// Is lets errors.Is(err, ErrLocked) match.
func (e *LockedError) Is(target error) bool { return target == ErrLocked }

type lockFile struct {
	path string
	f    *os.File
	// stale is the holder named by a lock file whose kernel lock was free
	// when it was taken (a program that died without releasing it).
	stale *LockInfo
}

// acquire takes the lock of a record. Where the platform has flock the
// kernel lock on the lock file decides: a lock file whose flock is free is
// stale, whatever process it names, and is taken as it is (never deleted
// first, so two starters cannot both win); after flock succeeds the file is
// checked to still be the one at path, since a holder removes it on release.
// Elsewhere the lock file is created with O_EXCL and never taken over.
func acquire(path, holder string) (*lockFile, error) {
	host, _ := os.Hostname()
	info := LockInfo{Holder: holder, PID: os.Getpid(), Host: host, Since: time.Now().UTC().Truncate(time.Second)}
	if !haveFlock {
		return acquireExclusive(path, info)
	}
	for attempt := 0; attempt < 8; attempt++ {
		f, err := os.OpenFile(path, os.O_RDWR|os.O_CREATE, 0o644)
		if err != nil {
			return nil, fmt.Errorf("journal: lock %s: %w", path, err)
		}
		if err := flock(f); err != nil {
			old := readLockInfo(f)
			f.Close()
			return nil, &LockedError{Path: path, Info: old}
		}
		held, err1 := f.Stat()
		at, err2 := os.Stat(path)
		if err1 != nil || err2 != nil || !os.SameFile(held, at) {
			// The holder released it (and removed the file) between our
			// open and our flock: try again on the file now at path.
			funlock(f)
			f.Close()
			continue
		}
		lk := &lockFile{path: path, f: f}
		if old := readLockInfo(f); old.PID != 0 || old.Holder != "" {
			lk.stale = &old
		}
		if err := writeLockInfo(f, info); err != nil {
			lk.release()
			return nil, fmt.Errorf("journal: write lock %s: %w", path, err)
		}
		return lk, nil
	}
	return nil, &LockedError{Path: path}
}

// acquireExclusive is the lock where there is no flock: the lock file is
// created with O_EXCL, and one that exists refuses the record.
func acquireExclusive(path string, info LockInfo) (*lockFile, error) {
	f, err := os.OpenFile(path, os.O_RDWR|os.O_CREATE|os.O_EXCL, 0o644)
	if errors.Is(err, os.ErrExist) {
		var old LockInfo
		if data, rerr := os.ReadFile(path); rerr == nil {
			json.Unmarshal(data, &old)
		}
		return nil, &LockedError{Path: path, Info: old}
	}
	if err != nil {
		return nil, fmt.Errorf("journal: lock %s: %w", path, err)
	}
	lk := &lockFile{path: path, f: f}
	if err := writeLockInfo(f, info); err != nil {
		lk.release()
		return nil, fmt.Errorf("journal: write lock %s: %w", path, err)
	}
	return lk, nil
}

func readLockInfo(f *os.File) LockInfo {
	var info LockInfo
	data, err := io.ReadAll(io.NewSectionReader(f, 0, 1<<16))
	if err == nil {
		json.Unmarshal(data, &info)
	}
	return info
}

func writeLockInfo(f *os.File, info LockInfo) error {
	b, _ := json.Marshal(info)
	if err := f.Truncate(0); err != nil {
		return err
	}
	if _, err := f.WriteAt(append(b, '\n'), 0); err != nil {
		return err
	}
	return f.Sync()
}

// release removes the lock file, while still holding it and only when it is
// still the file this lock holds, then lets go of the kernel lock.
func (l *lockFile) release() {
	if l == nil || l.f == nil {
		return
	}
	held, err1 := l.f.Stat()
	at, err2 := os.Stat(l.path)
	if err1 == nil && err2 == nil && os.SameFile(held, at) {
		os.Remove(l.path)
	}
	funlock(l.f)
	l.f.Close()
	l.f = nil
}

// ErrOtherName refuses a record that another store holds open under another
// name (a hard link): the lock beside each name cannot see the other.
var ErrOtherName = errors.New("the record is open in another program under another name (a hard link to the same file); close that program first")

// lockRecordFile takes the kernel lock on the record file itself, so two
// names for one file (hard links, which Resolve cannot tell apart) are never
// written by two stores at once. Files without a descriptor (test doubles)
// and systems without flock pass.
func lockRecordFile(f file) error {
	fd, ok := f.(interface{ Fd() uintptr })
	if !haveFlock || !ok {
		return nil
	}
	if err := flockFd(fd.Fd()); err != nil {
		return &LockedError{Path: "", Info: LockInfo{}, other: true}
	}
	return nil
}
