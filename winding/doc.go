// Package winding lays out and analyses tooth-coil (fractional-slot concentrated)
// windings for a stator of Q slots and a rotor of 2p poles.
//
// Model. Every coil is wound round one tooth. Teeth are numbered 1..Q
// counter-clockwise seen from the connection (lead) end; slot k lies between
// tooth k and tooth k+1 (slot Q between tooth Q and tooth 1). With two layers
// every tooth carries a coil; with one layer only the odd teeth do. The EMF of
// the coil on tooth k is a phasor at electrical angle -p*(k-1)*360/Q degrees
// (a tooth further round sees the rotor poles later when the rotor turns
// counter-clockwise). The layout is found by the star of slots (Bianchi et al.,
// IEEE Trans. Ind. Appl. 42(4), 2006): every coil phasor is given to the nearest
// of the 2m phase axes +A, -A, +B, ..., which maximises the fundamental
// winding factor; the result is accepted only when the phasor sums of the m
// phases are equal in magnitude and 360/m degrees apart (balance is tested, not
// assumed from a rule).
//
// Conventions. Phase names U, V, W for three phases (IEC 60034-8 terminal marks
// U1/U2...), V lagging U by 360/m electrical degrees. Direction CW means the wire
// goes clockwise round the tooth seen from the air gap while following the path
// from its start terminal. A coil whose phasor lies near the phase axis is
// wound CW, one near the opposite axis is wound CCW, so both add. In text a
// coil is a signed token, the sign glued to the upper-case phase letter: "+U"
// CW, "-U" CCW, "0" a tooth without a coil (SequenceTokens, SenseLegend); the
// signed form of the phase matrix of tooth-coil windings (common practice).
// Letter case never carries meaning. Tooth 1
// carries a CW coil of phase U and starts a run of adjacent U coils where the
// layout has runs.
//
// The package does no I/O and knows nothing of screens or paper. Angles are
// kept as integers on a circle of 2Q or 4mQ steps so ties and symmetry tests
// are exact; only winding factors are floating point.
package winding
