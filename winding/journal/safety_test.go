package journal_test

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"sync/atomic"
	"testing"

	"coilwright/winding/journal"
)

func openT(t *testing.T, path string) *journal.Store {
	t.Helper()
	s, _, _, err := journal.Open(path, "test")
	if err != nil {
		t.Fatal(err)
	}
	t.Cleanup(func() { s.Close() })
	return s
}

func decodeFile(t *testing.T, path string) []journal.Event {
	t.Helper()
	data, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	ev, torn, err := journal.Decode(data)
	if err != nil || torn != nil {
		t.Fatalf("Decode(%s) torn %v, err %v", path, torn, err)
	}
	return ev
}

// A record removed, replaced by rename (as editors and sync tools do) or cut
// short under an open store is written again from memory, with a notice; the
// file that stood at the path is kept aside.
func TestStoreNoticesRecordChangedUnderIt(t *testing.T) {
	cases := []struct {
		name   string
		change func(t *testing.T, path string)
		kept   bool // a foreign file is kept aside
		how    string
	}{
		{"removed", func(t *testing.T, path string) { os.Remove(path) }, false, "removed"},
		{"moved away", func(t *testing.T, path string) { os.Rename(path, path+".bak") }, false, "removed or moved"},
		{"replaced by rename", func(t *testing.T, path string) {
			tmp := path + ".new"
			os.WriteFile(tmp, []byte(`{"seq":1,"time":"2025-03-08T09:00:00Z","kind":"done","step":1}`+"\n"), 0o644)
			os.Rename(tmp, path)
		}, true, "replaced"},
		{"cut short in place", func(t *testing.T, path string) { os.Truncate(path, 10) }, true, "cut to 10 bytes"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			path := filepath.Join(tempDir(t), "job.toml.progress")
			s := openT(t, path)
			for i := 1; i <= 3; i++ {
				if err := s.Append(journal.Event{Kind: journal.Turns, Step: 2, Tooth: 1, Turns: i}); err != nil {
					t.Fatal(err)
				}
			}
			c.change(t, path)
			if err := s.Append(journal.Event{Kind: journal.Turns, Step: 2, Tooth: 1, Turns: 4}); err != nil {
				t.Fatalf("Append after the record was %s err = %v; want it written again", c.name, err)
			}
			n := s.Notices()
			if len(n) != 1 || !strings.Contains(n[0], c.how) || !strings.Contains(n[0], "written again") {
				t.Fatalf("Notices() = %q; want one saying the record %s and was written again", n, c.how)
			}
			if got := decodeFile(t, path); len(got) != 4 || got[3].Turns != 4 {
				t.Fatalf("record after %s = %d events; want all 4 turns entries", c.name, len(got))
			}
			side, _ := filepath.Glob(path + ".replaced-*")
			if c.kept != (len(side) == 1) {
				t.Errorf("side files %v; want one: %v", side, c.kept)
			}
			if c.kept && !strings.Contains(n[0], side[0]) {
				t.Errorf("notice %q does not name the side file %s", n[0], side[0])
			}
			// Later writes go to the new file, without another notice.
			if err := s.Append(journal.Event{Kind: journal.Done, Step: 2, Tooth: 1, Turns: 4}); err != nil {
				t.Fatal(err)
			}
			if n := s.Notices(); len(n) != 0 {
				t.Errorf("Notices() after a normal write = %q; want none", n)
			}
			if got := decodeFile(t, path); len(got) != 5 {
				t.Errorf("record = %d events; want 5", len(got))
			}
		})
	}
}

// Lines appended by another program are cut from the record before the next
// write, but only after they were copied to a side file.
func TestStoreKeepsForeignBytesAside(t *testing.T) {
	path := filepath.Join(tempDir(t), "job.toml.progress")
	s := openT(t, path)
	s.Append(journal.Event{Kind: journal.Done, Step: 1})
	f, _ := os.OpenFile(path, os.O_APPEND|os.O_WRONLY, 0)
	f.WriteString("hand-typed line\n")
	f.Close()
	if err := s.Append(journal.Event{Kind: journal.Done, Step: 2}); err != nil {
		t.Fatal(err)
	}
	n := s.Notices()
	side, _ := filepath.Glob(path + ".cut-*")
	if len(side) != 1 || len(n) != 1 || !strings.Contains(n[0], side[0]) {
		t.Fatalf("side files %v, notices %q; want one side file, named", side, n)
	}
	if b, _ := os.ReadFile(side[0]); string(b) != "hand-typed line\n" {
		t.Errorf("side file holds %q; want the foreign line", b)
	}
	if got := decodeFile(t, path); len(got) != 2 {
		t.Errorf("record = %d events; want 2", len(got))
	}
}

