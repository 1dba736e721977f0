package journal_test

import (
	"fmt"

	"coilwright/winding/journal"
)

func ExampleReplay() {
	events := []journal.Event{
		{Seq: 1, Kind: journal.Done, Step: 1},
		{Seq: 2, Kind: journal.Turns, Step: 2, Tooth: 1, Turns: 9},
		{Seq: 3, Kind: journal.Done, Step: 2, Tooth: 1, Turns: 24},
		{Seq: 4, Kind: journal.Turns, Step: 3, Tooth: 4, Turns: 15},
	}
	st := journal.Replay(events)
	fmt.Println("done:", st.Done)
	fmt.Println("current step:", st.Current(30))
	fmt.Println("turns so far:", st.InProgress[st.Current(30)])
	fmt.Println("tooth 1 has", st.CoilTurns[1], "turns")
	// Output:
	// done: [1 2]
	// current step: 3
	// turns so far: 15
	// tooth 1 has 24 turns
}

func ExampleDecode() {
	record := []byte(`{"seq":1,"time":"2025-03-08T09:00:00Z","kind":"done","step":1}
{"seq":2,"time":"2025-03-08T09:01:00Z","kind":"do`)
	events, torn, err := journal.Decode(record)
	fmt.Println(len(events), err)
	fmt.Println("torn:", torn.Line, torn.Offset, torn.Bytes)
	// Output:
	// 1 <nil>
	// torn: 2 63 49
}
