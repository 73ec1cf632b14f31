// Package casefiles lists the example cases in testdata/cases, which the
// tests of the core, the command line and the WebAssembly module share: the
// core writes each expected JSON answer (go test ./core -update), and the
// command line and the module must answer with the same bytes.
//
// A case is an input file NAME.EXT (any extension but .json), its expected
// answer NAME.json, and optionally NAME.options.json with request options.
package casefiles

import (
	"os"
	"path/filepath"
	"sort"
	"strings"
)

// Case is one example input with what it must produce.
type Case struct {
	Name    string // NAME
	Input   string // path of the input
	Options string // path of the options JSON, "" if none
	Golden  string // path of the expected JSON answer
}

// List returns the cases found in dir, sorted by name.
func List(dir string) ([]Case, error) {
	entries, err := os.ReadDir(dir)
	if err != nil {
		return nil, err
	}
	var cases []Case
	for _, e := range entries {
		name := e.Name()
		if e.IsDir() || strings.HasSuffix(name, ".json") {
			continue
		}
		base := strings.TrimSuffix(name, filepath.Ext(name))
		c := Case{Name: base, Input: filepath.Join(dir, name), Golden: filepath.Join(dir, base+".json")}
		if opt := filepath.Join(dir, base+".options.json"); fileExists(opt) {
			c.Options = opt
		}
		cases = append(cases, c)
	}
	sort.Slice(cases, func(i, j int) bool { return cases[i].Name < cases[j].Name })
	return cases, nil
}

func fileExists(path string) bool {
	_, err := os.Stat(path)
	return err == nil
}
