package journal

import (
	"encoding/json"
	"errors"
	"fmt"
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

// LockedError refuses a record that another live program holds.
type LockedError struct {
	Path string   // the lock file
	Info LockInfo // its holder; empty when the lock file could not be read
}

func (e *LockedError) Error() string {
	i := e.Info
	if i.Holder == "" && i.PID == 0 {
		return fmt.Sprintf("journal: the record is locked (%s cannot be read); if no other coilwright is running, delete it", e.Path)
	}
	return fmt.Sprintf("journal: the record is in use by %q (pid %d on %s since %s); close that first, or if it has died on another machine delete %s",
		i.Holder, i.PID, i.Host, i.Since.Format(time.RFC3339), e.Path)
}

// ErrLocked matches every *LockedError with errors.Is.
var ErrLocked = errors.New("journal: record locked")

// Is lets errors.Is(err, ErrLocked) match.
func (e *LockedError) Is(target error) bool { return target == ErrLocked }

type lockFile struct {
	path string
	f    *os.File
}

// acquire creates the lock file with O_EXCL and takes flock on it. An existing
// lock whose holder is a dead process on this host, and whose flock is free,
// is stale and taken over once.
func acquire(path, holder string) (*lockFile, error) {
	host, _ := os.Hostname()
	info := LockInfo{Holder: holder, PID: os.Getpid(), Host: host, Since: time.Now().UTC().Truncate(time.Second)}
	for attempt := 0; ; attempt++ {
		f, err := os.OpenFile(path, os.O_RDWR|os.O_CREATE|os.O_EXCL, 0o644)
		if err == nil {
			if err := flock(f); err != nil {
				f.Close()
				os.Remove(path)
				return nil, &LockedError{Path: path}
			}
			b, _ := json.Marshal(info)
			if _, err := f.Write(append(b, '\n')); err != nil {
				f.Close()
				os.Remove(path)
				return nil, fmt.Errorf("journal: write lock %s: %w", path, err)
			}
			f.Sync()
			return &lockFile{path: path, f: f}, nil
		}
		if !errors.Is(err, os.ErrExist) {
			return nil, fmt.Errorf("journal: lock %s: %w", path, err)
		}
		old, stale := inspect(path, host)
		if !stale || attempt > 0 {
			return nil, &LockedError{Path: path, Info: old}
		}
		if err := os.Remove(path); err != nil && !errors.Is(err, os.ErrNotExist) {
			return nil, fmt.Errorf("journal: remove stale lock %s: %w", path, err)
		}
	}
}

// inspect reads a lock file and says whether it is stale: written on this
// host by a process that no longer runs, with nobody holding its flock.
func inspect(path, host string) (LockInfo, bool) {
	var info LockInfo
	data, err := os.ReadFile(path)
	if err != nil || json.Unmarshal(data, &info) != nil {
		return info, false
	}
	if info.Host != host || info.PID <= 0 || processAlive(info.PID) {
		return info, false
	}
	f, err := os.Open(path)
	if err != nil {
		return info, false
	}
	defer f.Close()
	if flock(f) != nil {
		return info, false
	}
	funlock(f)
	return info, true
}

func (l *lockFile) release() {
	if l == nil || l.f == nil {
		return
	}
	os.Remove(l.path)
	funlock(l.f)
	l.f.Close()
	l.f = nil
}
