// Command build writes the static site to dist/: the page, its script and
// style, the demo data, Go's wasm_exec.js (copied untouched from the Go
// installation) and the statistics module compiled to WebAssembly.
//
//	go run ./tools/build --out dist
package main

import (
	"flag"
	"fmt"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
)

func main() { os.Exit(run(os.Args[1:], os.Stdout, os.Stderr)) }

// siteFiles are copied from site/ as they are.
var siteFiles = []string{"index.html", "style.css", "app.js", "worker.js", "demo.tsv"}

func run(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("build", flag.ContinueOnError)
	fs.SetOutput(stderr)
	out := fs.String("out", "dist", "folder to write")
	if err := fs.Parse(args); err != nil {
		return 2
	}
	if err := build(*out, stdout); err != nil {
		fmt.Fprintln(stderr, "build:", err)
		return 1
	}
	return 0
}

func build(out string, stdout io.Writer) error {
	if err := os.RemoveAll(out); err != nil {
		return err
	}
	if err := os.MkdirAll(out, 0o755); err != nil {
		return err
	}
	for _, name := range siteFiles {
		if err := copyFile(filepath.Join("site", name), filepath.Join(out, name)); err != nil {
			return err
		}
	}
	goroot, err := exec.Command("go", "env", "GOROOT").Output()
	if err != nil {
		return fmt.Errorf("go env GOROOT: %w", err)
	}
	execJS := filepath.Join(strings.TrimSpace(string(goroot)), "lib", "wasm", "wasm_exec.js")
	if err := copyFile(execJS, filepath.Join(out, "wasm_exec.js")); err != nil {
		return err
	}
	// Reproducible: no paths, symbols, build id or VCS stamp in the module.
	cmd := exec.Command("go", "build", "-trimpath", "-ldflags=-s -w -buildid=", "-buildvcs=false",
		"-o", filepath.Join(out, "midrank.wasm"), "./wasm")
	cmd.Env = append(os.Environ(), "GOOS=js", "GOARCH=wasm")
	cmd.Stderr = os.Stderr
	if err := cmd.Run(); err != nil {
		return fmt.Errorf("compiling the module: %w", err)
	}
	entries, err := os.ReadDir(out)
	if err != nil {
		return err
	}
	for _, e := range entries {
		info, err := e.Info()
		if err != nil {
			return err
		}
		fmt.Fprintf(stdout, "%10d  %s\n", info.Size(), filepath.Join(out, e.Name()))
	}
	return nil
}

func copyFile(from, to string) error {
	b, err := os.ReadFile(from)
	if err != nil {
		return err
	}
	return os.WriteFile(to, b, 0o644)
}
