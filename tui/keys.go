package tui

import "github.com/charmbracelet/bubbles/key"

// globalKeys work on every screen while nothing is being typed.
type globalKeys struct {
	Help, Overview, Quit, ForceQuit key.Binding
}

// guideKeys are the keys of the guide screen.
type guideKeys struct {
	Count, Uncount, Digits, Done, Note, Undo, Readings key.Binding
}

// typingKeys work while a note or a reading is being typed.
type typingKeys struct {
	Accept, Next, Cancel key.Binding
}

// confirmKeys answer a question (turns differ from the plan, undo).
type confirmKeys struct {
	Yes, No key.Binding
}

// scrollKeys move through the overview and help screens.
type scrollKeys struct {
	Up, Down, PageUp, PageDown, Back key.Binding
}

// keyMaps holds every key binding, built once.
type keyMaps struct {
	global  globalKeys
	guide   guideKeys
	typing  typingKeys
	confirm confirmKeys
	scroll  scrollKeys
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
			Digits:   key.NewBinding(key.WithKeys("0", "1", "2", "3", "4", "5", "6", "7", "8", "9"), key.WithHelp("0-9", "type the count")),
			Done:     key.NewBinding(key.WithKeys("enter"), key.WithHelp("enter", "step done")),
			Note:     key.NewBinding(key.WithKeys("n"), key.WithHelp("n", "note")),
			Undo:     key.NewBinding(key.WithKeys("u"), key.WithHelp("u", "undo last step")),
			Readings: key.NewBinding(key.WithKeys("enter"), key.WithHelp("enter", "type readings")),
		},
		typing: typingKeys{
			Accept: key.NewBinding(key.WithKeys("enter"), key.WithHelp("enter", "accept")),
			Next:   key.NewBinding(key.WithKeys("tab", "down"), key.WithHelp("tab", "next field")),
			Cancel: key.NewBinding(key.WithKeys("esc"), key.WithHelp("esc", "cancel")),
		},
		confirm: confirmKeys{
			Yes: key.NewBinding(key.WithKeys("enter", "y"), key.WithHelp("enter/y", "yes")),
			No:  key.NewBinding(key.WithKeys("esc", "n"), key.WithHelp("esc/n", "no, go back")),
		},
		scroll: scrollKeys{
			Up:       key.NewBinding(key.WithKeys("up", "k"), key.WithHelp("up", "scroll up")),
			Down:     key.NewBinding(key.WithKeys("down", "j"), key.WithHelp("down", "scroll down")),
			PageUp:   key.NewBinding(key.WithKeys("pgup", "b"), key.WithHelp("pgup", "page up")),
			PageDown: key.NewBinding(key.WithKeys("pgdown", "f"), key.WithHelp("pgdn", "page down")),
			Back:     key.NewBinding(key.WithKeys("esc", "o", "tab", "?"), key.WithHelp("esc", "back to the guide")),
		},
	}
}

// fullHelp lists every group of keys for the help screen.
func (k *keyMaps) fullHelp() [][]key.Binding {
	return [][]key.Binding{
		{k.guide.Count, k.guide.Uncount, k.guide.Digits, k.guide.Done},
		{k.guide.Note, k.guide.Undo, k.global.Overview, k.global.Help},
		{k.typing.Accept, k.typing.Next, k.typing.Cancel},
		{k.global.Quit, k.global.ForceQuit, k.scroll.Up, k.scroll.Down},
	}
}
