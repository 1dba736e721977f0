package printout

import (
	"flag"
	"os"
	"path/filepath"
	"testing"

	"coilwright/winding"
)

var preview = flag.String("preview", "", "write preview PDFs of the fixture packs into this directory")

func TestPreview(t *testing.T) {
	if *preview == "" {
		t.Skip("no -preview directory")
	}
	for name, s := range map[string]winding.Spec{
		"12-10":     {Slots: 12, Poles: 10},
		"120-112":   {Slots: 120, Poles: 112, Paths: 2},
		"12-10-1L":  {Slots: 12, Poles: 10, Layers: 1},
		"20-18-5ph": {Slots: 20, Poles: 18, Phases: 5},
	} {
		pk, err := Build(fixturePlan(t, s, winding.Star), Options{})
		if err != nil {
			t.Fatal(err)
		}
		fh, err := os.Create(filepath.Join(*preview, name+".pdf"))
		if err != nil {
			t.Fatal(err)
		}
		if err := Render(pk, fh); err != nil {
			t.Fatal(err)
		}
		fh.Close()
	}
}
