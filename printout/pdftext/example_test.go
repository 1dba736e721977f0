package pdftext_test

import (
	"bytes"
	"fmt"

	"coilwright/printout"
	"coilwright/printout/pdftext"
	"coilwright/winding/job"
	"coilwright/winding/plan"
)

// Pages reads back the text runs of a rendered pack, page by page.
func ExamplePages() {
	p, _ := plan.Build(job.Demo())
	pack, _ := printout.Build(p, printout.Options{})
	var pdf bytes.Buffer
	if err := printout.Render(pack, &pdf); err != nil {
		fmt.Println(err)
		return
	}
	pages, err := pdftext.Pages(pdf.Bytes())
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(len(pages) == len(pack.Pages), pages[0][0])
	// Output: true Slot map
}

// Runs reads back each run with the size it is set in.
func ExampleRuns() {
	p, _ := plan.Build(job.Demo())
	pack, _ := printout.Build(p, printout.Options{})
	var pdf bytes.Buffer
	if err := printout.Render(pack, &pdf); err != nil {
		fmt.Println(err)
		return
	}
	pages, err := pdftext.Runs(pdf.Bytes())
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%s %.0f pt\n", pages[0][0].Text, pages[0][0].Size)
	// Output: Slot map 15 pt
}
