package job

import _ "embed"

//go:embed demo.toml
var demoTOML []byte

//go:embed template.toml
var templateTOML []byte

// DemoTOML returns the demo job file: an invented battery-charging generator
// for a small stream turbine, with each value explained in its comments.
func DemoTOML() []byte { return append([]byte(nil), demoTOML...) }

// TemplateTOML returns the blank job file: typical values, each field
// commented with its unit, typical range and what it changes.
func TemplateTOML() []byte { return append([]byte(nil), templateTOML...) }

// DemoName is the file name shown in messages about the demo job.
const DemoName = "(demo)"

// Demo returns the parsed demo job. The embedded file is checked by the tests,
// so this does not fail; it panics only if the binary was built with a broken
// demo, a programmer error.
func Demo() *Job {
	j, err := Parse(demoTOML, DemoName)
	if err != nil {
		panic("job: embedded demo is invalid: " + err.Error())
	}
	return j
}
