// Package pdftext reads back the text of the PDFs that printout renders, so
// tests (of printout and of the sheet command) can compare a PDF with its
// page model without a PDF library.
//
// Model. Pages reads every stream, inflates the FlateDecode ones, decodes the
// ToUnicode CMap the fonts carry and maps the two-byte codes of every Tj
// string through it, giving the text runs of each page in drawing order.
// Runs gives each run with the font size of its Tf and the start of its
// baseline (Td), so tests can check type sizes on the written file.
//
// What it does not do. It knows only what printout's renderer (fpdf)
// writes: Identity-H fonts, literal strings, one Tj per run. It is no general
// PDF reader: it follows no text matrix (Tm) and reads no images.
package pdftext
