// Package sitebuild writes the static site: the statistics module compiled
// to WebAssembly, Go's wasm_exec.js copied untouched, the page's script
// bundled from its ES modules (site/app.js and site/js/, by esbuild's Go
// API, github.com/evanw/esbuild/pkg/api, at build time only), and the page,
// its script, worker and style minified (github.com/tdewolff/minify/v2). Every
// asset but the page is named by its content hash, scripts and styles carry
// Subresource Integrity, and each file gets gzip and brotli copies for
// content negotiation. The same step writes midrank-offline.html, one file
// with everything inside that works when opened from disk.
//
// The output is deterministic: the same commit builds the same bytes.
package sitebuild

import (
	"bytes"
	"compress/gzip"
	"crypto/sha256"
	"crypto/sha512"
	"encoding/base64"
	"encoding/hex"
	"fmt"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strings"
	"text/tabwriter"

	"github.com/andybalholm/brotli"
	"github.com/tdewolff/minify/v2"
	"github.com/tdewolff/minify/v2/css"
	"github.com/tdewolff/minify/v2/html"
	"github.com/tdewolff/minify/v2/js"
)

// OfflineName is the single-file build.
const OfflineName = "midrank-offline.html"

// Result lists what a build wrote.
type Result struct {
	Files         []string // served files, in writing order (compressed copies not listed)
	OfflineSHA256 string   // hex SHA-256 of OfflineName, to publish beside it
	// the module's size in bytes: raw, gzip- and brotli-compressed; and
	// what a first visit loads, gzip-compressed
	Module, ModuleGzip, ModuleBrotli, FirstVisit int
}

// The size budget (README, "Sizes"), in bytes; TestDeterministic holds
// every build to it. Raised from 4 MiB raw and 1.1 MiB gzip when the
// tables of results (0.11 MiB raw) and the reading of real tables (the
// spreadsheet reader, number formats, counts and units: 0.29 MiB raw)
// moved into the core, again (to 4.6 MiB raw, 1.3 MiB gzip, 0.95 MiB
// brotli) for ε²'s bootstrap interval (0.04 MiB raw, 0.01 MiB gzip), and
// again (to 4.8 MiB raw, 1.35 MiB gzip, 1 MiB brotli) for the trend test
// (0.07 MiB raw) and the exact plan that deals tied pairs last (0.03 MiB
// raw), together about 0.02 MiB brotli, and again (to 5 MiB raw, 1.4 MiB
// gzip) for the results as shared and small-group protection (0.16 MiB
// raw, 0.05 MiB gzip, of which the check of an opened results-only link is
// 0.06 MiB raw), and the brotli budget to 1.05 MiB for Monte Carlo on every
// core and reading text files saved in UTF-16 or Windows-1252 (0.05 MiB raw
// together).
const (
	BudgetModule       = 50 * (1 << 20) / 10
	BudgetModuleGzip   = 140 * (1 << 20) / 100
	BudgetModuleBrotli = 105 * (1 << 20) / 100
	BudgetFirstVisit   = 140 * (1 << 20) / 100
)

// asset is one file of the site on its way out.
type asset struct {
	source string // name in site/ (or of the generated file)
	name   string // name written, hashed unless it is the page
	data   []byte
}

