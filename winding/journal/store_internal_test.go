package journal

import (
	"errors"
	"os"
	"path/filepath"
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
	path := filepath.Join(t.TempDir(), "job.toml.progress")
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
