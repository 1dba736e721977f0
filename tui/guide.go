package tui

import (
	"fmt"
	"strconv"
	"strings"

	"github.com/charmbracelet/bubbles/cursor"
	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/bubbles/textinput"
	tea "github.com/charmbracelet/bubbletea"

	"coilwright/winding/plan"
)

// guideMode is what the guide screen is waiting for.
type guideMode int

const (
	modeWork         guideMode = iota // counting turns or waiting for enter
	modeConfirmTurns                  // the count differs from the plan
	modeConfirmUndo                   // take back the last step?
	modeNote                          // typing a note
	modeReadings                      // typing readings of a test step
	modeVerdict                       // the verdict of the readings is shown
)

func (m guideMode) String() string {
	switch m {
	case modeWork:
		return "work"
	case modeConfirmTurns:
		return "confirm-turns"
	case modeConfirmUndo:
		return "confirm-undo"
	case modeNote:
		return "note"
	case modeReadings:
		return "readings"
	case modeVerdict:
		return "verdict"
	}
	return "unknown"
}

// maxTurns caps a typed count.
const maxTurns = 99999

// guideModel is the guide screen: the stator drawing and the current step.
type guideModel struct {
	c *shared

	mode guideMode
	// entry holds the digits of a count being typed: nothing changes until
	// enter applies it; esc drops it and the count stands.
	entry   string
	flash   string
	note    textinput.Model
	fields  []textinput.Model
	focus   int
	labels  []field
	inErr   string
	verdict *Verdict
	values  []float64

	// A look at another step (0-based at) while the work stays where it
	// is; it holds only while the progress is unchanged since (atRev).
	looking bool
	at      int
	atRev   int

	// The page of cut lines shown (the more key), on step moreStep.
	moreStep, morePages int
}

// lookedAt is the step looked at, when it is not the current one and
// progress has not changed since the look began.
func (g guideModel) lookedAt() (int, bool) {
	if !g.looking || g.atRev != g.c.prog.Rev || g.at == g.c.prog.Current() {
		return 0, false
	}
	if _, ok := g.c.step(g.at); !ok {
		return 0, false
	}
	return g.at, true
}

// shown is the step the panel shows: the one looked at, or the current one.
func (g guideModel) shown() int {
	if at, ok := g.lookedAt(); ok {
		return at
	}
	return g.c.prog.Current()
}

// lookAt moves the look to step i (0-based), clamped to the plan; reaching
// the current step ends the look.
func (g guideModel) lookAt(i int) guideModel {
	cur := g.c.prog.Current()
	i = min(max(0, i), max(len(g.c.steps())-1, cur))
	g.looking, g.at, g.atRev, g.flash = i != cur, i, g.c.prog.Rev, ""
	return g
}

// backTo says where ending a look returns to.
func (g guideModel) backTo() string {
	if cur := g.c.prog.Current(); cur < len(g.c.steps()) {
		return fmt.Sprintf("step %d in hand", cur+1)
	}
	return "the finished job"
}

// lookKey handles a key while another step is looked at: it moves or ends
// the look and never changes progress, except undo, which ends the look and
// asks as usual.
func (g guideModel) lookKey(msg tea.KeyMsg, at int) (guideModel, tea.Cmd, bool) {
	k := g.c.keys.guide
	switch {
	case key.Matches(msg, k.Prev):
		return g.lookAt(at - 1), nil, true
	case key.Matches(msg, k.Next):
		return g.lookAt(at + 1), nil, true
	case key.Matches(msg, k.Back):
		g.flash = "back to " + g.backTo()
		g.looking = false
		return g, nil, true
	case key.Matches(msg, k.Undo):
		g.looking = false
		return g, nil, false
	case key.Matches(msg, k.Count):
		// A turn wound while looking is a turn of the coil in hand.
		g.looking = false
		if s, ok := g.c.step(g.c.prog.Current()); ok && s.Coil != nil && g.entry == "" {
			n := g.c.prog.Steps[s.Index-1].Turns + 1
			g.setTurns(s, n)
			g.flash = fmt.Sprintf("back to %s: turn counted, %d", g.backTo(), n)
			return g, nil, true
		}
		g.flash = fmt.Sprintf("only looking at step %d, nothing recorded: esc or home goes back to %s", at+1, g.backTo())
	case key.Matches(msg, k.Uncount), key.Matches(msg, k.Digits), key.Matches(msg, k.Note):
		g.flash = fmt.Sprintf("only looking at step %d, nothing recorded: esc or home goes back to %s", at+1, g.backTo())
	}
	return g, nil, true
}