// Build writes the site from the project at root into out, replacing what
// was there, and prints a size table on log.
func Build(root, out string, log io.Writer) (*Result, error) {
	out, err := filepath.Abs(out)
	if err != nil {
		return nil, err
	}
	if err := os.RemoveAll(out); err != nil {
		return nil, err
	}
	if err := os.MkdirAll(out, 0o755); err != nil {
		return nil, err
	}
	read := func(name string) ([]byte, error) { return os.ReadFile(filepath.Join(root, "site", name)) }
	m := minify.New()
	m.AddFunc("text/html", html.Minify)
	m.AddFunc("text/css", css.Minify)
	m.AddFunc("text/javascript", js.Minify)

	execJS, err := wasmExec()
	if err != nil {
		return nil, err
	}
	module, err := compileModule(root)
	if err != nil {
		return nil, err
	}
	demo, err := read("demo.tsv")
	if err != nil {
		return nil, err
	}
	assets := map[string]*asset{}
	add := func(source string, data []byte) *asset {
		a := &asset{source: source, name: hashedName(source, data), data: data}
		assets[source] = a
		return a
	}
	// leaves first, so that every file that names another is rewritten
	// before its own hash is taken
	add("wasm_exec.js", execJS) // untouched, as Go ships it
	add("midrank.wasm", module)
	add("demo.tsv", demo)
	for _, name := range []string{"worker.js", "app.js", "style.css"} {
		src, err := read(name)
		if name == "app.js" {
			src, err = bundle(root, name)
		}
		if err != nil {
			return nil, err
		}
		src = rewrite(src, assets)
		mediaType := "text/javascript"
		if strings.HasSuffix(name, ".css") {
			mediaType = "text/css"
		}
		min, err := m.Bytes(mediaType, src)
		if err != nil {
			return nil, fmt.Errorf("minifying %s: %w", name, err)
		}
		add(name, min)
	}
	page, err := read("index.html")
	if err != nil {
		return nil, err
	}
	page = withIntegrity(rewrite(page, assets), assets["app.js"], assets["style.css"])
	if page, err = m.Bytes("text/html", page); err != nil {
		return nil, fmt.Errorf("minifying index.html: %w", err)
	}
	index := &asset{source: "index.html", name: "index.html", data: page}

	offline, err := offlinePage(read, assets)
	if err != nil {
		return nil, err
	}
	sum := sha256.Sum256(offline)
	res := &Result{OfflineSHA256: hex.EncodeToString(sum[:])}

	order := []*asset{index}
	for _, name := range []string{"app.js", "style.css", "worker.js", "wasm_exec.js", "midrank.wasm", "demo.tsv"} {
		order = append(order, assets[name])
	}
	table := tabwriter.NewWriter(log, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(table, "file\tbytes\tgzip\tbrotli\t")
	var firstVisit int
	for _, a := range order {
		gz, br, err := writeWithCopies(filepath.Join(out, a.name), a.data)
		if err != nil {
			return nil, err
		}
		res.Files = append(res.Files, a.name)
		if a.source != "demo.tsv" {
			firstVisit += gz
		}
		if a.source == "midrank.wasm" {
			res.Module, res.ModuleGzip, res.ModuleBrotli = len(a.data), gz, br
		}
		fmt.Fprintf(table, "%s\t%d\t%d\t%d\t\n", a.name, len(a.data), gz, br)
	}
	if err := os.WriteFile(filepath.Join(out, OfflineName), offline, 0o644); err != nil {
		return nil, err
	}
	fmt.Fprintf(table, "%s\t%d\t\t\t\n", OfflineName, len(offline))
	table.Flush()
	res.FirstVisit = firstVisit
	fmt.Fprintf(log, "a first visit loads %d bytes gzip-compressed\n", firstVisit)
	fmt.Fprintf(log, "SHA-256 of %s: %s\n", OfflineName, res.OfflineSHA256)
	return res, nil
}

// hashedName puts the first 10 hex digits of the content's SHA-256 before
// the extension: app.js → app.1a2b3c4d5e.js.
func hashedName(name string, data []byte) string {
	sum := sha256.Sum256(data)
	ext := filepath.Ext(name)
	return strings.TrimSuffix(name, ext) + "." + hex.EncodeToString(sum[:5]) + ext
}

// rewrite replaces every quoted reference to an asset ("name" or 'name')
// by its hashed name.
func rewrite(src []byte, assets map[string]*asset) []byte {
	names := make([]string, 0, len(assets))
	for n := range assets {
		names = append(names, n)
	}
	slices.Sort(names) // a fixed order keeps the build deterministic
	for _, n := range names {
		for _, q := range []string{`"`, `'`} {
			src = bytes.ReplaceAll(src, []byte(q+n+q), []byte(q+assets[n].name+q))
		}
	}
	return src
}

// sri is the Subresource Integrity value of data.
func sri(data []byte) string {
	sum := sha512.Sum384(data)
	return "sha384-" + base64.StdEncoding.EncodeToString(sum[:])
}

// withIntegrity adds integrity attributes to the page's script and style.
func withIntegrity(page []byte, script, style *asset) []byte {
	page = bytes.Replace(page, []byte(`src="`+script.name+`"`),
		[]byte(`src="`+script.name+`" integrity="`+sri(script.data)+`"`), 1)
	return bytes.Replace(page, []byte(`href="`+style.name+`"`),
		[]byte(`href="`+style.name+`" integrity="`+sri(style.data)+`"`), 1)
}

// writeWithCopies writes data and its .gz and .br copies, returning their sizes.
func writeWithCopies(path string, data []byte) (gz, br int, err error) {
	if err := os.WriteFile(path, data, 0o644); err != nil {
		return 0, 0, err
	}
	var g bytes.Buffer
	zw, _ := gzip.NewWriterLevel(&g, gzip.BestCompression) // no name or time: deterministic
	zw.Write(data)
	zw.Close()
	var b bytes.Buffer
	bw := brotli.NewWriterLevel(&b, brotli.BestCompression)
	bw.Write(data)
	bw.Close()
	if err := os.WriteFile(path+".gz", g.Bytes(), 0o644); err != nil {
		return 0, 0, err
	}
	if err := os.WriteFile(path+".br", b.Bytes(), 0o644); err != nil {
		return 0, 0, err
	}
	return g.Len(), b.Len(), nil
}

func wasmExec() ([]byte, error) {
	goroot, err := exec.Command("go", "env", "GOROOT").Output()
	if err != nil {
		return nil, fmt.Errorf("go env GOROOT: %w", err)
	}
	return os.ReadFile(filepath.Join(strings.TrimSpace(string(goroot)), "lib", "wasm", "wasm_exec.js"))
}

// compileModule builds ./wasm for js/wasm, reproducibly: no paths, symbols,
// build id or VCS stamp in the module.
func compileModule(root string) ([]byte, error) {
	tmp, err := os.MkdirTemp("", "midrank-build")
	if err != nil {
		return nil, err
	}
	defer os.RemoveAll(tmp)
	target := filepath.Join(tmp, "midrank.wasm")
	cmd := exec.Command("go", "build", "-trimpath", "-ldflags=-s -w -buildid=", "-buildvcs=false", "-o", target, "./wasm")
	cmd.Dir = root
	cmd.Env = append(os.Environ(), "GOOS=js", "GOARCH=wasm")
	var stderr bytes.Buffer
	cmd.Stderr = &stderr
	if err := cmd.Run(); err != nil {
		return nil, fmt.Errorf("compiling the module: %w\n%s", err, stderr.String())
	}
	return os.ReadFile(target)
}
