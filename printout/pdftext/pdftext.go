package pdftext

import (
	"bytes"
	"compress/zlib"
	"fmt"
	"io"
	"regexp"
	"strconv"
	"unicode/utf16"
)

var (
	streamRe = regexp.MustCompile(`(?s)<<([^>]*(?:>[^>][^>]*)*)>>\s*stream\r?\n`)
	lengthRe = regexp.MustCompile(`/Length (\d+)`)
)

type pdfStream struct {
	dict string
	data []byte
}

func pdfStreams(pdf []byte) ([]pdfStream, error) {
	var out []pdfStream
	for _, m := range streamRe.FindAllSubmatchIndex(pdf, -1) {
		dict := string(pdf[m[2]:m[3]])
		lm := lengthRe.FindStringSubmatch(dict)
		if lm == nil {
			return nil, fmt.Errorf("pdftext: stream without /Length at %d", m[0])
		}
		n, _ := strconv.Atoi(lm[1])
		start := m[1]
		if start+n > len(pdf) {
			return nil, fmt.Errorf("pdftext: stream at %d runs past the end", m[0])
		}
		data := pdf[start : start+n]
		if bytes.Contains([]byte(dict), []byte("/FlateDecode")) {
			zr, err := zlib.NewReader(bytes.NewReader(data))
			if err != nil {
				return nil, fmt.Errorf("pdftext: inflate stream at %d: %v", m[0], err)
			}
			data, err = io.ReadAll(zr)
			if err != nil {
				return nil, fmt.Errorf("pdftext: inflate stream at %d: %v", m[0], err)
			}
		}
		out = append(out, pdfStream{dict, data})
	}
	return out, nil
}

// cmap maps two-byte codes to text, from bfrange and bfchar sections.
type cmap struct {
	ranges []struct{ lo, hi, dst uint16 }
	chars  map[uint16]uint16
}

var (
	bfrangeRe = regexp.MustCompile(`<([0-9A-Fa-f]{4})>\s*<([0-9A-Fa-f]{4})>\s*<([0-9A-Fa-f]{4})>`)
	bfcharRe  = regexp.MustCompile(`(?s)beginbfchar(.*?)endbfchar`)
	pairRe    = regexp.MustCompile(`<([0-9A-Fa-f]{4})>\s*<([0-9A-Fa-f]{4})>`)
)

func parseCMap(s []byte) *cmap {
	cm := &cmap{chars: map[uint16]uint16{}}
	hex := func(b []byte) uint16 { v, _ := strconv.ParseUint(string(b), 16, 16); return uint16(v) }
	for _, sec := range regexp.MustCompile(`(?s)beginbfrange(.*?)endbfrange`).FindAllSubmatch(s, -1) {
		for _, m := range bfrangeRe.FindAllSubmatch(sec[1], -1) {
			cm.ranges = append(cm.ranges, struct{ lo, hi, dst uint16 }{hex(m[1]), hex(m[2]), hex(m[3])})
		}
	}
	for _, sec := range bfcharRe.FindAllSubmatch(s, -1) {
		for _, m := range pairRe.FindAllSubmatch(sec[1], -1) {
			cm.chars[hex(m[1])] = hex(m[2])
		}
	}
	return cm
}

func (cm *cmap) lookup(code uint16) (uint16, bool) {
	if v, ok := cm.chars[code]; ok {
		return v, true
	}
	for _, r := range cm.ranges {
		if code >= r.lo && code <= r.hi {
			return r.dst + (code - r.lo), true
		}
	}
	return 0, false
}

// unescape reads a PDF literal string body.
func unescape(s []byte) []byte {
	var out []byte
	for i := 0; i < len(s); i++ {
		c := s[i]
		if c != '\\' || i+1 == len(s) {
			out = append(out, c)
			continue
		}
		i++
		switch s[i] {
		case 'n':
			out = append(out, '\n')
		case 'r':
			out = append(out, '\r')
		case 't':
			out = append(out, '\t')
		case 'b':
			out = append(out, '\b')
		case 'f':
			out = append(out, '\f')
		default:
			if s[i] >= '0' && s[i] <= '7' {
				n := 0
				j := i
				for ; j < len(s) && j < i+3 && s[j] >= '0' && s[j] <= '7'; j++ {
					n = n*8 + int(s[j]-'0')
				}
				out = append(out, byte(n))
				i = j - 1
			} else {
				out = append(out, s[i])
			}
		}
	}
	return out
}

