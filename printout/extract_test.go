package printout

import "coilwright/printout/pdftext"

// pdfPageTexts reads the text runs of each page of a rendered pack.
func pdfPageTexts(pdf []byte) ([][]string, error) { return pdftext.Pages(pdf) }
