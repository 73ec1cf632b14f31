package sitebuild

import (
	"bytes"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
)

// Edge builds the edge worker (tools/edge) over the site built in dist: it
// copies the served files, without their precompressed copies (the edge
// network compresses by itself) and without the offline file, into
// tools/edge/site for embedding, generates the worker's JavaScript shim with
// the workers package's own generator in Go mode, and compiles app.wasm,
// all into tools/edge/build.
func Edge(root, dist string) error {
	root, err := filepath.Abs(root) // the go commands below run in root
	if err != nil {
		return err
	}
	site := filepath.Join(root, "tools", "edge", "site")
	out := filepath.Join(root, "tools", "edge", "build")
	if err := os.RemoveAll(site); err != nil {
		return err
	}
	if err := os.MkdirAll(site, 0o755); err != nil {
		return err
	}
	entries, err := os.ReadDir(dist) // relative to the caller's folder, read before any command runs
	if err != nil {
		return err
	}
	for _, e := range entries {
		name := e.Name()
		if e.IsDir() || strings.HasSuffix(name, ".gz") || strings.HasSuffix(name, ".br") || name == OfflineName {
			continue
		}
		data, err := os.ReadFile(filepath.Join(dist, name))
		if err != nil {
			return err
		}
		if err := os.WriteFile(filepath.Join(site, name), data, 0o644); err != nil {
			return err
		}
	}
	steps := []struct {
		env  []string
		args []string
	}{
		{nil, []string{"tool", "workers-assets-gen", "-mode=go", "-o", out}},
		{[]string{"GOOS=js", "GOARCH=wasm"}, []string{"build", "-trimpath", "-ldflags=-s -w -buildid=", "-buildvcs=false",
			"-o", filepath.Join(out, "app.wasm"), "./tools/edge"}},
	}
	for _, s := range steps {
		cmd := exec.Command("go", s.args...)
		cmd.Dir = root
		cmd.Env = append(os.Environ(), s.env...)
		var stderr bytes.Buffer
		cmd.Stderr = &stderr
		if err := cmd.Run(); err != nil {
			return fmt.Errorf("go %s: %w\n%s", strings.Join(s.args, " "), err, stderr.String())
		}
	}
	return nil
}