func newTextInput(prompt string, limit int) textinput.Model {
	ti := textinput.New()
	ti.Prompt = prompt
	ti.CharLimit = limit
	ti.Cursor.SetMode(cursor.CursorStatic) // no blink: nothing runs while idle
	return ti
}

func newGuide(c *shared) guideModel {
	return guideModel{c: c, note: newTextInput("note: ", 200)}
}

// typing reports whether keys go to a text field, so global keys must not
// take them.
func (g guideModel) typing() bool {
	return g.mode == modeNote || g.mode == modeReadings || g.entry != ""
}

// resize sets the widths of the text fields.
func (g guideModel) resize() guideModel {
	w := max(10, g.c.width-16)
	g.note.Width = w
	for i := range g.fields {
		g.fields[i].Width = fieldWidth(g.fields[i]) - 1
	}
	return g
}

// update handles a key on the guide screen.
func (g guideModel) update(msg tea.KeyMsg) (guideModel, tea.Cmd) {
	// Keys typed fast (or sent by a terminal multiplexer) can arrive as one
	// message of several runes; outside a text field take them one by one,
	// so "18" typed quickly sets the count to 18.
	if g.mode != modeNote && g.mode != modeReadings && msg.Type == tea.KeyRunes && len(msg.Runes) > 1 {
		var cmds []tea.Cmd
		for _, r := range msg.Runes {
			var cmd tea.Cmd
			g, cmd = g.update(tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune{r}})
			cmds = append(cmds, cmd)
		}
		return g, tea.Batch(cmds...)
	}
	k := g.c.keys
	cur := g.c.prog.Current()
	s, ok := g.c.step(cur)
	switch g.mode {
	case modeNote:
		switch {
		case key.Matches(msg, k.typing.Accept):
			if ok {
				g.c.record(Entry{Kind: EntryNote, Step: s.Index, Note: strings.TrimSpace(g.note.Value())})
				g.flash = "note saved on step " + strconv.Itoa(s.Index)
			}
			g.note.Blur()
			g.mode = modeWork
			return g, nil
		case key.Matches(msg, k.typing.Cancel):
			g.note.Blur()
			g.mode = modeWork
			return g, nil
		}
		var cmd tea.Cmd
		g.note, cmd = g.note.Update(msg)
		return g, cmd
	case modeReadings:
		return g.updateReadings(msg, s, ok)
	case modeVerdict:
		failed := g.verdict != nil && g.verdict.Level == "fail"
		switch {
		case failed && msg.Type == tea.KeyEnter:
			// A failed test is recorded only with y: a second tap of
			// enter must not pass over it.
			g.flash = "the test FAILED: y records it as failed, esc goes back"
			return g, nil
		case key.Matches(msg, k.confirm.Yes):
			if ok && g.verdict != nil {
				g.c.record(Entry{Kind: EntryReading, Step: s.Index, Readings: readingsOf(g.labels, g.values), Verdict: g.verdict.Level})
				g.c.record(Entry{Kind: EntryDone, Step: s.Index})
				g.flash = fmt.Sprintf("step %d recorded: %s", s.Index, strings.ToUpper(g.verdict.Level))
			}
			g.mode, g.verdict = modeWork, nil
		case key.Matches(msg, k.confirm.No):
			if ok && s.Test == plan.TestBalance {
				// The balance has no readings of its own to type again.
				g.mode, g.verdict = modeWork, nil
				return g, nil
			}
			g.mode, g.verdict = modeReadings, nil
			return g, g.focusField(0)
		}
		return g, nil
	case modeConfirmTurns:
		switch {
		case key.Matches(msg, k.confirm.Accept):
			if ok && s.Coil != nil {
				g.complete(s)
			}
			g.mode = modeWork
		case key.Matches(msg, k.confirm.No):
			g.mode = modeWork
		default:
			g.flash = "the count differs from the plan: y records it, esc goes back to counting"
		}
		return g, nil
	case modeConfirmUndo:
		switch {
		case key.Matches(msg, k.confirm.Yes):
			if last := g.c.prog.LastDone(); last >= 0 {
				ls, _ := g.c.step(last)
				g.c.record(Entry{Kind: EntryUndo, Step: ls.Index})
				g.flash = "undone: step " + strconv.Itoa(ls.Index) + " " + ls.Title
			}
			g.mode = modeWork
		case key.Matches(msg, k.confirm.No):
			g.mode = modeWork
		}
		return g, nil
	}

	// modeWork.
	if at, looking := g.lookedAt(); looking {
		if key.Matches(msg, k.guide.More) {
			if g.moreStep != at {
				g.moreStep, g.morePages = at, 0
			}
			g.morePages++
			return g, nil
		}
		var cmd tea.Cmd
		var handled bool
		if g, cmd, handled = g.lookKey(msg, at); handled {
			return g, cmd
		}
	}
	g.looking = false
	if g.entry != "" {
		return g.typedCount(msg, s, ok)
	}
	if key.Matches(msg, k.guide.More) {
		if g.moreStep != cur {
			g.moreStep, g.morePages = cur, 0
		}
		g.morePages++
		return g, nil
	}
	g.flash = "" // a status line says what the last key did, never an older one
	if key.Matches(msg, k.guide.Bell) {
		g.c.bellOff = !g.c.bellOff
		g.flash = "bell at the planned count: on"
		if g.c.bellOff {
			g.flash = "bell at the planned count: off"
		}
		return g, nil
	}
	if ok && isPolarity(s) {
		if pg, cmd, handled := g.polarityKey(msg, s); handled {
			return pg, cmd
		}
	}
	switch {
	case key.Matches(msg, k.guide.Prev):
		return g.lookAt(cur - 1), nil
	case key.Matches(msg, k.guide.Next):
		return g.lookAt(cur + 1), nil
	case key.Matches(msg, k.guide.Undo):
		if g.c.prog.LastDone() >= 0 {
			g.mode = modeConfirmUndo
		} else {
			g.flash = "nothing to undo"
		}
		return g, nil
	case !ok:
		return g, nil
	case key.Matches(msg, k.guide.Note):
		g.note.SetValue(g.c.prog.Steps[cur].Note)
		g.note.CursorEnd()
		g.mode = modeNote
		return g, g.note.Focus()
	}
	if s.Kind == plan.StepCoil && s.Coil != nil {
		n := g.c.prog.Steps[cur].Turns
		switch {
		case key.Matches(msg, k.guide.Count):
			g.setTurns(s, n+1)
		case key.Matches(msg, k.guide.Uncount):
			g.setTurns(s, n-1)
		case key.Matches(msg, k.guide.Digits):
			g.entry, g.flash = msg.String(), ""
		case key.Matches(msg, k.guide.Done):
			if n == s.Coil.Turns {
				g.complete(s)
			} else {
				g.mode = modeConfirmTurns
			}
		}
		return g, nil
	}
	if s.Kind == plan.StepTest {
		switch {
		case g.c.tests[s.Test].Optional && key.Matches(msg, k.guide.Skip):
			return g.skip(s)
		case key.Matches(msg, k.guide.Readings) && s.Test == plan.TestBalance:
			return g.balanceFromResistance(s)
		case key.Matches(msg, k.guide.Readings):
			return g.startReadings(s)
		}
		return g, nil
	}
	if key.Matches(msg, k.guide.Done) {
		g.complete(s)
	}
	return g, nil
}

