package main

import (
	"errors"
	"fmt"
	"math"
	"os"
	"strconv"
	"strings"

	"github.com/spf13/cobra"

	"coilwright/winding/journal"
	"coilwright/winding/plan"
	"coilwright/winding/progress"
	"coilwright/winding/verify"
)

func init() { register(newCheckCmd) }

// readingFlag is a number given on the command line; for resistances it also
// takes OL or open (the meter over range) as +Inf.
type readingFlag struct {
	v       float64
	allowOL bool
}

func (f *readingFlag) String() string { return strconv.FormatFloat(f.v, 'g', -1, 64) }
func (f *readingFlag) Type() string   { return "number" }
func (f *readingFlag) Set(s string) error {
	s = strings.TrimSpace(s)
	if f.allowOL && (strings.EqualFold(s, "ol") || strings.EqualFold(s, "open")) {
		f.v = math.Inf(1)
		return nil
	}
	v, err := strconv.ParseFloat(strings.TrimSuffix(s, ","), 64)
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		if f.allowOL {
			return fmt.Errorf("%q is not a number (ohm, or OL for an open circuit)", s)
		}
		return fmt.Errorf("%q is not a number", s)
	}
	f.v = v
	return nil
}

type checkFlags struct {
	demo, asJSON, record     bool
	readingsFile, progress   string
	uv, vw, wu, temp, lead   readingFlag
	perPhase                 string
	fourWire                 bool
	ir1, ir10, irVolts       readingFlag
	hvPass, hvFail           bool
	hvVolts                  readingFlag
	emfUV, emfVW, emfWU, rpm readingFlag
	polarity                 []string
}

