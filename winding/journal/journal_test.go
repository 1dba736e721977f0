package journal_test

import (
	"bytes"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"coilwright/winding/journal"
)

const seedDir = "../../testdata/journal"

func readSeed(t testing.TB, name string) []byte {
	t.Helper()
	b, err := os.ReadFile(filepath.Join(seedDir, name))
	if err != nil {
		t.Fatal(err)
	}
	return b
}

func TestDecodeSeeds(t *testing.T) {
	cases := []struct {
		file     string
		events   int
		torn     bool
		errLine  int // 0: no error
		lastStep int
	}{
		{"bench-session.jsonl", 7, false, 0, 40},
		{"torn-tail.jsonl", 2, true, 0, 2},
		{"garbled-last.jsonl", 1, false, 2, 1}, // ends in a newline: damaged, not torn
		{"garbled-middle.jsonl", 1, false, 2, 1},
		{"empty.jsonl", 0, false, 0, 0},
		{"no-final-newline.jsonl", 1, false, 0, 1},
	}
	for _, c := range cases {
		t.Run(c.file, func(t *testing.T) {
			ev, torn, err := journal.Decode(readSeed(t, c.file))
			var de *journal.DecodeError
			if c.errLine > 0 {
				if !errors.As(err, &de) || de.Line != c.errLine {
					t.Fatalf("Decode(%s) err = %v; want a DecodeError on line %d", c.file, err, c.errLine)
				}
				return
			}
			if err != nil {
				t.Fatalf("Decode(%s) err = %v; want nil", c.file, err)
			}
			if len(ev) != c.events || (torn != nil) != c.torn {
				t.Errorf("Decode(%s) = %d events, torn %v; want %d, torn %v", c.file, len(ev), torn, c.events, c.torn)
			}
			if len(ev) > 0 && ev[len(ev)-1].Step != c.lastStep {
				t.Errorf("Decode(%s) last step = %d; want %d", c.file, ev[len(ev)-1].Step, c.lastStep)
			}
		})
	}
}

// record returns a record of n events and the byte offset where each line ends.
func record(t testing.TB, n int) ([]byte, []int) {
	var b bytes.Buffer
	var ends []int
	t0 := time.Date(2025, 3, 8, 9, 0, 0, 0, time.UTC)
	for i := 1; i <= n; i++ {
		e := journal.Event{Seq: i, Time: t0.Add(time.Duration(i) * time.Minute), Kind: journal.Done, Step: i, Tooth: i, Turns: 20 + i, Note: "ok ünïcode"}
		if i%3 == 0 {
			e = journal.Event{Seq: i, Time: t0, Kind: journal.Reading, Test: "resistance", Readings: map[string]float64{"uv": 1.25, "temp_c": 21}, Verdict: "warn"}
		}
		line, err := journal.Line(e)
		if err != nil {
			t.Fatal(err)
		}
		b.Write(line)
		ends = append(ends, b.Len())
	}
	return b.Bytes(), ends
}

// wantCount is the number of events that survive a cut at off: whole lines,
// and a last line that lacks only its newline.
func wantCount(ends []int, off int) int {
	n := 0
	for _, e := range ends {
		if e <= off || e-1 == off {
			n++
		}
	}
	return n
}

func TestDecodeTruncatedEveryOffset(t *testing.T) {
	data, ends := record(t, 6)
	for off := 0; off <= len(data); off++ {
		ev, torn, err := journal.Decode(data[:off])
		if err != nil {
			t.Fatalf("Decode(first %d bytes) err = %v; want nil", off, err)
		}
		if want := wantCount(ends, off); len(ev) != want {
			t.Fatalf("Decode(first %d bytes) = %d events; want %d", off, len(ev), want)
		}
		atBoundary := off == 0
		for _, e := range ends {
			atBoundary = atBoundary || e == off || e-1 == off
		}
		if atBoundary != (torn == nil) {
			t.Fatalf("Decode(first %d bytes) torn = %v; want torn only off a line boundary", off, torn)
		}
	}
}

