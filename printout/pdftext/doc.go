// Package pdftext reads back the text of the PDFs that printout renders, so
// tests (of printout and of the sheet command) can compare a PDF with its
// page model without a PDF library.
//
// Model. Pages reads every stream, inflates the FlateDecode ones, decodes the
// ToUnicode CMap the fonts carry and maps the two-byte codes of every Tj
// string through it, giving the text runs of each page in drawing order.
//
// What it does not do. It knows only what printout's renderer (fpdf)
// writes: Identity-H fonts, literal strings, one Tj per run. It is no general
// PDF reader, and it does not place text or read images.
package pdftext