func newCheckCmd() *cobra.Command {
	f := &checkFlags{uv: readingFlag{allowOL: true}, vw: readingFlag{allowOL: true}, wu: readingFlag{allowOL: true}}
	cmd := &cobra.Command{
		Use:   "check JOB | --demo  --uv R --vw R --wu R --temp T [more readings] | --polarity PHASE=TOOTHPOLE,...",
		Short: "Prove a finished stator: resistance, balance, insulation, withstand and back-EMF against the plan",
		Long: `check compares what you measured on the finished stator with what its plan
expects, and says pass, warn or fail, with findings that name the phase and the
likely cause.

Resistance: the three line-to-line readings of the connected winding (--uv,
--vw, --wu, in ohm; OL for an open circuit), or --per-phase U,V,W read before
the star point is made, and the winding temperature --temp in °C. Subtract the
meter leads with --lead-ohm (read them shorted together) or say --four-wire.
Phases are corrected to 20 °C (IEC 60028) and compared with the plan inside a
band from the wire's diameter tolerance (IEC 60317) and the length estimate;
balance within 2 % (EASA AR100).

Insulation (IEEE 43-2013): --ir1 and --ir10 in MΩ after 1 and 10 minutes at
--ir-volts V DC. Withstand (IEC 60034-1): --hv-pass or --hv-fail with --hv-volts.
Back-EMF: --emf-uv --emf-vw --emf-wu in V rms at --rpm.

Polarity: with DC into a phase at its start terminal, the pole a compass
shows at each wound tooth face, --polarity U=1S,2N,7N,8S (repeat it for each
phase); a reversed coil is named by its tooth. It can be checked on its own,
with no resistance readings.

The same readings can be given in a TOML file (--readings FILE); flags
override it. --record appends the readings and the verdict to the job's
progress record, where the bench guide and the printed test record show them.

The exit status is 0 whenever the check ran, whatever its verdict (read it in
the output: PASS, WARN or FAIL), 2 for readings that cannot be judged, and 1
when --record could not write the record (the report is still printed, and a
last line says it was not recorded).

High-voltage and insulation tests can kill: only trained people, following
local codes and licensed practice.`,
		Example: "  coilwright check --demo --uv 0.2861 --vw 0.2858 --wu 0.2866 --temp 22.5 --four-wire\n" +
			"  coilwright check --demo --polarity U=1S,2N,7N,8S,13S,14N,19N,20S\n" +
			"  coilwright check stator.toml --readings bench.toml --record --json",
		Args: maxArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error { return runCheck(cmd, args, f) },
	}
	fl := cmd.Flags()
	addDemoFlag(cmd, &f.demo)
	fl.BoolVar(&f.asJSON, "json", false, "write the report as JSON")
	fl.Var(&f.uv, "uv", "resistance between lines U and V, ohm (OL: open)")
	fl.Var(&f.vw, "vw", "resistance between lines V and W, ohm (OL: open)")
	fl.Var(&f.wu, "wu", "resistance between lines W and U, ohm (OL: open)")
	fl.StringVar(&f.perPhase, "per-phase", "", "phase resistances U,V,W read before the star point is made, ohm (instead of --uv --vw --wu)")
	fl.Var(&f.temp, "temp", "winding temperature, °C")
	fl.Var(&f.lead, "lead-ohm", "meter lead resistance to subtract from each reading, ohm")
	fl.BoolVar(&f.fourWire, "four-wire", false, "readings are four-wire (Kelvin): no lead correction")
	fl.Var(&f.ir1, "ir1", "insulation resistance to core after 1 min, MΩ")
	fl.Var(&f.ir10, "ir10", "insulation resistance to core after 10 min, MΩ")
	fl.Var(&f.irVolts, "ir-volts", "insulation test voltage, V DC")
	fl.BoolVar(&f.hvPass, "hv-pass", false, "the withstand test held without breakdown")
	fl.BoolVar(&f.hvFail, "hv-fail", false, "the withstand test broke down or tripped")
	fl.Var(&f.hvVolts, "hv-volts", "withstand test voltage applied, V AC rms")
	fl.Var(&f.emfUV, "emf-uv", "back-EMF between lines U and V, V rms")
	fl.Var(&f.emfVW, "emf-vw", "back-EMF between lines V and W, V rms")
	fl.Var(&f.emfWU, "emf-wu", "back-EMF between lines W and U, V rms")
	fl.Var(&f.rpm, "rpm", "rotor speed during the back-EMF reading, rpm")
	fl.StringArrayVar(&f.polarity, "polarity", nil, "poles seen with DC into the phase at X1: PHASE=TOOTHPOLE,... e.g. U=1S,2N,7N,8S (repeat per phase)")
	fl.StringVar(&f.readingsFile, "readings", "", "read the measurements from this TOML file (flags override it)")
	fl.BoolVar(&f.record, "record", false, "append the readings and the verdict to the job's progress record")
	fl.StringVar(&f.progress, "progress", "", "the progress record to append to with --record (default: beside the job, JOB.progress)")
	return cmd
}

