package printout_test

import (
	"bytes"
	"fmt"

	"coilwright/printout"
	"coilwright/winding/job"
	"coilwright/winding/plan"
)

// Build lays out the pack as a page model; Render writes it as PDF.
func ExampleBuild() {
	p, err := plan.Build(job.Demo())
	if err != nil {
		fmt.Println(err)
		return
	}
	pack, err := printout.Build(p, printout.Options{Paper: printout.A4})
	if err != nil {
		fmt.Println(err)
		return
	}
	seen := map[string]bool{}
	for _, pg := range pack.Pages {
		if !seen[pg.Title] {
			seen[pg.Title] = true
			fmt.Println(pg.Title)
		}
	}
	var pdf bytes.Buffer
	if err := printout.Render(pack, &pdf); err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(bytes.HasPrefix(pdf.Bytes(), []byte("%PDF-")))
	// Output:
	// Slot map
	// Developed layout
	// Connections
	// Design figures
	// Machine figures
	// Cut list and materials
	// Winding checklist
	// Winding checklist (continued)
	// Polarity test: the pole of every tooth
	// Test record
	// Test record (continued)
	// true
}