func TestStoreTruncatedEveryOffset(t *testing.T) {
	data, ends := record(t, 4)
	for off := 0; off <= len(data); off++ {
		path := filepath.Join(tempDir(t), "job.toml.progress") // a fresh folder: torn tails leave side files
		if err := os.WriteFile(path, data[:off], 0o644); err != nil {
			t.Fatal(err)
		}
		s, ev, _, err := journal.Open(path, "test")
		if err != nil {
			t.Fatalf("Open(cut at %d) err = %v", off, err)
		}
		want := wantCount(ends, off)
		if len(ev) != want {
			t.Fatalf("Open(cut at %d) = %d events; want %d", off, len(ev), want)
		}
		if err := s.Append(journal.Event{Kind: journal.Note, Note: "after the cut"}); err != nil {
			t.Fatalf("Append after cut at %d: %v", off, err)
		}
		if err := s.Close(); err != nil {
			t.Fatal(err)
		}
		back, _ := os.ReadFile(path)
		ev2, torn, err := journal.Decode(back)
		if err != nil || torn != nil || len(ev2) != want+1 || ev2[want].Note != "after the cut" {
			t.Fatalf("reload after cut at %d = %d events, torn %v, err %v; want %d clean events", off, len(ev2), torn, err, want+1)
		}
		if ev2[want].Seq != want+1 && want > 0 && ev2[want].Seq <= ev2[want-1].Seq {
			t.Fatalf("seq after cut at %d = %d; want above %d", off, ev2[want].Seq, ev2[want-1].Seq)
		}
	}
}

func TestStoreLockRefusedNamesHolder(t *testing.T) {
	path := filepath.Join(tempDir(t), "stator.toml.progress")
	a, _, _, err := journal.Open(path, "bench guide")
	if err != nil {
		t.Fatal(err)
	}
	_, _, _, err = journal.Open(path, "check")
	var le *journal.LockedError
	if !errors.As(err, &le) || !errors.Is(err, journal.ErrLocked) {
		t.Fatalf("second Open err = %v; want a LockedError", err)
	}
	if !strings.Contains(err.Error(), `"bench guide"`) || le.Info.PID != os.Getpid() {
		t.Errorf("second Open err = %q; want the holder \"bench guide\" and pid %d named", err, os.Getpid())
	}
	if err := a.Close(); err != nil {
		t.Fatal(err)
	}
	b, _, _, err := journal.Open(path, "check")
	if err != nil {
		t.Fatalf("Open after Close err = %v; want the lock free", err)
	}
	b.Close()
}

func TestStoreStaleLockTakenOver(t *testing.T) {
	host, _ := os.Hostname()
	cases := []struct{ name, lock string }{
		// A pid far above any pid_max: no such process runs.
		{"dead pid", `{"holder":"bench","pid":2147483000,"host":"` + host + `","since":"2025-03-08T09:00:00Z"}`},
		// A live process that is not a guide (after a reboot the pid is
		// someone else's): nobody holds the kernel lock, so it is stale.
		{"live unrelated pid", fmt.Sprintf(`{"holder":"bench","pid":%d,"host":"%s","since":"2025-03-08T09:00:00Z"}`, os.Getpid(), host)},
		{"another host", `{"holder":"bench","pid":1,"host":"` + host + `-elsewhere","since":"2025-03-08T09:00:00Z"}`},
		{"garbage", "not json"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			path := filepath.Join(tempDir(t), "stator.toml.progress")
			if err := os.WriteFile(journal.LockPathFor(path), []byte(c.lock), 0o644); err != nil {
				t.Fatal(err)
			}
			s, _, _, err := journal.Open(path, "check")
			if err != nil {
				t.Fatalf("Open with a lock nobody holds (%s) err = %v; want it taken", c.name, err)
			}
			if _, _, _, err := journal.Open(path, "bench"); !errors.Is(err, journal.ErrLocked) {
				t.Errorf("second Open err = %v; want ErrLocked while the first holds it", err)
			}
			s.Close()
			if _, err := os.Stat(journal.LockPathFor(path)); !errors.Is(err, os.ErrNotExist) {
				t.Errorf("lock file left after Close")
			}
		})
	}
}

