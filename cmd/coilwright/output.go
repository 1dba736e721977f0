package main

import (
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"os"

	"coilwright/winding/journal"
)

// writeJSON writes v as indented JSON with a final newline.
func writeJSON(w io.Writer, v any) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(v)
}

// protected is a file an output must never replace: what it is, and where.
type protected struct{ what, path string }

// writeOutput writes a command's output file so that an existing file is
// never left half-written (a temporary file in the same folder, synced, then
// renamed over it). An output that is one of the protected files (the job,
// its progress record or the record's lock), compared by the file it is and
// not by how its name is written, is refused as invalid input.
func writeOutput(flag, path string, data []byte, keep ...protected) error {
	if err := refuseProtected(flag, path, keep...); err != nil {
		return err
	}
	if err := journal.WriteFileAtomic(path, data, 0o644); err != nil {
		return fmt.Errorf("writing %s: %w (nothing at %s was changed)", path, err, path)
	}
	return nil
}

// refuseProtected is the check of writeOutput alone. Besides the files
// named, any existing file that reads as a progress record (of this job or
// another) is refused: it holds work that cannot be made again.
func refuseProtected(flag, path string, keep ...protected) error {
	at := journal.Resolve(path)
	out, outErr := os.Stat(path)
	if n := recordEntries(path, out); n > 0 {
		return badInputf("%s %s is a progress record (%d entries of recorded work): writing there would destroy it; give another file", flag, path, n)
	}
	for _, k := range keep {
		if k.path == "" {
			continue
		}
		same := journal.Resolve(k.path) == at
		if fi, err := os.Stat(k.path); !same && outErr == nil && err == nil {
			same = os.SameFile(fi, out)
		}
		if same {
			return badInputf("%s %s is %s (%s): writing there would destroy it; give another file, e.g. pack.pdf", flag, path, k.what, k.path)
		}
	}
	return nil
}

// recordEntries is the number of entries in the file at path when it reads
// as a progress record, else 0. Only a regular file of at most 64 MiB is read.
func recordEntries(path string, fi os.FileInfo) int {
	if fi == nil || !fi.Mode().IsRegular() || fi.Size() == 0 || fi.Size() > 64<<20 {
		return 0
	}
	data, err := os.ReadFile(path)
	if err != nil {
		return 0
	}
	events, _, err := journal.Decode(data)
	var de *journal.DecodeError
	if errors.As(err, &de) && len(events) == 0 {
		return 0 // not a record at all (a PDF, a job file)
	}
	return len(events)
}
