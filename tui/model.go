package tui

import (
	"fmt"
	"io"
	"strings"
	"time"

	"github.com/charmbracelet/bubbles/help"
	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/x/ansi"

	"coilwright/winding/plan"
	"coilwright/winding/progress"
)

// screen is the screen shown.
type screen int

const (
	screenGuide screen = iota
	screenOverview
	screenHelp
)

func (s screen) String() string {
	switch s {
	case screenGuide:
		return "guide"
	case screenOverview:
		return "overview"
	case screenHelp:
		return "help"
	}
	return "unknown"
}

// Options configure a guide.
type Options struct {
	Plan     *plan.Plan
	Recorder Recorder // where progress goes; nil keeps it in memory only
	History  []Entry  // the record so far, folded against the plan to resume
	Notice   string   // shown at start (e.g. a torn last line)
	Where    string   // where progress is kept, in words, for the help screen
	Judge    Judge    // verdicts of test readings; nil uses VerifyJudge
	Now      func() time.Time
	// Bell is where the terminal bell is rung when a count reaches the plan
	// (the terminal's output); nil rings no bell.
	Bell io.Writer
	// WriteGap is the shortest time between the starts of two writes to the
	// record (BurstGap in the bench command); 0 writes each key at once.
	WriteGap time.Duration
}

// Model is the bench guide, a tea.Model.
type Model struct {
	c        *shared
	screen   screen
	guide    guideModel
	overview overviewModel
	help     helpModel
	keyHelp  help.Model
	notice   string   // the status line until the next key
	banner   []string // what the resume needs said, above the guide until a key
	// fileBanner is what the record file needed (written again after it was
	// removed or replaced under the guide): it stays above the guide until
	// the step in hand changes, so a winder counting with the space bar
	// cannot miss it; the help screen keeps it after that.
	fileBanner     []string
	fileBannerStep int
	quitting       bool
	stopped        bool // a signal asked the guide to stop
	ignored        int  // history entries that did not fit the plan
}

// New builds the guide and replays the history so it resumes where the work
// stopped.
func New(o Options) *Model {
	c := &shared{
		st:    newStyles(),
		keys:  newKeyMaps(),
		plan:  o.Plan,
		where: o.Where,
		judge: o.Judge,
		now:   o.Now,
		bell:  o.Bell,
		out:   &writer{rec: o.Recorder, gap: max(0, o.WriteGap), clock: time.Now},
		rings: map[ringKey]*ringGeometry{},
		tests: map[string]plan.Test{},
	}
	if c.judge == nil {
		c.judge = VerifyJudge
	}
	if c.now == nil {
		c.now = time.Now
	}
	if o.Plan != nil {
		c.teeth = teethOf(o.Plan.Layout)
		for _, t := range o.Plan.Tests {
			// a test worked out from another's readings (the balance from
			// the resistance test's) shows and records those readings
			t.Readings = o.Plan.ReadingsFor(t)
			c.tests[t.Name] = t
		}
		for _, s := range o.Plan.Steps {
			if s.Kind == plan.StepCoil {
				c.coils++
			}
		}
	}
	c.prog = progress.Fold(o.Plan, o.History)
	m := &Model{c: c, keyHelp: newHelpView(), ignored: len(c.prog.Dropped)}
	if o.Notice != "" {
		m.banner = append(m.banner, o.Notice)
	}
	m.banner = append(m.banner, c.prog.Summary()...)
	if r := resumeNotice(c); r != "" {
		m.banner = append(m.banner, r)
	}
	c.said = append(c.said, m.banner...)
	m.guide = newGuide(c)
	m.overview = newOverview(c)
	m.help = newHelp(c)
	return m
}

// Init starts nothing: the guide waits for keys and the window size.
func (m *Model) Init() tea.Cmd { return nil }

// Update handles a message; all writing happens in the commands it returns.
func (m *Model) Update(msg tea.Msg) (tea.Model, tea.Cmd) {
	var cmd tea.Cmd
	switch msg := msg.(type) {
	case tea.WindowSizeMsg:
		m.c.width, m.c.height, m.c.sized = max(0, msg.Width), max(0, msg.Height), true
		m.keyHelp.Width = m.c.width
		m.guide = m.guide.resize()
		bw, bh := m.bodySize()
		m.overview = m.overview.open(bw, bh)
		m.help = m.help.open(bw, bh)
	case savedMsg:
		if len(msg.notices) > 0 {
			m.fileBanner = append(m.fileBanner, msg.notices...)
			m.fileBannerStep = m.c.prog.Current()
		}
		m.c.said = append(m.c.said, msg.notices...)
		cmd = m.c.out.saved(msg)
		if m.quitting && m.c.out.settled() {
			return m, tea.Quit
		}
	case retryMsg:
		cmd = m.c.out.retry()
	case gatherMsg:
		cmd = m.c.out.gather()
	case stopMsg:
		m.quitting, m.stopped = true, true
		if m.c.out.settled() || m.c.out.err != nil {
			return m, tea.Quit // what waits is written by Run, or kept in the error
		}
	case tea.KeyMsg:
		n, step, ok := m.c.countNow()
		cmd = tea.Batch(m.key(msg), m.c.bellAfter(n, step, ok))
		if len(m.fileBanner) > 0 && m.c.prog.Current() != m.fileBannerStep {
			m.fileBanner = nil
		}
		if m.quitting && m.c.out.settled() {
			return m, tea.Quit
		}
	}
	return m, tea.Batch(cmd, m.c.out.kick())
}

