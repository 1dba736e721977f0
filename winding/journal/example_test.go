package journal_test

import (
	"fmt"

	"coilwright/winding/journal"
)

func ExampleClean() {
	fmt.Printf("%q\n", journal.Clean("sleeved\x1b]0;pwned\x07 at slot 12\r\n"))
	// Output:
	// "sleeved]0;pwned at slot 12  "
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
