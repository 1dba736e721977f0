package tui

import "github.com/charmbracelet/bubbles/key"

// globalKeys work on every screen while nothing is being typed.
type globalKeys struct {
	Help, Overview, Quit, ForceQuit key.Binding
}

// guideKeys are the keys of the guide screen. Prev and Next move a look at
// another step without changing progress; Look only shows them as one pair on
// the help line; Back ends the look.
type guideKeys struct {
	Count, Uncount, Digits, Done, Note, Undo, Readings key.Binding
	Prev, Next, Look, Back, More, Bell, Skip           key.Binding
}

// typingKeys work while a note or a reading is being typed.
type typingKeys struct {
	Accept, Next, Cancel key.Binding
}

// confirmKeys answer a question (turns differ from the plan, undo).
type confirmKeys struct {
	Yes, No key.Binding
	// Accept is yes by y alone: a count off the plan is never recorded by
	// enter, so a double tap cannot accept it.
	Accept key.Binding
}

// scrollKeys move through the overview and help screens; Pick opens the
// step highlighted on the overview in the guide, to look at.
type scrollKeys struct {
	Up, Down, PageUp, PageDown, Back, Pick key.Binding
	Choose                                 key.Binding // up and down as one pair on the overview's help line
}

// keyMaps holds every key binding, built once.
type keyMaps struct {
	global  globalKeys
	guide   guideKeys
	typing  typingKeys
	confirm confirmKeys
	scroll  scrollKeys

	polarity polarityKeys
}

func newKeyMaps() *keyMaps {
	return &keyMaps{
		global: globalKeys{
			Help:      key.NewBinding(key.WithKeys("?"), key.WithHelp("?", "help")),
			Overview:  key.NewBinding(key.WithKeys("o", "tab"), key.WithHelp("o", "all steps")),
			Quit:      key.NewBinding(key.WithKeys("q"), key.WithHelp("q", "quit")),
			ForceQuit: key.NewBinding(key.WithKeys("ctrl+c"), key.WithHelp("ctrl+c", "quit at once")),
		},
		guide: guideKeys{
			Count:    key.NewBinding(key.WithKeys(" "), key.WithHelp("space", "+1 turn")),
			Uncount:  key.NewBinding(key.WithKeys("backspace", "-"), key.WithHelp("bksp", "-1 turn")),
			Digits:   key.NewBinding(key.WithKeys("0", "1", "2", "3", "4", "5", "6", "7", "8", "9"), key.WithHelp("0-9", "type a count")),
			Done:     key.NewBinding(key.WithKeys("enter"), key.WithHelp("enter", "step done")),
			Note:     key.NewBinding(key.WithKeys("n"), key.WithHelp("n", "note")),
			Undo:     key.NewBinding(key.WithKeys("u"), key.WithHelp("u", "undo last step")),
			Readings: key.NewBinding(key.WithKeys("enter"), key.WithHelp("enter", "type readings")),
			Prev:     key.NewBinding(key.WithKeys("left", "["), key.WithHelp("left/[", "look at the step before")),
			Next:     key.NewBinding(key.WithKeys("right", "]"), key.WithHelp("right/]", "look at the step after")),
			Look:     key.NewBinding(key.WithKeys("left", "right", "[", "]"), key.WithHelp("[/]", "look back/ahead")),
			Back:     key.NewBinding(key.WithKeys("esc", "home", "enter"), key.WithHelp("esc/home", "back to the step in hand")),
			More:     key.NewBinding(key.WithKeys("m"), key.WithHelp("m", "more of the panel")),
			Bell:     key.NewBinding(key.WithKeys("b"), key.WithHelp("b", "bell on/off")),
			Skip:     key.NewBinding(key.WithKeys("s"), key.WithHelp("s", "skip this optional test")),
		},
		typing: typingKeys{
			Accept: key.NewBinding(key.WithKeys("enter"), key.WithHelp("enter", "accept")),
			Next:   key.NewBinding(key.WithKeys("tab", "down"), key.WithHelp("tab", "next field")),
			Cancel: key.NewBinding(key.WithKeys("esc"), key.WithHelp("esc", "cancel")),
		},
		confirm: confirmKeys{
			Yes:    key.NewBinding(key.WithKeys("enter", "y"), key.WithHelp("enter/y", "yes")),
			No:     key.NewBinding(key.WithKeys("esc", "n"), key.WithHelp("esc/n", "no, go back")),
			Accept: key.NewBinding(key.WithKeys("y"), key.WithHelp("y", "yes")),
		},
		polarity: newPolarityKeys(),
		scroll: scrollKeys{
			Up:       key.NewBinding(key.WithKeys("up", "k"), key.WithHelp("up", "scroll up")),
			Down:     key.NewBinding(key.WithKeys("down", "j"), key.WithHelp("down", "scroll down")),
			PageUp:   key.NewBinding(key.WithKeys("pgup", "b"), key.WithHelp("pgup", "page up")),
			PageDown: key.NewBinding(key.WithKeys("pgdown", "f"), key.WithHelp("pgdn", "page down")),
			Back:     key.NewBinding(key.WithKeys("esc", "o", "tab", "?"), key.WithHelp("esc", "back to the guide")),
			Pick:     key.NewBinding(key.WithKeys("enter"), key.WithHelp("enter", "look at this step")),
			Choose:   key.NewBinding(key.WithKeys("up", "down", "k", "j"), key.WithHelp("up/down", "choose a step")),
		},
	}
}

// fullHelp lists every group of keys for the help screen.
func (k *keyMaps) fullHelp() [][]key.Binding {
	return [][]key.Binding{
		{k.guide.Count, k.guide.Uncount, k.guide.Digits, k.guide.Done},
		{k.guide.Note, k.guide.Undo, k.global.Overview, k.global.Help},
		{k.guide.Prev, k.guide.Next, k.guide.Back, withHelp(k.scroll.Pick, "on all steps: look at it"), k.guide.More},
		{k.typing.Accept, k.typing.Next, k.typing.Cancel},
		{withHelp(k.polarity.North, "polarity: north"), withHelp(k.polarity.South, "polarity: south"), withHelp(k.polarity.Unsure, "polarity: unsure"), k.polarity.Reread},
		{k.global.Quit, k.global.ForceQuit, k.scroll.Up, k.scroll.Down, k.guide.Bell, k.guide.Skip},
	}
}
