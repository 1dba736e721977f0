package journal

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"
)

// sideName is a free name next to the record for bytes kept aside:
// "stator.toml.progress.cut-1", "-2", ...
func sideName(path, what string) (string, error) {
	for i := 1; i < 1000; i++ {
		name := fmt.Sprintf("%s.%s-%d", path, what, i)
		if _, err := os.Lstat(name); errors.Is(err, os.ErrNotExist) {
			return name, nil
		}
	}
	return "", fmt.Errorf("no free name for a side file next to %s: clear out its %s-N files", path, what)
}

// keepAside copies bytes into a new side file next to the record, synced,
// and returns its name.
func keepAside(path, what string, data []byte) (string, error) {
	name, err := sideName(path, what)
	if err != nil {
		return "", err
	}
	f, err := os.OpenFile(name, os.O_WRONLY|os.O_CREATE|os.O_EXCL, 0o644)
	if err != nil {
		return "", err
	}
	if _, err := f.Write(data); err != nil {
		f.Close()
		os.Remove(name)
		return "", err
	}
	if err := f.Sync(); err != nil {
		f.Close()
		os.Remove(name)
		return "", err
	}
	if err := f.Close(); err != nil {
		return "", err
	}
	return name, syncDir(filepath.Dir(name))
}

// WriteFileAtomic writes data to path so that the file at path is at every
// moment either the old one, whole, or the new one, whole: it writes a
// temporary file in the same folder, syncs it, renames it over path and
// syncs the folder. On any failure (a full disk) the old file is untouched
// and the temporary file removed.
func WriteFileAtomic(path string, data []byte, perm os.FileMode) error {
	return writeFileAtomic(path, data, perm, os.CreateTemp)
}

// tempFile is what writeFileAtomic needs of its temporary file.
type tempFile interface {
	Write([]byte) (int, error)
	Sync() error
	Close() error
	Name() string
	Chmod(os.FileMode) error
}

// writeFileAtomic is WriteFileAtomic with the temporary file's maker given,
// so tests can simulate a full disk.
func writeFileAtomic[F tempFile](path string, data []byte, perm os.FileMode, create func(dir, pattern string) (F, error)) error {
	dir, base := filepath.Split(path)
	if dir == "" {
		dir = "."
	}
	f, err := create(dir, "."+base+".tmp-*")
	if err != nil {
		return err
	}
	tmp := f.Name()
	fail := func(err error) error {
		f.Close()
		os.Remove(tmp)
		return err
	}
	if _, err := f.Write(data); err != nil {
		return fail(err)
	}
	if err := f.Chmod(perm); err != nil {
		return fail(err)
	}
	if err := f.Sync(); err != nil {
		return fail(err)
	}
	if err := f.Close(); err != nil {
		os.Remove(tmp)
		return err
	}
	if err := os.Rename(tmp, path); err != nil {
		os.Remove(tmp)
		return err
	}
	return syncDir(dir)
}
