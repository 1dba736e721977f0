package verify_test

import (
	"bufio"
	"errors"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"coilwright/winding/job"
	"coilwright/winding/plan"
	"coilwright/winding/verify"
)

func planWithPaths(t testing.TB, paths int) *plan.Plan {
	t.Helper()
	j := job.Demo()
	j.Winding.Paths = paths
	p, err := plan.Build(j)
	if err != nil {
		t.Fatalf("plan.Build(demo, %d paths) err = %v", paths, err)
	}
	return p
}

// observed is every wound tooth of the plan as it would read with the coils
// on the given teeth reversed.
func observed(p *plan.Plan, reversed ...int) []verify.PoleReading {
	flip := map[int]bool{}
	for _, t := range reversed {
		flip[t] = true
	}
	out := make([]verify.PoleReading, 0, len(p.Polarity))
	for _, tp := range p.Polarity {
		pole := tp.Pole
		if flip[tp.Tooth] {
			pole = pole.Opposite()
		}
		out = append(out, verify.PoleReading{Phase: tp.Phase, Tooth: tp.Tooth, Pole: pole})
	}
	return out
}

// named gives the teeth the failing findings of a report name, and the
// phases of those findings.
func named(rep *verify.Report) (teeth []int, phases []string) {
	for _, f := range rep.Findings {
		if f.Severity != verify.Fail {
			continue
		}
		if f.Test != plan.TestPolarity {
			continue
		}
		phases = append(phases, f.Phase)
		if f.Tooth != 0 {
			teeth = append(teeth, f.Tooth)
		}
		teeth = append(teeth, f.Teeth...)
	}
	return teeth, phases
}

func TestPolarityAllRight(t *testing.T) {
	for _, paths := range []int{1, 2} {
		p := planWithPaths(t, paths)
		rep, err := verify.Check(p, verify.Readings{Polarity: observed(p)})
		if err != nil {
			t.Fatalf("%d paths: Check(every pole right) err = %v", paths, err)
		}
		if rep.Verdict != verify.Pass || len(rep.Findings) != 3 || rep.Polarity == nil || len(rep.Polarity.Reversed) != 0 {
			t.Errorf("%d paths: Check(every pole right) = %s, %d findings, %+v; want pass with one finding per phase", paths, rep.Verdict, len(rep.Findings), rep.Polarity)
		}
		if len(rep.Cautions) == 0 || !strings.Contains(rep.Cautions[0], "current-limited") {
			t.Errorf("%d paths: report cautions %q; want the DC supply caution", paths, rep.Cautions)
		}
	}
}

// Every single reversed coil of the demo (one and two paths) is found and
// named by its tooth alone.
func TestPolarityEachReversedCoil(t *testing.T) {
	for _, paths := range []int{1, 2} {
		p := planWithPaths(t, paths)
		for _, tp := range p.Polarity {
			rep, err := verify.Check(p, verify.Readings{Polarity: observed(p, tp.Tooth)})
			if err != nil {
				t.Fatalf("Check(tooth %d reversed) err = %v", tp.Tooth, err)
			}
			teeth, phases := named(rep)
			if rep.Verdict != verify.Fail || !reflect.DeepEqual(teeth, []int{tp.Tooth}) || !reflect.DeepEqual(phases, []string{tp.Phase}) {
				t.Errorf("%d paths, tooth %d reversed: verdict %s, named teeth %v in %v; want fail naming tooth %d of %s",
					paths, tp.Tooth, rep.Verdict, teeth, phases, tp.Tooth, tp.Phase)
				continue
			}
			for _, f := range rep.Findings {
				if f.Tooth == tp.Tooth && (!strings.Contains(f.Message, "step ") || !strings.Contains(f.Message, "Rewind")) {
					t.Errorf("tooth %d reversed: message %q does not give the coil's step and what to do", tp.Tooth, f.Message)
				}
			}
		}
	}
}

// Every pair of reversed coils of the demo is found; both teeth are named,
// and no other.
func TestPolarityTwoReversedCoils(t *testing.T) {
	for _, paths := range []int{1, 2} {
		p := planWithPaths(t, paths)
		for i, a := range p.Polarity {
			for _, b := range p.Polarity[i+1:] {
				rep, err := verify.Check(p, verify.Readings{Polarity: observed(p, a.Tooth, b.Tooth)})
				if err != nil {
					t.Fatalf("Check(teeth %d, %d reversed) err = %v", a.Tooth, b.Tooth, err)
				}
				teeth, _ := named(rep)
				want := []int{min(a.Tooth, b.Tooth), max(a.Tooth, b.Tooth)}
				if a.Phase != b.Phase {
					want = []int{a.Tooth, b.Tooth} // one finding per phase, in phase order
				}
				if rep.Verdict != verify.Fail || !reflect.DeepEqual(teeth, want) {
					t.Errorf("%d paths, teeth %d and %d reversed: verdict %s, named %v; want fail naming %v", paths, a.Tooth, b.Tooth, rep.Verdict, teeth, want)
				}
			}
		}
	}
}

