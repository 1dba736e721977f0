package job

import "strings"

// positions finds where each key of a job file is written, by dotted key, for
// the messages of validation. It reads the plain subset of TOML a job file
// uses (tables, key = value, one level of inline table); anything it does not
// follow is simply not located, and the message then goes without a line.
func positions(data []byte) map[string]Pos {
	out := map[string]Pos{}
	table := ""
	lines := strings.Split(string(data), "\n")
	for i, raw := range lines {
		line := strings.TrimRight(raw, "\r")
		trim := strings.TrimLeft(line, " \t")
		indent := len(line) - len(trim)
		if trim == "" || trim[0] == '#' {
			continue
		}
		if strings.HasPrefix(trim, "[") && !strings.HasPrefix(trim, "[[") {
			end := strings.IndexByte(trim, ']')
			if end < 0 {
				continue
			}
			table = cleanKey(trim[1:end])
			if _, seen := out[table]; !seen {
				out[table] = Pos{i + 1, indent + 1}
			}
			continue
		}
		eq := strings.IndexByte(trim, '=')
		if eq <= 0 {
			continue
		}
		key := join(table, cleanKey(trim[:eq]))
		out[key] = Pos{i + 1, indent + 1}
		rest := trim[eq+1:]
		val := strings.TrimLeft(rest, " \t")
		if strings.HasPrefix(val, "{") {
			base := indent + eq + 1 + (len(rest) - len(val)) // index of the brace, 0-based
			inline(out, key, val, i+1, base)
		}
	}
	return out
}

// inline records the keys of a one-line inline table starting at val[0] = '{'.
func inline(out map[string]Pos, table, val string, line, col0 int) {
	end := strings.IndexByte(val, '}')
	if end < 0 {
		end = len(val)
	}
	body := val[1:end]
	off := 1
	for _, part := range strings.Split(body, ",") {
		eq := strings.IndexByte(part, '=')
		if eq > 0 {
			lead := len(part) - len(strings.TrimLeft(part, " \t"))
			out[join(table, cleanKey(part[:eq]))] = Pos{line, col0 + off + lead + 1}
		}
		off += len(part) + 1
	}
}

func cleanKey(k string) string {
	parts := strings.Split(k, ".")
	for i, p := range parts {
		parts[i] = strings.Trim(strings.TrimSpace(p), `"'`)
	}
	return strings.Join(parts, ".")
}

func join(table, key string) string {
	if table == "" {
		return key
	}
	return table + "." + key
}
