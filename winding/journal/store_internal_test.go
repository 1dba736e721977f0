package journal

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
)

// failingFile writes part of a line and then fails, as a full or read-only
// disk does.
type failingFile struct {
	*os.File
}

func (f failingFile) Write(p []byte) (int, error) {
	n, _ := f.File.Write(p[:len(p)/2])
	return n, syscall.EROFS
}

func TestStoreWriteFailureKeepsPending(t *testing.T) {
	path := filepath.Join(resolvedTempDir(t), "job.toml.progress")
	s, _, _, err := Open(path, "test")
	if err != nil {
		t.Fatal(err)
	}
	defer s.Close()
	if err := s.Append(Event{Kind: Done, Step: 1}); err != nil {
		t.Fatal(err)
	}
	s.drop()
	s.open = func(p string) (file, error) {
		f, err := openRecord(p)
		if err != nil {
			return nil, err
		}
		return failingFile{f.(*os.File)}, nil
	}
	err = s.Append(Event{Kind: Done, Step: 2})
	var we *WriteError
	if !errors.As(err, &we) || !errors.Is(err, syscall.EROFS) || we.Pending != 1 {
		t.Fatalf("Append on a failing disk err = %v; want a WriteError (EROFS, 1 pending)", err)
	}
	err = s.Append(Event{Kind: Done, Step: 3})
	if !errors.As(err, &we) || we.Pending != 2 {
		t.Fatalf("second Append err = %v; want 2 pending", err)
	}
	if p := s.Pending(); len(p) != 2 || p[0].Step != 2 || p[1].Step != 3 {
		t.Fatalf("Pending() = %+v; want steps 2, 3 in order", p)
	}
	s.open = openRecord // the disk is back
	if err := s.Retry(); err != nil {
		t.Fatalf("Retry err = %v", err)
	}
	data, _ := os.ReadFile(path)
	ev, torn, err := Decode(data)
	if err != nil || torn != nil || len(ev) != 3 {
		t.Fatalf("record after Retry = %d events, torn %v, err %v; want 3 clean (half-written line cut)", len(ev), torn, err)
	}
	for i, e := range ev {
		if e.Step != i+1 || e.Seq != i+1 {
			t.Errorf("event %d = step %d seq %d; want %d, %d", i, e.Step, e.Seq, i+1, i+1)
		}
	}
}

// syncCounter counts the fsyncs of the record.
type syncCounter struct {
	*os.File
	n *int
}

func (f syncCounter) Sync() error { *f.n++; return f.File.Sync() }

// A batch of events is written together and synced once.
func TestStoreOneSyncPerBatch(t *testing.T) {
	path := filepath.Join(resolvedTempDir(t), "job.toml.progress")
	s, _, _, err := Open(path, "test")
	if err != nil {
		t.Fatal(err)
	}
	defer s.Close()
	syncs := 0
	s.open = func(p string) (file, error) {
		f, err := openRecord(p)
		if err != nil {
			return nil, err
		}
		return syncCounter{f.(*os.File), &syncs}, nil
	}
	batch := make([]Event, 60)
	for i := range batch {
		batch[i] = Event{Kind: Turns, Step: 2, Tooth: 1, Turns: i + 1}
	}
	if err := s.Append(batch...); err != nil {
		t.Fatal(err)
	}
	if syncs != 1 {
		t.Errorf("Append(60 events) synced %d times; want 1", syncs)
	}
	if err := s.Append(Event{Kind: Done, Step: 2, Tooth: 1, Turns: 60}); err != nil || syncs != 2 {
		t.Errorf("Append(1 event) err %v, syncs %d; want 2 in all", err, syncs)
	}
}

// fullTemp is a temporary file on a full disk: it takes half of a write.
type fullTemp struct{ *os.File }

func (f fullTemp) Write(p []byte) (int, error) {
	n, _ := f.File.Write(p[:len(p)/2])
	return n, syscall.ENOSPC
}

// On a full disk the file at the path stays whole, and no temporary file is
// left behind.
func TestWriteFileAtomicFullDisk(t *testing.T) {
	dir := resolvedTempDir(t)
	path := filepath.Join(dir, "pack.pdf")
	os.WriteFile(path, []byte("the good old pack"), 0o644)
	err := writeFileAtomic(path, []byte("a new pack, much longer than the old one"), 0o644, func(d, p string) (fullTemp, error) {
		f, err := os.CreateTemp(d, p)
		return fullTemp{f}, err
	})
	if !errors.Is(err, syscall.ENOSPC) {
		t.Fatalf("writeFileAtomic on a full disk err = %v; want ENOSPC", err)
	}
	if b, _ := os.ReadFile(path); string(b) != "the good old pack" {
		t.Errorf("file after a failed write = %q; want the old one whole", b)
	}
	if left, _ := os.ReadDir(dir); len(left) != 1 {
		t.Errorf("folder holds %d files after the failure; want only the old one", len(left))
	}
	if err := WriteFileAtomic(path, []byte("new"), 0o600); err != nil {
		t.Fatal(err)
	}
	if b, _ := os.ReadFile(path); string(b) != "new" {
		t.Errorf("file after WriteFileAtomic = %q; want new", b)
	}
}

// A failed write names its cause first, so a status line cut to the
// terminal's width still shows it, and the record's path once.
func TestWriteErrorCauseFirst(t *testing.T) {
	path := filepath.Join(resolvedTempDir(t), "job.toml.progress")
	cases := []struct {
		err  error
		want string
	}{
		{&os.PathError{Op: "write", Path: path, Err: syscall.ENOSPC}, "no space left on device writing the progress record " + path + ";"},
		{&os.PathError{Op: "open", Path: path + ".tmp-1", Err: syscall.EROFS}, "read-only file system writing the progress record " + path + ";"},
		{syscall.EIO, "input/output error writing the progress record " + path + ";"},
	}
	for _, c := range cases {
		msg := (&WriteError{Path: path, Pending: 3, Err: c.err}).Error()
		if !strings.HasPrefix(msg, c.want) || strings.Count(msg, path) != 1 || !strings.Contains(msg, "3 event(s) kept in memory") {
			t.Errorf("WriteError(%v) = %q; want it to start %q and name the path once", c.err, msg, c.want)
		}
	}
}

// resolvedTempDir is t.TempDir with symbolic links resolved, as Store names
// its files.
func resolvedTempDir(t *testing.T) string {
	t.Helper()
	return Resolve(t.TempDir())
}
