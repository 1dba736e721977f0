package winding

import (
	"strconv"
	"strings"
)

// NumberList writes teeth, slots or path counts the way a sheet lists them:
// "3, 4, 9, 10". Every report of the program uses it, so lists read alike.
func NumberList(ns []int) string {
	s := make([]string, len(ns))
	for i, n := range ns {
		s[i] = strconv.Itoa(n)
	}
	return strings.Join(s, ", ")
}