// A torn last line (no newline) is copied to a side file named in the
// report before it is cut; a damaged last line that ends in a newline is
// refused with its line number and the record left as it is.
func TestStoreTornTailKeptAside(t *testing.T) {
	dir := tempDir(t)
	path := filepath.Join(dir, "job.toml.progress")
	good := `{"seq":1,"time":"2025-03-08T09:00:00Z","kind":"done","step":1}` + "\n"
	if err := os.WriteFile(path, []byte(good+`{"seq":2,"kind":"tu`), 0o644); err != nil {
		t.Fatal(err)
	}
	s, ev, torn, err := journal.Open(path, "test")
	if err != nil || len(ev) != 1 || torn == nil || torn.Line != 2 {
		t.Fatalf("Open(torn) = %d events, torn %v, err %v; want 1 and line 2 torn", len(ev), torn, err)
	}
	if side, _ := filepath.Glob(path + ".cut-*"); len(side) != 0 {
		t.Errorf("side files %v before any write; want none (nothing is cut yet)", side)
	}
	if err := s.Append(journal.Event{Kind: journal.Done, Step: 2}); err != nil {
		t.Fatalf("first Append after a torn tail: %v", err)
	}
	side, _ := filepath.Glob(path + ".cut-*")
	n := s.Notices()
	if len(side) != 1 || len(n) != 1 || !strings.Contains(n[0], side[0]) {
		t.Fatalf("after the first write: side files %v, notices %q; want one, named", side, n)
	}
	if b, _ := os.ReadFile(side[0]); string(b) != `{"seq":2,"kind":"tu` {
		t.Errorf("side file %s holds %q; want the torn bytes", side[0], b)
	}
	if err := s.Close(); err != nil {
		t.Fatal(err)
	}
	if got := decodeFile(t, path); len(got) != 2 {
		t.Errorf("record = %d events; want 2", len(got))
	}

	flipped := good + `{"seq":2,"time":"2025-03-08T09:00:00Z","kind":"done","step":2}` + "\n"
	flipped = flipped[:len(flipped)-10] + "\x01" + flipped[len(flipped)-9:]
	if err := os.WriteFile(path, []byte(flipped), 0o644); err != nil {
		t.Fatal(err)
	}
	_, _, _, err = journal.Open(path, "test")
	var de *journal.DecodeError
	if !errors.As(err, &de) || de.Line != 2 {
		t.Fatalf("Open(flipped byte in the last line) err = %v; want a DecodeError on line 2", err)
	}
	if b, _ := os.ReadFile(path); string(b) != flipped {
		t.Errorf("the damaged record was changed")
	}
}

// Values beyond any coil or meter are refused with their line number.
func TestDecodeBoundsValues(t *testing.T) {
	cases := []struct{ name, line, why string }{
		{"absurd turns", `{"seq":2,"kind":"done","step":2,"tooth":1,"turns":9e18}`, ""},
		{"turns past the bound", `{"seq":2,"kind":"turns","step":2,"tooth":1,"turns":100000}`, "more than any coil holds"},
		{"negative turns", `{"seq":2,"kind":"turns","step":2,"tooth":1,"turns":-5}`, "below 0"},
		{"huge step", `{"seq":2,"kind":"done","step":2000000}`, ""},
		{"huge seq", `{"seq":9000000000000000000,"kind":"done","step":2}`, ""},
		{"huge reading", `{"seq":2,"kind":"reading","test":"resistance","readings":{"uv":1e300}}`, ""},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			data := `{"seq":1,"kind":"done","step":1}` + "\n" + c.line + "\n" + `{"seq":3,"kind":"done","step":3}` + "\n"
			_, _, err := journal.Decode([]byte(data))
			var de *journal.DecodeError
			if !errors.As(err, &de) || de.Line != 2 {
				t.Errorf("Decode(%s) err = %v; want a DecodeError on line 2", c.name, err)
			}
			if err != nil && !strings.Contains(err.Error(), c.why) {
				t.Errorf("Decode(%s) err = %v; want it to say %q", c.name, err, c.why)
			}
		})
	}
}