func TestStoreReadOnlyDirectory(t *testing.T) {
	if os.Geteuid() == 0 {
		t.Skip("root ignores directory permissions; the failing-disk case is covered by TestStoreWriteFailureKeepsPending")
	}
	dir := tempDir(t)
	path := filepath.Join(dir, "job.toml.progress")
	s, _, _, err := journal.Open(path, "test")
	if err != nil {
		t.Fatal(err)
	}
	defer s.Close()
	if err := os.Chmod(dir, 0o500); err != nil {
		t.Fatal(err)
	}
	defer os.Chmod(dir, 0o700)
	err = s.Append(journal.Event{Kind: journal.Done, Step: 1})
	var we *journal.WriteError
	if !errors.As(err, &we) || we.Pending != 1 || len(s.Pending()) != 1 {
		t.Fatalf("Append in a read-only folder err = %v, pending %d; want a WriteError with 1 pending", err, len(s.Pending()))
	}
	os.Chmod(dir, 0o700)
	if err := s.Retry(); err != nil || len(s.Pending()) != 0 {
		t.Fatalf("Retry after chmod back err = %v, pending %d; want saved", err, len(s.Pending()))
	}
}

func TestFreshRecordCreatedOnFirstAppend(t *testing.T) {
	path := filepath.Join(tempDir(t), "job.toml.progress")
	s, ev, torn, err := journal.Open(path, "test")
	if err != nil || len(ev) != 0 || torn != nil {
		t.Fatalf("Open(new) = %d events, %v, %v", len(ev), torn, err)
	}
	if _, err := os.Stat(path); !errors.Is(err, os.ErrNotExist) {
		t.Errorf("record created before the first event")
	}
	if err := s.Append(journal.Event{Kind: journal.Done, Step: 1}); err != nil {
		t.Fatal(err)
	}
	if err := s.Append(journal.Event{Kind: journal.Turns, Step: -1}); err == nil {
		t.Errorf("Append(step -1) = nil; want an EventError")
	}
	s.Close()
	if _, err := os.Stat(journal.LockPathFor(path)); !errors.Is(err, os.ErrNotExist) {
		t.Errorf("lock file left after Close")
	}
	got, _ := os.ReadFile(path)
	ev, _, _ = journal.Decode(got)
	if len(ev) != 1 || ev[0].Seq != 1 || ev[0].Time.IsZero() {
		t.Errorf("record = %+v; want one event with seq 1 and a time", ev)
	}
}

func TestNoFinalNewlineRepaired(t *testing.T) {
	path := filepath.Join(tempDir(t), "job.toml.progress")
	os.WriteFile(path, readSeed(t, "no-final-newline.jsonl"), 0o644)
	s, ev, _, err := journal.Open(path, "test")
	if err != nil || len(ev) != 1 {
		t.Fatalf("Open = %d events, %v", len(ev), err)
	}
	s.Append(journal.Event{Kind: journal.Done, Step: 2})
	s.Close()
	got, _ := os.ReadFile(path)
	ev, torn, err := journal.Decode(got)
	if err != nil || torn != nil || len(ev) != 2 || ev[1].Seq != 2 {
		t.Errorf("reload = %+v, %v, %v; want 2 events", ev, torn, err)
	}
}

func FuzzDecode(f *testing.F) {
	entries, err := os.ReadDir(seedDir)
	if err != nil {
		f.Fatal(err)
	}
	for _, e := range entries {
		f.Add(readSeed(f, e.Name()))
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		ev, torn, err := journal.Decode(data)
		if err != nil {
			return
		}
		for _, e := range ev {
			if e.Line < 1 || e.Turns > journal.MaxTurns {
				t.Fatalf("event %+v: line %d, turns %d out of bounds", e, e.Line, e.Turns)
			}
		}
		if torn != nil && (torn.Offset < 0 || torn.Offset+int64(torn.Bytes) != int64(len(data))) {
			t.Fatalf("torn tail %v does not end the %d-byte record", torn, len(data))
		}
		// What decodes must encode and decode again to the same events.
		var b bytes.Buffer
		for _, e := range ev {
			line, err := journal.Line(e)
			if err != nil {
				t.Fatalf("Line(%+v) err = %v after it decoded", e, err)
			}
			b.Write(line)
		}
		again, torn2, err := journal.Decode(b.Bytes())
		if err != nil || torn2 != nil || len(again) != len(ev) {
			t.Fatalf("re-decode = %d events, %v, %v; want %d", len(again), torn2, err, len(ev))
		}
	})
}
