package sitebuild

import (
	"bytes"
	"crypto/sha256"
	"encoding/hex"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
)

// TestDeterministic builds the site twice and expects the same bytes in
// every file, a hashed name for every asset, and the published SHA-256 of
// the offline file.
func TestDeterministic(t *testing.T) {
	var logs [2]strings.Builder
	dirs := [2]string{t.TempDir(), t.TempDir()}
	var results [2]*Result
	for i := range dirs {
		r, err := Build("../../..", dirs[i], &logs[i])
		if err != nil {
			t.Fatalf("build %d: %v", i, err)
		}
		results[i] = r
	}
	entries, err := os.ReadDir(dirs[0])
	if err != nil {
		t.Fatal(err)
	}
	if len(entries) != 3*7+1 {
		t.Errorf("%d files written, want 22 (7 with .gz and .br copies, and the offline file)", len(entries))
	}
	for _, e := range entries {
		a, _ := os.ReadFile(filepath.Join(dirs[0], e.Name()))
		b, err := os.ReadFile(filepath.Join(dirs[1], e.Name()))
		if err != nil || !bytes.Equal(a, b) {
			t.Errorf("%s differs between two builds", e.Name())
		}
	}
	hashed := regexp.MustCompile(`^[a-z_]+\.[0-9a-f]{10}\.[a-z]+$`)
	for _, name := range results[0].Files {
		if name != "index.html" && !hashed.MatchString(name) {
			t.Errorf("asset %s has no content hash in its name", name)
		}
	}
	offline, _ := os.ReadFile(filepath.Join(dirs[0], OfflineName))
	sum := sha256.Sum256(offline)
	if got := hex.EncodeToString(sum[:]); got != results[0].OfflineSHA256 || !strings.Contains(logs[0].String(), got) {
		t.Errorf("offline SHA-256 %s, reported %s", got, results[0].OfflineSHA256)
	}
	r := results[0]
	for _, size := range []struct {
		what          string
		bytes, budget int
	}{
		{"module", r.Module, BudgetModule},
		{"module, gzip", r.ModuleGzip, BudgetModuleGzip},
		{"module, brotli", r.ModuleBrotli, BudgetModuleBrotli},
		{"first visit, gzip", r.FirstVisit, BudgetFirstVisit},
	} {
		t.Logf("%s: %.3f MiB (budget %.3f)", size.what, float64(size.bytes)/(1<<20), float64(size.budget)/(1<<20))
		if size.bytes == 0 || size.bytes > size.budget {
			t.Errorf("%s is %d bytes; the budget is %d", size.what, size.bytes, size.budget)
		}
	}
	page, _ := os.ReadFile(filepath.Join(dirs[0], "index.html"))
	if n := bytes.Count(page, []byte("integrity=")); n != 2 {
		t.Errorf("index.html has %d integrity attributes, want 2 (script and style)", n)
	}
}
