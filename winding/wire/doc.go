// Package wire holds the data of enamelled round copper winding wire: the
// resistivity, temperature coefficient and density of annealed copper
// (IEC 60028), the American Wire Gauge diameters (ASTM B258), the overall
// diameters and tolerances of enamel grades 1 and 2 (IEC 60317-0-1), and the
// few formulas that turn a length of wire into a resistance or a mass.
//
// Units: diameters in mm, areas in mm², lengths in m, resistances in ohm,
// temperatures in degrees Celsius, masses in kg.
//
// The package knows nothing of coils or slots; it does no I/O. It covers
// copper only: aluminium and other conductors are not supported.
package wire