// typedCount handles a key while a count is typed: digits add to it,
// backspace takes one off, enter applies it, esc drops it (the count
// stands), space still counts a wound turn; anything else waits.
func (g guideModel) typedCount(msg tea.KeyMsg, s plan.Step, ok bool) (guideModel, tea.Cmd) {
	k := g.c.keys
	if !ok || s.Coil == nil {
		g.entry = ""
		return g, nil
	}
	n := g.c.prog.Steps[s.Index-1].Turns
	switch {
	case key.Matches(msg, k.guide.Digits):
		if len(g.entry) < len(strconv.Itoa(maxTurns)) {
			g.entry += msg.String()
		}
	case msg.Type == tea.KeyBackspace:
		g.entry = g.entry[:len(g.entry)-1]
		if g.entry == "" {
			g.flash = fmt.Sprintf("typed count dropped; the count stands at %d", n)
		}
	case key.Matches(msg, k.typing.Accept):
		v, _ := strconv.Atoi(g.entry)
		g.entry = ""
		if most := g.c.prog.MaxTurns(s.Index - 1); v > most {
			g.flash = fmt.Sprintf("%d turns cannot fit: the slot holds at most %d of this wire; the count stands at %d", v, most, n)
			return g, nil
		}
		g.setTurns(s, v)
		g.flash = fmt.Sprintf("count set to %d", v)
	case key.Matches(msg, k.typing.Cancel):
		g.entry = ""
		g.flash = fmt.Sprintf("typed count dropped; the count stands at %d", n)
	case key.Matches(msg, k.guide.Count):
		g.setTurns(s, n+1)
		g.flash = fmt.Sprintf("turn counted: %d; the typed count still waits for enter or esc", n+1)
	default:
		g.flash = "a count is being typed: enter sets it, esc keeps " + strconv.Itoa(n)
	}
	return g, nil
}

