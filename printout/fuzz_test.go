package printout

import (
	"testing"

	"coilwright/winding/job"
	"coilwright/winding/job/jobtest"
	"coilwright/winding/plan"
)

// FuzzBuildPack carries arbitrary job files (seeded with testdata/job/) through
// the plan into the page model: any job the plan accepts must lay out without
// a panic, with every page inside the sheet.
func FuzzBuildPack(f *testing.F) {
	for _, data := range jobtest.Seeds(f) {
		f.Add(data)
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		if len(data) > 4096 {
			return
		}
		j, err := job.Parse(data, "fuzz.toml")
		if err != nil {
			return
		}
		if j.Winding.Slots > 240 {
			return // keep each run short; large stators are benchmarked
		}
		p, err := plan.Build(j)
		if err != nil {
			return
		}
		pack, err := Build(p, Options{})
		if err != nil {
			t.Fatalf("Build of an accepted plan = %v", err)
		}
		if len(pack.Pages) < 4 {
			t.Fatalf("%d pages; want at least 4", len(pack.Pages))
		}
	})
}

// FuzzDemoVariants varies the numbers of the demo job that shape the pack
// (slot and pole count, layers, paths, phases, connection, rotor side, turns,
// wire) far more often than byte mutation of a file would, and carries every
// variant the plan accepts through the page model.
func FuzzDemoVariants(f *testing.F) {
	f.Add(24, 28, 2, 1, 3, false, false, 18, 1.0, 2)
	f.Add(12, 10, 1, 2, 3, true, true, 40, 0.5, 1)
	f.Add(120, 112, 2, 4, 3, false, true, 5, 0.3, 1)
	f.Add(20, 18, 2, 2, 5, true, false, 10, 0.4, 3)
	f.Add(9, 8, 2, 1, 3, true, true, 1, 2.0, 1)
	f.Fuzz(func(t *testing.T, slots, poles, layers, paths, phases int, delta, inner bool, turns int, bare float64, strands int) {
		if slots > 240 || poles > 240 {
			return
		}
		j := jobtest.DemoVariant(jobtest.Variant{Slots: slots, Poles: poles, Layers: layers, Paths: paths,
			Phases: phases, Delta: delta, InnerRotor: inner, TurnsPerCoil: turns})
		j.Wire.BareDiameterMM, j.Wire.StrandsInHand = bare, strands
		p, err := plan.Build(j)
		if err != nil {
			return
		}
		pack, err := Build(p, Options{})
		if err != nil || len(pack.Pages) < 4 {
			t.Fatalf("Build of an accepted %d/%d plan = %v", slots, poles, err)
		}
	})
}
