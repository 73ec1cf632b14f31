// Package sitebuild writes the static site: the page, its script and style,
// the demo data, Go's wasm_exec.js (copied untouched from the Go
// installation) and the statistics module compiled to WebAssembly.
package sitebuild

import (
	"fmt"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
)

// siteFiles are copied from site/ as they are.
var siteFiles = []string{"index.html", "style.css", "app.js", "worker.js", "demo.tsv"}

// Build writes the site from the project at root into out, replacing what
// was there, and lists the files it wrote with their sizes on log.
func Build(root, out string, log io.Writer) error {
	out, err := filepath.Abs(out)
	if err != nil {
		return err
	}
	if err := os.RemoveAll(out); err != nil {
		return err
	}
	if err := os.MkdirAll(out, 0o755); err != nil {
		return err
	}
	for _, name := range siteFiles {
		if err := copyFile(filepath.Join(root, "site", name), filepath.Join(out, name)); err != nil {
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
	cmd.Dir = root
	cmd.Env = append(os.Environ(), "GOOS=js", "GOARCH=wasm")
	cmd.Stderr = log
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
		fmt.Fprintf(log, "%10d  %s\n", info.Size(), e.Name())
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