// setTurns changes the count of the coil in progress and records it.
func (g *guideModel) setTurns(s plan.Step, n int) {
	flash := ""
	if most := g.c.prog.MaxTurns(s.Index - 1); n > most {
		flash = fmt.Sprintf("%d turns cannot fit: the slot holds at most %d of this wire; the count stays at %d", n, most, most)
		n = most
	}
	g.flash = flash
	n = max(0, n)
	if n == g.c.prog.Steps[s.Index-1].Turns {
		return
	}
	g.c.record(Entry{Kind: EntryTurns, Step: s.Index, Turns: n})
}

// complete records the current step as done.
func (g *guideModel) complete(s plan.Step) {
	e := Entry{Kind: EntryDone, Step: s.Index}
	if s.Coil != nil {
		e.Turns = g.c.prog.Steps[s.Index-1].Turns
		g.flash = fmt.Sprintf("tooth %d wound: %d turns", s.Coil.Tooth, e.Turns)
		if e.Turns != s.Coil.Turns {
			g.flash += fmt.Sprintf(" (plan %d)", s.Coil.Turns)
		}
	} else {
		g.flash = "done: " + s.Title
	}
	g.c.record(e)
}

// startReadings opens the reading fields of a test step.
func (g guideModel) startReadings(s plan.Step) (guideModel, tea.Cmd) {
	t := g.c.tests[s.Test]
	g.labels = fieldsFor(g.c.plan, t)
	g.fields = make([]textinput.Model, len(g.labels))
	for i, f := range g.labels {
		g.fields[i] = newTextInput("", 16) // the label is drawn beside the box (fieldLine)
		g.fields[i].Placeholder = f.unit
		if f.u == plan.UnitOhm && f.expected != nil && f.expected.Value < 1 {
			g.fields[i].Placeholder = "Ω or mΩ" // "285.5m" reads as milliohms (readingValue)
		}
		if f.def != "" {
			// A preset stands as the placeholder, so what is typed replaces
			// it rather than running on after it; an empty field keeps it.
			g.fields[i].Placeholder = f.def + " " + f.unit
		}
		g.fields[i].Width = fieldWidth(g.fields[i]) - 1 // the cursor takes a cell
	}
	if r := g.c.prog.Steps[s.Index-1].Reading; r != nil {
		vals, ok := valuesOf(g.labels, r.Values)
		for i, v := range vals {
			if ok[i] {
				g.fields[i].SetValue(strconv.FormatFloat(v, 'g', -1, 64))
			}
		}
	}
	g.mode, g.inErr = modeReadings, ""
	return g, g.focusField(0)
}