// key routes a key: global keys first unless text is being typed, then the
// screen in front.
func (m *Model) key(msg tea.KeyMsg) tea.Cmd {
	k := m.c.keys.global
	if key.Matches(msg, k.ForceQuit) {
		m.quitting = true
		return tea.Quit
	}
	if m.c.tooSmall() {
		// Nothing on screen says what a key would do: only quitting works.
		if key.Matches(msg, k.Quit) && !m.guide.typing() {
			m.quitting = true
		}
		return nil
	}
	m.notice, m.banner = "", nil
	if m.screen == screenGuide && m.guide.typing() {
		var cmd tea.Cmd
		m.guide, cmd = m.guide.update(msg)
		return cmd
	}
	bw, bh := m.bodySize()
	switch {
	case key.Matches(msg, k.Quit):
		m.quitting = true
		return nil
	case m.screen != screenHelp && key.Matches(msg, k.Help):
		m.help = m.help.open(bw, bh)
		m.screen = screenHelp
		return nil
	case m.screen == screenGuide && key.Matches(msg, k.Overview):
		m.overview = m.overview.from(m.guide.shown()).open(bw, bh)
		m.screen = screenOverview
		return nil
	case m.screen == screenOverview && key.Matches(msg, m.c.keys.scroll.Pick):
		m.guide = m.guide.lookAt(m.overview.sel)
		m.screen = screenGuide
		return nil
	case m.screen != screenGuide && key.Matches(msg, m.c.keys.scroll.Back):
		m.screen = screenGuide
		return nil
	}
	var cmd tea.Cmd
	switch m.screen {
	case screenGuide:
		m.guide, cmd = m.guide.update(msg)
	case screenOverview:
		m.overview, cmd = m.overview.update(msg)
	case screenHelp:
		m.help, cmd = m.help.update(msg)
	}
	return cmd
}

// bodySize is the space between the header and the status and help lines.
func (m *Model) bodySize() (int, int) {
	return m.c.width, max(0, m.c.height-3)
}

// View renders the screen in front.
func (m *Model) View() string {
	c := m.c
	if c.tooSmall() {
		return m.smallView()
	}
	bw, bh := m.bodySize()
	top := m.bannerLines(bw, bh/3)
	bh -= len(top)
	var body string
	switch m.screen {
	case screenOverview:
		body = m.overview.view()
	case screenHelp:
		body = m.help.view()
	default:
		body = m.guide.view(bw, bh)
	}
	body = fit(body, bw, bh)
	if len(top) > 0 {
		body = strings.Join(top, "\n") + "\n" + body
		bh += len(top)
	}
	if n := strings.Count(body, "\n") + 1; n < bh {
		body += strings.Repeat("\n", bh-n)
	}
	return fit(m.header()+"\n"+body+"\n"+m.status()+"\n"+m.helpLine(), c.width, c.height)
}

// bannerLines is what the record file and the resume need said, wrapped
// to the width and cut to at most h lines (the last says so): the resume's
// until the next key, the record file's until the step in hand changes.
func (m *Model) bannerLines(w, h int) []string {
	if len(m.banner)+len(m.fileBanner) == 0 || h < 1 {
		return nil
	}
	var out []string
	for _, b := range append(append([]string(nil), m.fileBanner...), m.banner...) {
		out = append(out, wrapPlain(b, w)...)
	}
	if len(out) > h {
		out = append(out[:h-1], "... (more on the help screen, ?)")
	}
	for i, l := range out {
		out[i] = m.c.st.notice.Render(fit(l, w, 1))
	}
	return out
}