func TestPolarityPatterns(t *testing.T) {
	p1, p2 := planWithPaths(t, 1), planWithPaths(t, 2)
	teethOf := func(p *plan.Plan, phase string, path int) []int {
		var out []int
		for _, tp := range p.PolesOf(phase) {
			if path == 0 || tp.Path == path {
				out = append(out, tp.Tooth)
			}
		}
		return out
	}
	cases := []struct {
		name     string
		p        *plan.Plan
		reversed []int
		pattern  string
		says     string
	}{
		// U1 and U2 swapped: every tooth of U reversed.
		{"phase leads swapped", p1, teethOf(p1, "U", 0), "leads", "swapped"},
		{"path leads swapped", p2, teethOf(p2, "V", 2), "path-leads", "path 2"},
		// Demo U path: 1 (cw, S) then 2 (ccw, N): wound in each other's place.
		{"jumper to the wrong tooth", p1, []int{1, 2}, "jumper", "jumper taken to the wrong tooth"},
		{"leads swapped and one coil reversed", p1, teethOf(p1, "U", 0)[1:], "leads-and-coils", "tooth 1 wound"},
		{"one coil", p1, []int{7}, "coil", "coil 3 (step"},
		{"two coils apart", p1, []int{1, 13}, "coils", "tooth 1 (coil 1"},
	}
	for _, c := range cases {
		rep, err := verify.Check(c.p, verify.Readings{Polarity: observed(c.p, c.reversed...)})
		if err != nil {
			t.Fatalf("%s: err = %v", c.name, err)
		}
		var got string
		var msg string
		for _, ph := range rep.Polarity.Phases {
			if ph.Pattern != "" {
				got = ph.Pattern
			}
		}
		for _, f := range rep.Findings {
			if f.Severity == verify.Fail {
				msg = f.Message
			}
		}
		if got != c.pattern || !strings.Contains(msg, c.says) {
			t.Errorf("%s: pattern %q, message %q; want %q saying %q", c.name, got, msg, c.pattern, c.says)
		}
	}
}

func TestPolarityPartial(t *testing.T) {
	p := planWithPaths(t, 1)
	rep, err := verify.Check(p, verify.Readings{Polarity: observed(p)[:3]})
	if err != nil {
		t.Fatal(err)
	}
	if rep.Verdict != verify.Warn || !strings.Contains(rep.Findings[0].Message, "not read: tooth 8, 13, 14, 19, 20") {
		t.Errorf("three teeth of U read: %s %q; want warn naming the teeth not read", rep.Verdict, rep.Findings[0].Message)
	}
}

func TestParsePolarity(t *testing.T) {
	cases := []struct {
		in    string
		want  []verify.PoleReading
		token string // the token an error names; "" when it parses
	}{
		{"U=1S,2N,7N,8S", []verify.PoleReading{{"U", 1, plan.South}, {"U", 2, plan.North}, {"U", 7, plan.North}, {"U", 8, plan.South}}, ""},
		{" v = 5s 6n ", []verify.PoleReading{{"V", 5, plan.South}, {"V", 6, plan.North}}, ""},
		{"W=3N,,4S", []verify.PoleReading{{"W", 3, plan.North}, {"W", 4, plan.South}}, ""},
		{"U=1X", nil, `"U=1X"`},
		{"U1S", nil, `"U1S"`},
		{"=1S", nil, `"=1S"`},
		{"U=", nil, `"U="`},
		{"U=S", nil, `"U=S"`},
		{"U=0N", nil, `"U=0N"`},
		{"U=99999999999999999999N", nil, `"U=99999999999999999999N"`},
		{"U=1SN", nil, `"U=1SN"`},
		{"Ü=1S", nil, `"Ü=1S"`},
	}
	for _, c := range cases {
		got, err := verify.ParsePolarity(c.in)
		if c.token == "" {
			if err != nil || !reflect.DeepEqual(got, c.want) {
				t.Errorf("ParsePolarity(%q) = %v, %v; want %v", c.in, got, err, c.want)
			}
			continue
		}
		var pe *verify.PolarityError
		if !errors.As(err, &pe) || pe.Token != c.token || !errors.Is(err, verify.ErrInput) {
			t.Errorf("ParsePolarity(%q) err = %v; want a PolarityError naming %s", c.in, err, c.token)
		}
	}
}

func TestValidatePolarity(t *testing.T) {
	p := planWithPaths(t, 1)
	single := job.Demo()
	single.Winding.Layers = 1
	single.Winding.Poles = 20 // 24/20 single layer
	ps, err := plan.Build(single)
	if err != nil {
		t.Fatal(err)
	}
	cases := []struct {
		p     *plan.Plan
		in    string
		token string
		says  string
	}{
		{p, "U=3S", `"U=3S"`, "carries phase W"},
		{p, "X=1S", `"X=1S"`, "no phase X"},
		{p, "U=25S", `"U=25S"`, "24 teeth"},
		{p, "U=1S,1S", `"U=1S"`, "twice"},
		{ps, "U=2S", `"U=2S"`, "carries no coil"},
	}
	for _, c := range cases {
		obs, err := verify.ParsePolarity(c.in)
		if err != nil {
			t.Fatalf("ParsePolarity(%q) err = %v", c.in, err)
		}
		_, err = verify.Check(c.p, verify.Readings{Polarity: obs})
		var pe *verify.PolarityError
		if !errors.As(err, &pe) || pe.Token != c.token || !strings.Contains(pe.Reason, c.says) {
			t.Errorf("Check(%q) err = %v; want a PolarityError naming %s saying %q", c.in, err, c.token, c.says)
		}
	}
}