func runCheck(cmd *cobra.Command, args []string, f *checkFlags) error {
	_, p, jobPath, err := loadPlanArg(cmd, args, f.demo)
	if err != nil {
		return err
	}
	r, err := f.readings(cmd)
	if err != nil {
		return err
	}
	rep, err := verify.Check(p, r)
	var ie *verify.InputError
	var pe *verify.PolarityError
	switch {
	case errors.As(err, &pe):
		return badInputf("--polarity %s: %s", pe.Token, pe.Reason)
	case errors.As(err, &ie):
		if f.readingsFile != "" && !cmd.Flags().Changed(flagOf(ie.Field)) && !(flagOf(ie.Field) == "hv-volts" && (f.hvPass || f.hvFail)) {
			// The value came from the readings file: name it by the file's key.
			return badInputf("--readings %s: %s = %s: %s", f.readingsFile, verify.FileKey(ie.Field), fmtReading(ie.Value), ie.Reason)
		}
		return badInputf("--%s %s: %s", flagOf(ie.Field), fmtReading(ie.Value), ie.Reason)
	case errors.Is(err, verify.ErrUnsupported):
		return badInput(err)
	case err != nil:
		return err
	}
	var recErr error
	if f.record {
		path := f.progress
		if path == "" && jobPath != "" {
			path = journal.PathFor(jobPath)
		}
		if path == "" {
			if path, err = demoProgressPath(); err != nil {
				return err
			}
		}
		var filed []journal.Event
		if filed, recErr = recordCheck(cmd, path, p, r, rep); recErr == nil {
			fmt.Fprintf(cmd.ErrOrStderr(), "recorded in %s: %s; the bench guide and the sheet show them\n", path, filedText(p, filed))
		} else if le := (*journal.LockedError)(nil); errors.As(recErr, &le) {
			who := "another program"
			if le.Info.Holder != "" {
				who = fmt.Sprintf("%q (pid %d on %s)", le.Info.Holder, le.Info.PID, le.Info.Host)
			}
			recErr = fmt.Errorf("%s is held by %s: quit it (q in the bench guide) and give the same check again", path, who)
		}
	}
	if err := writeCheckReport(cmd, p, rep, f.asJSON); err != nil {
		return err
	}
	if recErr != nil {
		// The verdict is shown above; only the record failed (exit status 1).
		return fmt.Errorf("check --record: %w. The check above was NOT recorded", recErr)
	}
	return nil
}

// writeCheckReport writes the check's report, as text or JSON.
func writeCheckReport(cmd *cobra.Command, p *plan.Plan, rep *verify.Report, asJSON bool) error {
	if asJSON {
		return writeJSON(cmd.OutOrStdout(), rep)
	}
	w := cmd.OutOrStdout()
	fmt.Fprintf(w, "Check of %s\n\n", planTitle(p))
	// a report without resistance readings starts with a section's blank line
	_, err := fmt.Fprint(w, strings.TrimLeft(rep.Text(), "\n"))
	return err
}

func planTitle(p *plan.Plan) string {
	t := p.Name
	if t == "" {
		t = "the job"
	}
	if p.Layout != nil {
		t += fmt.Sprintf(" (%d teeth, %d poles, %s)", p.Layout.Spec.Slots, p.Layout.Spec.Poles, p.Connection)
	}
	return t
}

// flagOf turns a verify field ("uv", "per-phase U") into its flag name.
func flagOf(field string) string {
	name, _, _ := strings.Cut(field, " ")
	return name
}

func fmtReading(v float64) string {
	if math.IsInf(v, 1) {
		return "OL"
	}
	return strconv.FormatFloat(v, 'g', -1, 64)
}