// Control characters never get into a record nor out of one.
func TestNotesCleanedInAndOut(t *testing.T) {
	path := filepath.Join(tempDir(t), "job.toml.progress")
	s := openT(t, path)
	evil := "sleeved\x1b]0;owned\x07\x1b[2J at slot\u009b12"
	if err := s.Append(journal.Event{Kind: journal.Note, Step: 2, Note: evil}); err != nil {
		t.Fatal(err)
	}
	s.Close()
	raw, _ := os.ReadFile(path)
	if strings.ContainsAny(string(raw), "\x1b\x07\u009b") || strings.Contains(string(raw), `\u001b`) {
		t.Errorf("record holds a control character: %q", raw)
	}
	// A record edited by hand to hold one gives it back cleaned.
	ev, _, err := journal.Decode([]byte(`{"seq":1,"kind":"note","step":2,"note":"a\u001b[31mred\u0007"}` + "\n"))
	if err != nil || len(ev) != 1 || ev[0].Note != "a[31mred" {
		t.Errorf("Decode(note with escapes) = %+v, %v; want the note cleaned", ev, err)
	}
}

// Two paths to one record (a symbolic link) share its lock.
func TestStoreLockFollowsSymlink(t *testing.T) {
	dir := tempDir(t)
	path := filepath.Join(dir, "job.toml.progress")
	os.WriteFile(path, nil, 0o644)
	link := filepath.Join(dir, "elsewhere.progress")
	if err := os.Symlink(path, link); err != nil {
		t.Skip("no symbolic links here:", err)
	}
	a := openT(t, path)
	if _, _, _, err := journal.Open(link, "bench"); !errors.Is(err, journal.ErrLocked) {
		t.Fatalf("Open through a symbolic link while held err = %v; want ErrLocked", err)
	}
	a.Close()
	b, _, _, err := journal.Open(link, "bench")
	if err != nil {
		t.Fatalf("Open through the link after Close err = %v", err)
	}
	b.Close()
}

// Starters racing for a stale lock: never more than one holder at a time,
// and a closing holder never deletes the lock of the next.
func TestStoreLockNoTakeOverRace(t *testing.T) {
	path := filepath.Join(tempDir(t), "job.toml.progress")
	var holders, most atomic.Int32
	for round := 0; round < 100; round++ {
		os.WriteFile(journal.LockPathFor(path), []byte(`{"holder":"bench","pid":2147483000,"host":"x"}`), 0o644)
		var wg sync.WaitGroup
		for g := 0; g < 4; g++ {
			wg.Add(1)
			go func() {
				defer wg.Done()
				s, _, _, err := journal.Open(path, "racer")
				if err != nil {
					return
				}
				n := holders.Add(1)
				for m := most.Load(); n > m && !most.CompareAndSwap(m, n); m = most.Load() {
				}
				holders.Add(-1)
				s.Close()
			}()
		}
		wg.Wait()
	}
	if most.Load() > 1 {
		t.Fatalf("%d holders of one record at once; want at most 1", most.Load())
	}
}

// Taking a lock nobody held says whose it was.
func TestStaleLockTakenIsSaid(t *testing.T) {
	path := filepath.Join(tempDir(t), "job.toml.progress")
	os.WriteFile(journal.LockPathFor(path), []byte(`{"holder":"bench","pid":1,"host":"bench-pc","since":"2025-03-08T09:00:00Z"}`), 0o644)
	s := openT(t, path)
	n := s.Notices()
	if len(n) != 1 || !strings.Contains(n[0], `"bench" (pid 1 on bench-pc`) || !strings.Contains(n[0], "taken") {
		t.Errorf("Notices() after taking a stale lock = %q; want its holder named", n)
	}
}

