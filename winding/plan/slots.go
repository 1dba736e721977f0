package plan

import (
	"math"
	"strconv"

	"coilwright/winding"
)

// CoilSlots returns the slot a coil goes down and the slot it comes up, for
// the rotor type. With the lead end up and facing the tooth from the air gap,
// a clockwise coil goes down the slot on the right and comes up the slot on
// the left; a counter-clockwise coil the other way round. Seen from the air
// gap of an outer rotor (looking in at the stator) tooth k's right-hand slot
// is slot k, the slot after it; seen from the bore of an inner rotor (looking
// out) it is slot k-1, the slot before it.
func CoilSlots(r Rotor, d winding.Direction, tooth, slots int) (down, up int) {
	before, after := winding.SlotsOf(tooth, slots)
	right, left := before, after
	if r == OuterRotor {
		right, left = after, before
	}
	if d == winding.CCW {
		return left, right
	}
	return right, left
}

// SlotWords is the instruction for the two slots of a coil, in the same words
// on every screen and page: "down slot 1, up slot 24".
func SlotWords(down, up int) string {
	return "down slot " + strconv.Itoa(down) + ", up slot " + strconv.Itoa(up)
}

// SenseWords spells a coil's sense out as the winder sees it:
// "CLOCKWISE seen from the air gap".
func SenseWords(d winding.Direction) string {
	if d == winding.CCW {
		return "COUNTER-CLOCKWISE seen from the air gap"
	}
	return "CLOCKWISE seen from the air gap"
}

// JumperStep is a jumper as it is laid: the wire leaves the up slot of one
// coil at the lead end and enters the down slot of the next, the shorter way
// round the lead end (counter-clockwise, up the slot numbers, when both ways
// are equal). The embedded winding.Jumper keeps the teeth and the tooth span.
type JumperStep struct {
	winding.Jumper
	LeavesSlot  int `json:"leaves_slot"` // the up slot of the coil on FromTooth
	EntersSlot  int `json:"enters_slot"` // the down slot of the coil on ToTooth
	SlotPitches int `json:"slot_pitches"`
	// Way is the direction round the lead end seen from the lead end: "ccw"
	// (up the slot numbers) or "cw".
	Way string `json:"way"`
	// RadiusMM is the radius the jumper runs at round the lead end (mid slot
	// depth); LengthMM is the arc between the two slots there plus the slack.
	RadiusMM float64 `json:"radius_mm"`
	LengthMM float64 `json:"length_mm"`
}

// Jumper ways seen from the lead end.
const (
	WayCCW = "ccw"
	WayCW  = "cw"
)

// Words is the instruction for the jumper in the same words on every screen
// and page: "leaves slot 2 at the lead end, enters slot 6: 4 slot pitches,
// counter-clockwise seen from the lead end".
func (j JumperStep) Words() string {
	s := "leaves slot " + strconv.Itoa(j.LeavesSlot) + " at the lead end, enters slot " + strconv.Itoa(j.EntersSlot) + ": "
	if j.SlotPitches == 0 {
		return s + "straight back down the same slot"
	}
	way := "counter-clockwise"
	if j.Way == WayCW {
		way = "clockwise"
	}
	return s + strconv.Itoa(j.SlotPitches) + " slot pitch" + plural(j.SlotPitches, "", "es") + ", " + way + " seen from the lead end"
}

// LayJumper lays one jumper between two coils from the slot positions: slot
// k's centre lies (k - ½)·360°/Q counter-clockwise from the centre of tooth 1
// seen from the lead end, and the jumper follows the arc of radius r between
// the two slot centres the shorter way, plus the slack.
func LayJumper(rot Rotor, jp winding.Jumper, from, to winding.Direction, slots int, r, slackMM float64) JumperStep {
	_, leaves := CoilSlots(rot, from, jp.FromTooth, slots)
	enters, _ := CoilSlots(rot, to, jp.ToTooth, slots)
	up := ((enters-leaves)%slots + slots) % slots
	js := JumperStep{Jumper: jp, LeavesSlot: leaves, EntersSlot: enters, SlotPitches: up, Way: WayCCW, RadiusMM: r}
	if down := slots - up; down < up {
		js.SlotPitches, js.Way = down, WayCW
	}
	angle := 2 * math.Pi * float64(js.SlotPitches) / float64(slots)
	js.LengthMM = r*angle + slackMM
	return js
}
