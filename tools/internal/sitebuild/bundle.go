package sitebuild

import (
	"errors"
	"fmt"
	"path/filepath"
	"strings"

	"github.com/evanw/esbuild/pkg/api"
)

// bundle joins the ES module entry (in site/) and every module it imports
// into one classic script, run as a function so that nothing leaks into the
// page's globals. Nothing is minified here (minify does it after the names
// of the assets are rewritten), no source map and no comment naming a file
// is written, and paths are taken relative to the project: the same sources
// give the same bytes on every machine.
func bundle(root, entry string) ([]byte, error) {
	abs, err := filepath.Abs(root)
	if err != nil {
		return nil, err
	}
	res := api.Build(api.BuildOptions{
		EntryPoints:   []string{filepath.Join("site", entry)},
		AbsWorkingDir: abs,
		Bundle:        true,
		Format:        api.FormatIIFE,
		Target:        api.ES2020,
		Charset:       api.CharsetUTF8,
		LegalComments: api.LegalCommentsNone,
		Write:         false,
		LogLevel:      api.LogLevelSilent,
	})
	if len(res.Errors) > 0 {
		var msgs []string
		for _, m := range res.Errors {
			place := ""
			if m.Location != nil {
				place = fmt.Sprintf("%s:%d:%d: ", m.Location.File, m.Location.Line, m.Location.Column)
			}
			msgs = append(msgs, place+m.Text)
		}
		return nil, fmt.Errorf("bundling %s: %s", entry, strings.Join(msgs, "; "))
	}
	if len(res.OutputFiles) != 1 {
		return nil, errors.New("bundling " + entry + ": expected one output file")
	}
	return res.OutputFiles[0].Contents, nil
}