// A record removed and written anew before the store's first write is
// noticed, though the new file may well get the removed one's number (file
// systems reuse it at once): the store holds the record open from Open on.
func TestStoreNoticesRecordRecreatedBeforeFirstWrite(t *testing.T) {
	for round := 0; round < 20; round++ {
		path := filepath.Join(tempDir(t), "job.toml.progress")
		ours := `{"seq":1,"time":"2025-03-08T09:00:00Z","kind":"done","step":1}` + "\n"
		if err := os.WriteFile(path, []byte(ours), 0o644); err != nil {
			t.Fatal(err)
		}
		s := openT(t, path)
		if err := os.Remove(path); err != nil {
			t.Fatal(err)
		}
		// Another program's file, longer than ours, at the same path.
		theirs := `{"seq":1,"time":"2025-03-08T09:00:00Z","kind":"note","note":"someone else's record, longer than ours"}` + "\n"
		if err := os.WriteFile(path, []byte(theirs), 0o644); err != nil {
			t.Fatal(err)
		}
		if err := s.Append(journal.Event{Kind: journal.Done, Step: 2}); err != nil {
			t.Fatal(err)
		}
		n := s.Notices()
		if len(n) != 1 || !strings.Contains(n[0], "replaced") {
			t.Fatalf("round %d: Notices() = %q; want the replaced record noticed", round, n)
		}
		got := decodeFile(t, path)
		if len(got) != 2 || got[0].Step != 1 || got[1].Step != 2 {
			t.Fatalf("round %d: record = %+v; want our two entries", round, got)
		}
		side, _ := filepath.Glob(path + ".replaced-*")
		if len(side) != 1 {
			t.Fatalf("round %d: side files %v; want the other file kept", round, side)
		}
		if b, _ := os.ReadFile(side[0]); string(b) != theirs {
			t.Errorf("round %d: side file holds %q; want the other program's file", round, b)
		}
	}
}

// The guide may close the store while its last write still runs: the calls
// take turns, and every event is written once.
func TestStoreConcurrentAppendAndClose(t *testing.T) {
	path := filepath.Join(tempDir(t), "job.toml.progress")
	s, _, _, err := journal.Open(path, "test")
	if err != nil {
		t.Fatal(err)
	}
	var wg sync.WaitGroup
	for g := 0; g < 4; g++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := 0; i < 25; i++ {
				if err := s.Append(journal.Event{Kind: journal.Turns, Step: 2, Tooth: 1, Turns: i}); err != nil {
					t.Error(err)
					return
				}
				s.Notices()
				s.Pending()
			}
		}()
	}
	wg.Wait()
	if err := s.Close(); err != nil {
		t.Fatal(err)
	}
	got := decodeFile(t, path)
	if len(got) != 100 {
		t.Fatalf("record = %d events; want 100", len(got))
	}
	for i, e := range got {
		if e.Seq != i+1 {
			t.Fatalf("event %d has seq %d; want %d (each written once, in order)", i, e.Seq, i+1)
		}
	}
}

// A damaged line, last or in the middle, refuses the record, leaves it as it
// is, and says how to go on: the line, and the two ways forward.
func TestOpenDamagedSaysHowToGoOn(t *testing.T) {
	line := func(seq, step int) string {
		return fmt.Sprintf(`{"seq":%d,"time":"2025-03-08T09:00:00Z","kind":"done","step":%d}`, seq, step) + "\n"
	}
	cases := []struct {
		name  string
		data  string
		line  int
		where string
	}{
		{"last line", line(1, 1) + line(2, 2) + "{\"seq\":3,\x01}\n", 3, "its last line, 3"},
		{"middle line", line(1, 1) + "{\"seq\":2,\"kind\":\"done\",\n" + line(3, 3) + line(4, 4), 2, "line 2 of 4"},
		{"absurd turns", line(1, 1) + `{"seq":2,"kind":"done","step":5,"tooth":1,"turns":9e18}` + "\n" + line(3, 3), 2, "line 2 of 3"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			path := filepath.Join(tempDir(t), "job.toml.progress")
			if err := os.WriteFile(path, []byte(c.data), 0o644); err != nil {
				t.Fatal(err)
			}
			_, _, _, err := journal.Open(path, "test")
			var de *journal.DamagedError
			var dec *journal.DecodeError
			if !errors.As(err, &de) || !errors.As(err, &dec) || de.Line != c.line {
				t.Fatalf("Open err = %v; want a DamagedError on line %d", err, c.line)
			}
			msg := err.Error()
			for _, want := range []string{c.where, path, "kept exactly as it is", fmt.Sprintf("delete line %d", c.line), path + ".damaged", "fresh, empty record"} {
				if !strings.Contains(msg, want) {
					t.Errorf("message %q\nlacks %q", msg, want)
				}
			}
			if b, _ := os.ReadFile(path); string(b) != c.data {
				t.Errorf("the damaged record was changed")
			}
			if _, err := os.Stat(journal.LockPathFor(path)); !errors.Is(err, os.ErrNotExist) {
				t.Errorf("a lock was left on the refused record")
			}
		})
	}
}