func (g *guideModel) focusField(i int) tea.Cmd {
	if len(g.fields) == 0 {
		return nil
	}
	g.focus = (i%len(g.fields) + len(g.fields)) % len(g.fields)
	for k := range g.fields {
		g.fields[k].Blur()
	}
	return g.fields[g.focus].Focus()
}

// showVerdict judges the readings vals of the test step s and shows the
// verdict, the fields left unfocused.
func (g guideModel) showVerdict(s plan.Step, vals []float64) guideModel {
	v := g.c.judge(g.c.plan, g.c.tests[s.Test], vals)
	g.verdict, g.values, g.inErr = &v, vals, ""
	g.mode = modeVerdict
	for i := range g.fields {
		g.fields[i].Blur()
	}
	return g
}

// updateReadings handles keys while readings are typed.
func (g guideModel) updateReadings(msg tea.KeyMsg, s plan.Step, ok bool) (guideModel, tea.Cmd) {
	k := g.c.keys
	switch {
	case key.Matches(msg, k.typing.Cancel):
		g.mode = modeWork
		return g, nil
	case msg.String() == "shift+tab" || msg.String() == "up":
		return g, g.focusField(g.focus - 1)
	case key.Matches(msg, k.typing.Next):
		return g, g.focusField(g.focus + 1)
	case key.Matches(msg, k.typing.Accept):
		if g.focus < len(g.fields)-1 {
			// Each reading is read as it is left, so a slip is said
			// while the meter still shows it.
			if _, _, err := parseReadings(g.fields[g.focus:g.focus+1], g.labels[g.focus:g.focus+1]); err != "" {
				g.inErr = err
				return g, nil
			}
			g.inErr = ""
			return g, g.focusField(g.focus + 1)
		}
		vals, bad, err := parseReadings(g.fields, g.labels)
		if err != "" {
			g.inErr = err
			return g, g.focusField(bad)
		}
		if !ok {
			g.mode = modeWork
			return g, nil
		}
		return g.showVerdict(s, vals), nil
	}
	if len(g.fields) == 0 {
		return g, nil
	}
	var cmd tea.Cmd
	g.fields[g.focus], cmd = g.fields[g.focus].Update(msg)
	return g, cmd
}

// parseReadings reads every field as a number that is not negative, as
// readingValue takes it; on a bad field it returns its index and why.
func parseReadings(fs []textinput.Model, labels []field) ([]float64, int, string) {
	out := make([]float64, 0, len(fs))
	for i, f := range fs {
		txt := strings.TrimSpace(f.Value())
		fd := field{label: "reading"}
		if i < len(labels) {
			fd = labels[i]
		}
		if txt == "" && fd.def != "" {
			txt = fd.def // an empty field keeps its preset
		}
		if txt == "" && fd.optional {
			out = append(out, 0) // not taken
			continue
		}
		v, err := readingValue(txt, fd)
		if err != "" {
			return nil, i, fd.label + ": " + err
		}
		out = append(out, v)
	}
	return out, 0, ""
}