// readings gathers the readings from the file and the flags. Resistance and
// temperature are required unless only other tests are given.
func (f *checkFlags) readings(cmd *cobra.Command) (verify.Readings, error) {
	var r verify.Readings
	haveTemp := false
	if f.readingsFile != "" {
		data, err := os.ReadFile(f.readingsFile)
		if err != nil {
			return r, badInputf("--readings %s: %v", f.readingsFile, err)
		}
		if r, haveTemp, err = verify.ParseReadings(data); err != nil {
			return r, badInputf("--readings %s: %v", f.readingsFile, err)
		}
	}
	ch := cmd.Flags().Changed
	set := func(name string, dst *float64, src readingFlag) {
		if ch(name) {
			*dst = src.v
		}
	}
	set("uv", &r.UV, f.uv)
	set("vw", &r.VW, f.vw)
	set("wu", &r.WU, f.wu)
	set("lead-ohm", &r.LeadOhm, f.lead)
	if ch("temp") {
		r.TempC, haveTemp = f.temp.v, true
	}
	if ch("four-wire") {
		r.FourWire = f.fourWire
	}
	if ch("per-phase") {
		parts := strings.Split(f.perPhase, ",")
		if len(parts) != 3 {
			return r, badInputf("--per-phase %q: give three resistances U,V,W separated by commas", f.perPhase)
		}
		r.PerPhase = make([]float64, 3)
		for i, s := range parts {
			rf := readingFlag{allowOL: true}
			if err := rf.Set(s); err != nil {
				return r, badInputf("--per-phase %s: %v", []string{"U", "V", "W"}[i], err)
			}
			r.PerPhase[i] = rf.v
		}
	}
	if ch("polarity") {
		var given []verify.PoleReading
		phases := map[string]bool{}
		for _, s := range f.polarity {
			obs, err := verify.ParsePolarity(s)
			if err != nil {
				var pe *verify.PolarityError
				if errors.As(err, &pe) {
					return r, badInputf("--polarity %s: %s", pe.Token, pe.Reason)
				}
				return r, badInput(err)
			}
			for _, o := range obs {
				phases[o.Phase] = true
			}
			given = append(given, obs...)
		}
		// A phase given by flag replaces that phase from the file.
		kept := given
		for _, o := range r.Polarity {
			if !phases[o.Phase] {
				kept = append(kept, o)
			}
		}
		r.Polarity = kept
	}
	if len(r.Polarity) > 0 && !r.HasResistance() && r.Insulation == nil && r.Withstand == nil && r.EMF == nil &&
		!anyChanged(ch, "uv", "vw", "wu", "per-phase", "temp", "ir1", "ir10", "ir-volts", "hv-pass", "hv-fail", "hv-volts", "emf-uv", "emf-vw", "emf-wu", "rpm") {
		return r, nil // a polarity test on its own needs no resistance or temperature
	}
	// Insulation.
	if ch("ir1") || ch("ir10") || ch("ir-volts") {
		if r.Insulation == nil {
			r.Insulation = &verify.Insulation{}
		}
		set("ir1", &r.Insulation.IR1MOhm, f.ir1)
		set("ir10", &r.Insulation.IR10MOhm, f.ir10)
		set("ir-volts", &r.Insulation.Volts, f.irVolts)
	}
	if in := r.Insulation; in != nil {
		switch {
		case !ch("ir1") && in.IR1MOhm == 0 && in.IR10MOhm > 0:
			return r, badInputf("--ir1 is missing: the polarization index needs the 1-minute reading too")
		case !ch("ir1") && in.IR1MOhm == 0 && f.readingsFile == "":
			return r, badInputf("--ir1 is missing: give the insulation resistance after 1 min in MΩ")
		case in.Volts == 0:
			return r, badInputf("--ir-volts is missing: give the insulation test voltage (IEEE 43: 500 V DC below 1 kV)")
		}
	}
	// Withstand.
	switch {
	case f.hvPass && f.hvFail:
		return r, badInputf("--hv-pass and --hv-fail: give one of them")
	case f.hvPass || f.hvFail:
		r.Withstand = &verify.Withstand{Passed: f.hvPass}
		if r.Withstand.Volts = f.hvVolts.v; !ch("hv-volts") {
			return r, badInputf("--hv-volts is missing: give the withstand test voltage applied")
		}
	case ch("hv-volts"):
		if r.Withstand == nil {
			return r, badInputf("--hv-volts without a result: add --hv-pass or --hv-fail")
		}
		r.Withstand.Volts = f.hvVolts.v
	}
	// Back-EMF.
	if ch("emf-uv") || ch("emf-vw") || ch("emf-wu") || ch("rpm") {
		if r.EMF == nil {
			r.EMF = &verify.BackEMF{}
		}
		set("emf-uv", &r.EMF.UV, f.emfUV)
		set("emf-vw", &r.EMF.VW, f.emfVW)
		set("emf-wu", &r.EMF.WU, f.emfWU)
		set("rpm", &r.EMF.RPM, f.rpm)
		for _, name := range []string{"emf-uv", "emf-vw", "emf-wu", "rpm"} {
			if !ch(name) && f.readingsFile == "" {
				return r, badInputf("--%s is missing: a back-EMF check needs --emf-uv, --emf-vw, --emf-wu and --rpm", name)
			}
		}
	}
	// Resistance is required unless the check is of other tests only (a
	// withstand, insulation or back-EMF test on its own); the temperature
	// wherever a reading is corrected by it (resistance, insulation).
	other := r.Insulation != nil || r.Withstand != nil || r.EMF != nil
	if r.HasResistance() || anyChanged(ch, "uv", "vw", "wu", "per-phase", "lead-ohm", "four-wire") || !other {
		if len(r.PerPhase) == 0 {
			for _, x := range []struct {
				name string
				v    float64
			}{{"uv", r.UV}, {"vw", r.VW}, {"wu", r.WU}} {
				if x.v == 0 && !ch(x.name) {
					if f.readingsFile != "" {
						return r, badInputf("--readings %s: %s is missing: give all three line-to-line readings uv, vw and wu in ohm (or per_phase = [U, V, W]), \"OL\" for an open circuit", f.readingsFile, x.name)
					}
					return r, badInputf("--%s is missing: give all three line-to-line readings --uv, --vw and --wu in ohm (or --per-phase U,V,W)", x.name)
				}
			}
		}
		if !haveTemp && f.readingsFile != "" {
			return r, badInputf("--readings %s: temp is missing: the winding temperature in °C is needed to correct the readings to 20 °C (or give --temp)", f.readingsFile)
		}
		if !haveTemp {
			return r, badInputf("--temp is missing: the winding temperature in °C is needed to correct the readings to 20 °C")
		}
	}
	if r.Insulation != nil && !haveTemp {
		return r, badInputf("--temp is missing: the winding temperature in °C is needed to correct the insulation resistance to 40 °C")
	}
	return r, nil
}

