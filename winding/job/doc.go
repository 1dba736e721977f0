// Package job reads the job file: the stator a person describes once (the
// winding, the stator geometry, the wire, the turns or the voltage to solve
// them for, the flux source, the rating and the build allowances), written in
// TOML.
//
// Model. A Job is plain data as written in the file, with defaults filled and
// every field checked on its own and against its neighbours (either the slot
// area or its shape; either a bare diameter or an AWG size; either the turns or
// a target with a flux source). Physics that needs the layout (do the turns fit
// the slot, what EMF they give) is checked by package plan, which reports its
// refusals with this package's FieldError so they too carry the line and column
// of the field in the file.
//
// Units are those of the key names: mm, mm², V, A, rpm, Wb, T, °C. Keys are
// lowercase with underscores. Unknown keys are refused by name (strict
// decoding), since a mistyped key would otherwise silently take its default.
//
// The package reads bytes it is given (Parse) or one file (Load); it writes
// nothing. The embedded demo job and the commented blank template are here so
// every command can use them without a file.
package job