// shortHelp lists the keys that matter now, for the help line.
func (g guideModel) shortHelp() []key.Binding {
	k := g.c.keys
	switch g.mode {
	case modeNote:
		return []key.Binding{k.typing.Accept, k.typing.Cancel}
	case modeReadings:
		return []key.Binding{k.typing.Accept, k.typing.Next, k.typing.Cancel}
	case modeVerdict:
		yes, no := withHelp(k.confirm.Yes, "record and go on"), withHelp(k.confirm.No, "type again")
		if g.verdict != nil && g.verdict.Level == "fail" {
			yes = withHelp(k.confirm.Accept, "record as failed")
		}
		if s, ok := g.c.step(g.c.prog.Current()); ok && s.Test == plan.TestBalance {
			no = withHelp(k.confirm.No, "back")
		}
		return []key.Binding{yes, no}
	case modeConfirmTurns:
		return []key.Binding{withHelp(k.confirm.Accept, "record this count"), withHelp(k.confirm.No, "back to counting")}
	case modeConfirmUndo:
		return []key.Binding{withHelp(k.confirm.Yes, "undo it"), withHelp(k.confirm.No, "keep it")}
	}
	if g.entry != "" {
		return []key.Binding{withHelp(k.typing.Accept, "set the count"), withHelp(k.typing.Cancel, "keep "+strconv.Itoa(g.c.prog.Steps[g.c.prog.Current()].Turns)),
			withHelp(k.guide.Uncount, "delete a digit"), k.guide.Count}
	}
	if _, looking := g.lookedAt(); looking {
		back := k.guide.Back
		back.SetHelp("esc", "back to "+strings.TrimSuffix(g.backTo(), " in hand"))
		return []key.Binding{back, k.guide.Look, k.global.Overview, k.global.Help, k.global.Quit}
	}
	s, ok := g.c.step(g.c.prog.Current())
	var out []key.Binding
	switch {
	case !ok:
	case s.Kind == plan.StepCoil:
		out = append(out, k.guide.Count, withHelp(k.guide.Done, "coil done"), k.guide.Uncount, k.guide.Digits)
	case isPolarity(s):
		out = append(out, g.polarityShortHelp()...)
	case s.Kind == plan.StepTest && s.Test == plan.TestBalance:
		out = append(out, withHelp(k.guide.Readings, "judge the resistance readings"))
	case s.Kind == plan.StepTest && g.c.tests[s.Test].Optional:
		out = append(out, k.guide.Readings, k.guide.Skip)
	case s.Kind == plan.StepTest:
		out = append(out, k.guide.Readings)
	default:
		out = append(out, withHelp(k.guide.Done, "confirm done"))
	}
	// The look keys come early: the line is cut at the right on narrow
	// terminals, and the help screen lists every key anyway.
	out = append(out, withHelp(k.guide.Look, "look"))
	if ok && !isPolarity(s) { // n reads north there
		out = append(out, k.guide.Note)
	}
	return append(out, k.guide.Undo, k.global.Overview, k.global.Help, k.global.Quit)
}

func withHelp(b key.Binding, desc string) key.Binding {
	b.SetHelp(b.Help().Key, desc)
	return b
}

// view renders the guide body in w x h cells: the ring beside the step
// panel when both fit with the panel wide enough for the coil picture, else
// the developed strip above it while the panel still keeps its live parts,
// else the panel alone.
func (g guideModel) view(w, h int) string {
	c := g.c
	teeth := c.teeth
	shown := g.shown()
	mk := marks{wound: c.prog.ToothWound(len(teeth)), current: c.currentTooth()}
	at, looking := g.lookedAt()
	if looking {
		mk.viewed = c.toothOf(at)
	}
	mk.from, mk.next = c.fromNext(shown)
	if len(teeth) == 0 {
		pl, _ := g.panel(w, h)
		return joinLines(pl)
	}
	if rg := c.ring(max(0, w-panelWide-3), max(0, h-3)); rg != nil {
		d := renderRing(c.st, *rg, teeth, mk, c.ringCaption(shown))
		left := c.st.drawing.Render(strings.Join(d.lines, "\n"))
		lw := d.width + 2
		for _, leg := range legend(lw, looking) {
			left += "\n" + c.st.dim.Render(leg)
		}
		pl, _ := g.panel(max(0, w-lw-1), h)
		return joinColumns(left, joinLines(pl), 1)
	}
	d := renderStrip(c.st, teeth, mk, w)
	top := d.lines
	for _, leg := range legend(w, looking) {
		top = append(top, c.st.dim.Render(leg))
	}
	if pl, ok := g.panel(w, max(0, h-len(top))); ok && len(top) < h {
		return joinLines(append(top, pl...))
	}
	pl, _ := g.panel(w, h) // the step matters more than the drawing
	return joinLines(pl)
}

// panelWide is the panel width that keeps the coil picture beside its words.
const panelWide = 62
