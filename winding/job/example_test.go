package job_test

import (
	"fmt"

	"coilwright/winding/job"
)

func ExampleParse() {
	_, err := job.Parse([]byte("name = \"x\"\n[winding]\nslots = 12\npole = 10\n"), "stator.toml")
	fmt.Println(err)
	// Output: job: stator.toml:4:1: winding.pole: unknown key "pole" in [winding]; known keys there: connection, layers, paths, phases, poles, slots
}

func ExampleDemo() {
	j := job.Demo()
	fmt.Printf("%s: %d slots, %d poles, %s rotor, turns for %s %g V at %g rpm\n",
		j.Name, j.Winding.Slots, j.Winding.Poles, j.Stator.Rotor, j.Turns.Target, j.Turns.Volts, j.Turns.SpeedRPM)
	// Output: Leat turbine charger, 24/28 outer rotor: 24 slots, 28 poles, outer rotor, turns for dc_bus 26 V at 300 rpm
}