// header is the top line: program, job, winding, and where the work stands.
func (m *Model) header() string {
	c := m.c
	right := fmt.Sprintf("coils %d/%d  steps %d/%d", c.prog.CoilsDone(), c.coils, c.prog.DoneCount(), len(c.steps()))
	if m.screen != screenGuide {
		right = m.screen.String() + "  " + right
	}
	title := "coilwright bench"
	rest := " | " + c.planName()
	if spec := c.specText(); spec != "" {
		rest += " | " + spec
	}
	room := max(0, c.width-len(right)-2-len(title)) // two spaces before the counts
	if spec := c.specText(); lipglossWidth(rest) > room && spec != "" {
		// The spec (an inner rotor where the name says outer, say) is kept
		// whole and the name cut, while a readable part of the name is left.
		if nameRoom := room - len(" | ") - lipglossWidth(" | "+spec); nameRoom >= 12 {
			rest = " | " + ansi.Truncate(c.planName(), nameRoom, "...") + " | " + spec
		} else if lipglossWidth(" | "+spec) <= room {
			rest = " | " + spec
		} else {
			rest = " | " + c.planName()
		}
	}
	if lipglossWidth(rest) > room {
		rest = ansi.Truncate(rest, room, "...")
	}
	left := c.st.title.Render(title) + c.st.dim.Render(rest)
	gap := c.width - lipglossWidth(left) - len(right)
	if gap < 1 {
		return fit(left, c.width, 1)
	}
	return left + strings.Repeat(" ", gap) + c.st.strong.Render(right)
}

// status is the line above the key help: a write error first, then a
// notice, then the last action.
func (m *Model) status() string {
	c := m.c
	w := c.out
	switch {
	case w.err != nil:
		s := fmt.Sprintf("NOT SAVED (%d changes kept in memory, retrying): %v", w.pending(), w.err)
		if m.quitting {
			s += " | ctrl+c quits and loses them"
		}
		return c.st.errorBar.Render(fit(s, c.width, 1))
	case m.quitting:
		return c.st.notice.Render("saving before quitting...")
	case m.notice != "":
		return c.st.notice.Render(fit(m.notice, c.width, 1))
	case m.screen == screenGuide && m.guide.flash != "":
		return c.st.ok.Render(fit(m.guide.flash, c.width, 1))
	}
	return ""
}

// helpLine is the short key help of the screen in front.
func (m *Model) helpLine() string {
	k := m.c.keys
	var b []key.Binding
	switch m.screen {
	case screenGuide:
		b = m.guide.shortHelp()
	case screenOverview:
		b = []key.Binding{k.scroll.Choose, k.scroll.Pick, k.scroll.Back, k.global.Quit}
	default:
		b = []key.Binding{k.scroll.Up, k.scroll.Down, k.scroll.PageDown, k.global.Quit}
	}
	return m.keyLine(b)
}

// keyLine renders the key help in the width, always ending with the help and
// quit keys: the keys before them are dropped from the end until it fits.
func (m *Model) keyLine(b []key.Binding) string {
	k := m.c.keys.global
	var head []key.Binding
	for _, x := range b {
		if x.Help().Key != k.Help.Help().Key && x.Help().Key != k.Quit.Help().Key {
			head = append(head, x)
		}
	}
	tail := []key.Binding{k.Help, k.Quit}
	if m.screen == screenGuide && m.guide.typing() {
		// Keys go to the field while typing: esc first.
		tail = []key.Binding{withHelp(k.Help, "help after esc"), withHelp(k.Quit, "quit after esc")}
	}
	if m.screen == screenHelp {
		// ? closes the help screen, as esc does: said first, so it is kept.
		back := k.Help
		back.SetHelp("?/esc", "back to the guide")
		head = append([]key.Binding{back}, head...)
		tail = tail[1:]
	}
	h := m.keyHelp
	h.Width = 0 // measured here, never cut with an ellipsis
	for {
		line := h.ShortHelpView(append(append([]key.Binding{}, head...), tail...))
		if ansi.StringWidth(line) <= m.c.width || len(head) == 0 {
			return fit(line, m.c.width, 1)
		}
		head = head[:len(head)-1]
	}
}

// smallView asks for a larger terminal; it fits any size, even 0x0.
func (m *Model) smallView() string {
	c := m.c
	if !c.sized {
		return fmt.Sprintf("coilwright bench: waiting for the terminal size...\nIt needs at least %dx%d; enlarge the terminal if this stays.", minWidth, minHeight)
	}
	msg := fmt.Sprintf("Terminal too small: %dx%d.\nEnlarge it to at least %dx%d.\nYour progress is safe; keys do nothing here (q quits).", c.width, c.height, minWidth, minHeight)
	if c.out.err != nil {
		msg += "\nNOT SAVED: retrying."
	}
	lines := strings.Split(msg, "\n")
	out := make([]string, 0, len(lines))
	for _, l := range lines {
		out = append(out, wrapPlain(l, c.width)...)
	}
	return fit(strings.Join(out, "\n"), c.width, c.height)
}

// newHelpView is a bubbles/help model with plain ASCII separators (the
// default bullet and ellipsis are of ambiguous width on some terminals).
func newHelpView() help.Model {
	h := help.New()
	h.ShortSeparator = " | "
	h.FullSeparator = "   "
	h.Ellipsis = "..."
	return h
}
