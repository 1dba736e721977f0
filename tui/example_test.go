package tui_test

import (
	"fmt"
	"strings"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/x/ansi"

	"coilwright/tui"
	"coilwright/winding/job"
	"coilwright/winding/plan"
)

// New builds the guide from a plan; it is a tea.Model, driven here by hand
// as the program loop would drive it. Progress goes nowhere (no Recorder).
func ExampleNew() {
	p, err := plan.Build(job.Demo())
	if err != nil {
		fmt.Println(err)
		return
	}
	var m tea.Model = tui.New(tui.Options{Plan: p})
	m, _ = m.Update(tea.WindowSizeMsg{Width: 100, Height: 30})
	for i := 0; i < 4; i++ { // confirm the set-up and the three preparation steps
		m, _ = m.Update(tea.KeyMsg{Type: tea.KeyEnter})
	}
	for _, line := range strings.Split(ansi.Strip(m.View()), "\n") {
		line = strings.Trim(line, "| ")
		if strings.HasPrefix(line, "coil 1 of 24") {
			fmt.Println(line)
		}
		if i := strings.Index(line, "down slot"); i >= 0 {
			fmt.Println(line[i:])
		}
	}
	// Output:
	// coil 1 of 24                                                                        step 5 of 79
	// down slot 1, up slot 24
}