func anyChanged(ch func(string) bool, names ...string) bool {
	for _, n := range names {
		if ch(n) {
			return true
		}
	}
	return false
}

// recordCheck appends the readings and the verdict to the progress record:
// one event per plan test the check judged, on that test's step, so the bench
// guide and the printed test record show them (progress.CheckEvents). The
// plan's fingerprint goes first when the record lacks it.
func recordCheck(cmd *cobra.Command, path string, p *plan.Plan, r verify.Readings, rep *verify.Report) ([]journal.Event, error) {
	s, events, torn, err := journal.Open(path, "coilwright check")
	if err != nil {
		return nil, err
	}
	if torn != nil {
		fmt.Fprintf(cmd.ErrOrStderr(), "check: the last line of %s was cut short (%s) and is left out\n", path, torn)
	}
	defer func() {
		for _, n := range s.Notices() {
			fmt.Fprintf(cmd.ErrOrStderr(), "check: %s\n", n)
		}
	}()
	filed := progress.CheckEvents(p, r, rep)
	evs := filed
	if progress.Fold(p, events).NeedsFingerprint() {
		evs = append([]journal.Event{progress.FingerprintEvent(p)}, evs...)
	}
	if err := s.Append(evs...); err != nil {
		s.Close()
		return nil, err
	}
	return filed, s.Close()
}

// filedText says which tests a check filed, on which steps (named as the
// guide names them), with their verdicts: "step 75, resistance of each phase:
// PASS; step 76, resistance balance: PASS".
func filedText(p *plan.Plan, evs []journal.Event) string {
	parts := make([]string, 0, len(evs))
	for _, e := range evs {
		name := e.Test
		if e.Step >= 1 && e.Step <= len(p.Steps) {
			name = p.Steps[e.Step-1].Title // "Test: ..." or "Test (optional): ..."
			if _, rest, ok := strings.Cut(name, ": "); ok && strings.HasPrefix(name, "Test") {
				name = rest
			}
		}
		parts = append(parts, fmt.Sprintf("step %d, %s: %s", e.Step, name, strings.ToUpper(e.Verdict)))
	}
	if len(parts) == 0 {
		return "no test of the plan"
	}
	return strings.Join(parts, "; ")
}