// FuzzParsePolarity: any text either parses into teeth with a pole N or S
// that Check judges or refuses as input, or is refused naming a token; never
// a panic.
func FuzzParsePolarity(f *testing.F) {
	file, err := os.Open(filepath.Join(fileDir, "polarity-seeds.txt"))
	if err != nil {
		f.Fatal(err)
	}
	sc := bufio.NewScanner(file)
	for sc.Scan() {
		f.Add(sc.Text())
	}
	file.Close()
	p := demoPlan(f)
	f.Fuzz(func(t *testing.T, s string) {
		obs, err := verify.ParsePolarity(s)
		if err != nil {
			var pe *verify.PolarityError
			if !errors.As(err, &pe) || pe.Token == "" || pe.Reason == "" {
				t.Fatalf("ParsePolarity(%q) err = %v; want a PolarityError naming a token", s, err)
			}
			return
		}
		for _, o := range obs {
			if o.Tooth < 1 || (o.Pole != plan.North && o.Pole != plan.South) || o.Phase == "" {
				t.Fatalf("ParsePolarity(%q) gave %+v", s, o)
			}
		}
		rep, err := verify.Check(p, verify.Readings{Polarity: obs})
		if err != nil {
			if !errors.Is(err, verify.ErrInput) {
				t.Fatalf("Check(%q) err = %v; want input refused or judged", s, err)
			}
			return
		}
		if rep.Verdict == "" || rep.Polarity == nil {
			t.Fatalf("Check(%q) gave no polarity verdict", s)
		}
	})
}

// ValuesOf and ReadingsOf carry the poles through the record's keys and back.
func TestPolarityValuesRoundTrip(t *testing.T) {
	p := planWithPaths(t, 1)
	pt, _ := p.TestNamed(plan.TestPolarity)
	obs := observed(p, 7)
	v := verify.ValuesOf(p, pt, verify.Readings{Polarity: obs})
	if len(v) != 24 || v["tooth_1"] != -1 || v["tooth_7"] != -1 {
		t.Fatalf("ValuesOf(polarity) = %v; want 24 teeth, tooth_1 -1, tooth_7 -1 (reversed)", v)
	}
	r, ok := verify.ReadingsOf(p, pt, v)
	if !ok || !reflect.DeepEqual(r.Polarity, obs) {
		t.Errorf("ReadingsOf(ValuesOf(obs)) = %v, %v; want the same poles", r.Polarity, ok)
	}
}

// A five-phase winding (20 slots, 18 poles) is judged phase by phase like a
// three-phase one: the polarity check needs no three-phase resistance model.
func TestPolarityFivePhases(t *testing.T) {
	src := string(job.DemoTOML())
	for _, r := range [][2]string{
		{"slots = 24", "slots = 20"}, {"poles = 28", "poles = 18"}, {"phases = 3", "phases = 5"},
		{"target = \"dc_bus\"\nvolts = 26\nspeed_rpm = 300\nbridge_drop_v = 1.6", "target = \"phase_emf\"\nvolts = 12\nspeed_rpm = 300"},
	} {
		if !strings.Contains(src, r[0]) {
			t.Fatalf("demo job has no %q to change", r[0])
		}
		src = strings.Replace(src, r[0], r[1], 1)
	}
	j, err := job.Parse([]byte(src), "five.toml")
	if err != nil {
		t.Fatal(err)
	}
	p, err := plan.Build(j)
	if err != nil {
		t.Fatal(err)
	}
	if len(p.Layout.PhaseNames) != 5 || len(p.Polarity) != 20 {
		t.Fatalf("five-phase plan: %d phases, %d poles; want 5 and 20", len(p.Layout.PhaseNames), len(p.Polarity))
	}
	rep, err := verify.Check(p, verify.Readings{Polarity: observed(p)})
	if err != nil || rep.Verdict != verify.Pass || len(rep.Findings) != 5 {
		t.Fatalf("five phases, every pole right: %v, %v; want pass with five findings", rep, err)
	}
	for _, tp := range p.Polarity {
		rep, err := verify.Check(p, verify.Readings{Polarity: observed(p, tp.Tooth)})
		if err != nil {
			t.Fatal(err)
		}
		if teeth, phases := named(rep); !reflect.DeepEqual(teeth, []int{tp.Tooth}) || !reflect.DeepEqual(phases, []string{tp.Phase}) {
			t.Errorf("five phases, tooth %d reversed: named %v in %v; want tooth %d of %s", tp.Tooth, teeth, phases, tp.Tooth, tp.Phase)
		}
	}
}
