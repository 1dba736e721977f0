package winding

import (
	"io/fs"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
)

// No Go file may cite a document that is not in the repository: the sources
// behind the models are written in the README and the package docs.
func TestNoCitationOutsideRepository(t *testing.T) {
	root := filepath.Join("..")
	doc := regexp.MustCompile(`\b[A-Za-z][A-Za-z0-9_-]*\.md\b`)
	err := filepath.WalkDir(root, func(path string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		if d.IsDir() && (strings.HasPrefix(d.Name(), ".") && path != root || d.Name() == "testdata") {
			return filepath.SkipDir
		}
		if d.IsDir() || !strings.HasSuffix(path, ".go") {
			return nil
		}
		src, err := os.ReadFile(path)
		if err != nil {
			return err
		}
		for _, name := range doc.FindAllString(string(src), -1) {
			if _, err := os.Stat(filepath.Join(root, name)); err != nil {
				t.Errorf("%s cites %s, which is not in the repository", path, name)
			}
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
}
