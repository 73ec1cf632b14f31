// Package testfiles reads the files that the tests of the core, the command
// line and the WebAssembly module share, and nothing else imports: the
// example cases of testdata/cases and the reference tables of
// testdata/reference. It reads through an fs.FS (the tests pass
// os.DirFS), so that the core's packages still import nothing of their host.
//
// A case is an input file NAME.EXT (any extension but .json), its expected
// answer NAME.json, and optionally NAME.options.json with request options;
// the core writes each expected answer (go test ./core -update), and the
// command line and the module must answer with the same bytes.
package testfiles

import (
	"bufio"
	"io/fs"
	"path"
	"sort"
	"strings"
)

// Case is one example input with what it must produce; the names are paths
// within the fs.FS that Cases was given.
type Case struct {
	Name    string // NAME
	Input   string // the input
	Options string // the options JSON, "" if none
	Golden  string // the expected JSON answer
}

// Cases returns the cases at the top of fsys, sorted by name.
func Cases(fsys fs.FS) ([]Case, error) {
	entries, err := fs.ReadDir(fsys, ".")
	if err != nil {
		return nil, err
	}
	var cases []Case
	for _, e := range entries {
		name := e.Name()
		if e.IsDir() || strings.HasSuffix(name, ".json") {
			continue
		}
		base := strings.TrimSuffix(name, path.Ext(name))
		c := Case{Name: base, Input: name, Golden: base + ".json"}
		if _, err := fs.Stat(fsys, base+".options.json"); err == nil {
			c.Options = base + ".options.json"
		}
		cases = append(cases, c)
	}
	sort.Slice(cases, func(i, j int) bool { return cases[i].Name < cases[j].Name })
	return cases, nil
}

// Rows reads a tab-separated reference table, as tools/reference writes
// them: its first line names the columns and is skipped; every other line is
// a row of cells.
func Rows(fsys fs.FS, name string) ([][]string, error) {
	f, err := fsys.Open(name)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	var rows [][]string
	s := bufio.NewScanner(f)
	s.Buffer(nil, 1<<20)
	s.Scan()
	for s.Scan() {
		rows = append(rows, strings.Split(s.Text(), "\t"))
	}
	return rows, s.Err()
}