// tjRun is the raw string of one Tj with the text state it was shown in.
type tjRun struct {
	raw  []byte
	size float64 // points, from the last Tf
	x, y float64 // from the Td of its text object, in PDF points
}

var (
	tfRe = regexp.MustCompile(`/\S+ ([0-9.]+) Tf`)
	tdRe = regexp.MustCompile(`(-?[0-9.]+) (-?[0-9.]+) Td`)
)

// tjStrings finds the literal string operands of Tj in a content stream,
// each with the font size last set by Tf and the position last set by Td
// before it.
func tjStrings(content []byte) []tjRun {
	tfs := tfRe.FindAllSubmatchIndex(content, -1)
	tds := tdRe.FindAllSubmatchIndex(content, -1)
	num := func(m []int, k int) float64 {
		v, _ := strconv.ParseFloat(string(content[m[2*k]:m[2*k+1]]), 64)
		return v
	}
	var out []tjRun
	size, x, y := 0.0, 0.0, 0.0
	for i := 0; i < len(content); i++ {
		if content[i] != '(' {
			continue
		}
		for len(tfs) > 0 && tfs[0][0] < i {
			size = num(tfs[0], 1)
			tfs = tfs[1:]
		}
		for len(tds) > 0 && tds[0][0] < i {
			x, y = num(tds[0], 1), num(tds[0], 2)
			tds = tds[1:]
		}
		depth := 1
		j := i + 1
		for ; j < len(content) && depth > 0; j++ {
			switch content[j] {
			case '\\':
				j++
			case '(':
				depth++
			case ')':
				depth--
			}
		}
		rest := bytes.TrimLeft(content[j:], " ")
		if bytes.HasPrefix(rest, []byte("Tj")) {
			out = append(out, tjRun{raw: unescape(content[i+1 : j-1]), size: size, x: x, y: y})
		}
		i = j - 1
	}
	return out
}

// Run is one text run as the PDF shows it: its text, the font size it is set
// in and the start of its baseline, in PDF points from the bottom left
// corner of the page.
type Run struct {
	Text string
	Size float64
	X, Y float64
}

// Pages returns the text runs of each page content stream, in order.
func Pages(pdf []byte) ([][]string, error) {
	runs, err := Runs(pdf)
	if err != nil {
		return nil, err
	}
	pages := make([][]string, len(runs))
	for i, pg := range runs {
		for _, r := range pg {
			pages[i] = append(pages[i], r.Text)
		}
	}
	return pages, nil
}

// Runs returns the text runs of each page content stream, in order, with
// their size and position.
func Runs(pdf []byte) ([][]Run, error) {
	streams, err := pdfStreams(pdf)
	if err != nil {
		return nil, err
	}
	var cm *cmap
	for _, s := range streams {
		if bytes.Contains(s.data, []byte("begincmap")) {
			cm = parseCMap(s.data)
			break
		}
	}
	if cm == nil {
		return nil, fmt.Errorf("pdftext: no ToUnicode CMap found")
	}
	var pages [][]Run
	for _, s := range streams {
		if !bytes.Contains(s.data, []byte(" Tj")) || bytes.Contains(s.data, []byte("begincmap")) {
			continue
		}
		var runs []Run
		for _, tj := range tjStrings(s.data) {
			raw := tj.raw
			if len(raw)%2 != 0 {
				return nil, fmt.Errorf("pdftext: odd-length two-byte string %q", raw)
			}
			u := make([]uint16, 0, len(raw)/2)
			for k := 0; k < len(raw); k += 2 {
				code := uint16(raw[k])<<8 | uint16(raw[k+1])
				v, ok := cm.lookup(code)
				if !ok {
					return nil, fmt.Errorf("pdftext: code %04x not in the CMap", code)
				}
				u = append(u, v)
			}
			runs = append(runs, Run{Text: string(utf16.Decode(u)), Size: tj.size, X: tj.x, Y: tj.y})
		}
		pages = append(pages, runs)
	}
	return pages, nil
}