// tempDir is a test's temporary folder named as the store names its files,
// with symbolic links resolved (on some systems the temporary folder lies
// behind one, e.g. /var -> /private/var), so paths in notices compare equal.
func tempDir(t *testing.T) string {
	t.Helper()
	return journal.Resolve(t.TempDir())
}

// A record removed or replaced after the last write and before Close is
// written again by Close: quitting never loses what the store holds.
func TestStoreCloseWritesAgainARecordGone(t *testing.T) {
	cases := []struct {
		name   string
		change func(path string) error
	}{
		{"removed", os.Remove},
		{"replaced by rename", func(path string) error {
			if err := os.WriteFile(path+".new", []byte("someone else's\n"), 0o644); err != nil {
				return err
			}
			return os.Rename(path+".new", path)
		}},
		{"cut short", func(path string) error { return os.Truncate(path, 5) }},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			path := filepath.Join(tempDir(t), "job.toml.progress")
			s, _, _, err := journal.Open(path, "test")
			if err != nil {
				t.Fatal(err)
			}
			for i := 1; i <= 3; i++ {
				if err := s.Append(journal.Event{Kind: journal.Turns, Step: 5, Tooth: 1, Turns: i}); err != nil {
					t.Fatal(err)
				}
			}
			if err := c.change(path); err != nil {
				t.Fatal(err)
			}
			if err := s.Close(); err != nil {
				t.Fatalf("Close after the record was %s err = %v; want it written again", c.name, err)
			}
			if n := s.Notices(); len(n) != 1 || !strings.Contains(n[0], "written again") {
				t.Errorf("Notices() after Close = %q; want one saying it was written again", n)
			}
			if got := decodeFile(t, path); len(got) != 3 || got[2].Turns != 3 {
				t.Errorf("record after Close = %d events; want the 3 held in memory", len(got))
			}
			if _, err := os.Stat(journal.LockPathFor(path)); !errors.Is(err, os.ErrNotExist) {
				t.Errorf("lock left after Close")
			}
		})
	}
}

// Two names for one record by a hard link: the second store is refused,
// though each name has a lock file of its own.
func TestStoreLockFollowsHardLink(t *testing.T) {
	dir := tempDir(t)
	path := filepath.Join(dir, "job.toml.progress")
	if err := os.WriteFile(path, []byte(`{"seq":1,"time":"2025-03-08T09:00:00Z","kind":"done","step":1}`+"\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	link := filepath.Join(dir, "copy.progress")
	if err := os.Link(path, link); err != nil {
		t.Skip("no hard links here:", err)
	}
	a := openT(t, path)
	_, _, _, err := journal.Open(link, "bench")
	if !errors.Is(err, journal.ErrLocked) || !strings.Contains(err.Error(), "another name") {
		t.Fatalf("Open through a hard link while held err = %v; want ErrLocked naming another name", err)
	}
	if _, err := os.Stat(journal.LockPathFor(link)); !errors.Is(err, os.ErrNotExist) {
		t.Errorf("the refused Open left its lock file")
	}
	// Records written and rewritten by the holder stay held.
	if err := a.Append(journal.Event{Kind: journal.Done, Step: 2}); err != nil {
		t.Fatal(err)
	}
	if _, _, _, err := journal.Open(link, "bench"); !errors.Is(err, journal.ErrLocked) {
		t.Fatalf("Open through a hard link after a write err = %v; want ErrLocked", err)
	}
	a.Close()
	b, _, _, err := journal.Open(link, "bench")
	if err != nil {
		t.Fatalf("Open through the link after Close err = %v", err)
	}
	b.Close()
}
