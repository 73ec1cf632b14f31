package browsertest

import (
	"context"
	"fmt"
	"net"
	"net/http"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"midrank/tools/internal/sitebuild"
	"midrank/tools/internal/static"
)

// TestEdgeWorker builds the edge worker over the built site, runs it in the
// local edge runtime (the npm package workerd, which make test installs
// with npm ci in tools/edge), and checks the page, the module's type, the
// headers, 404 and HEAD, then the same browser smoke test as the served site.
func TestEdgeWorker(t *testing.T) {
	workerd, err := filepath.Abs("../edge/node_modules/.bin/workerd")
	if err != nil {
		t.Fatal(err)
	}
	if _, err := os.Stat(workerd); err != nil {
		t.Fatal("the edge runtime is missing: make test installs it (cd tools/edge && npm ci)")
	}
	dist := site(t)
	if err := sitebuild.Edge("../..", dist); err != nil {
		t.Fatal(err)
	}
	addr := freeAddr(t)
	ctx, cancel := context.WithCancel(context.Background())
	defer cancel()
	cmd := exec.CommandContext(ctx, workerd, "serve", "workerd.capnp", "--socket-addr", "http="+addr)
	cmd.Dir = "../edge"
	var logs strings.Builder
	cmd.Stdout, cmd.Stderr = &logs, &logs
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	defer func() { cancel(); cmd.Wait() }()
	base := "http://" + addr
	waitUp(t, base+"/", &logs)

	files, err := os.ReadDir(dist)
	if err != nil {
		t.Fatal(err)
	}
	var module string
	for _, f := range files {
		if strings.HasSuffix(f.Name(), ".wasm") {
			module = f.Name()
		}
	}
	tests := []struct {
		method, path string
		status       int
		header       map[string]string
	}{
		{"GET", "/", 200, map[string]string{"Content-Type": "text/html; charset=utf-8", "Cache-Control": "no-cache",
			"Content-Security-Policy": static.ContentSecurityPolicy, "X-Content-Type-Options": "nosniff",
			"Referrer-Policy": "no-referrer", "Cross-Origin-Opener-Policy": "same-origin"}},
		{"GET", "/" + module, 200, map[string]string{"Content-Type": "application/wasm", "Cache-Control": "public, max-age=31536000, immutable"}},
		{"HEAD", "/", 200, map[string]string{"Content-Type": "text/html; charset=utf-8"}},
		{"GET", "/no-such-file.js", 404, nil},
		{"POST", "/", 405, nil},
	}
	for _, tt := range tests {
		req, _ := http.NewRequest(tt.method, base+tt.path, nil)
		resp, err := http.DefaultClient.Do(req)
		if err != nil {
			t.Fatalf("%s %s: %v\n%s", tt.method, tt.path, err, logs.String())
		}
		resp.Body.Close()
		if resp.StatusCode != tt.status {
			t.Errorf("%s %s: status %d, want %d", tt.method, tt.path, resp.StatusCode, tt.status)
		}
		for k, v := range tt.header {
			if got := resp.Header.Get(k); got != v {
				t.Errorf("%s %s: %s = %q, want %q", tt.method, tt.path, k, got, v)
			}
		}
	}

	b := open(t, base+"/", base+"/")
	b.smokeTest(t)
	b.checkRequests(t)
}

// freeAddr finds a free loopback port.
func freeAddr(t *testing.T) string {
	t.Helper()
	l, err := net.Listen("tcp", "127.0.0.1:0")
	if err != nil {
		t.Fatal(err)
	}
	defer l.Close()
	return l.Addr().String()
}

// waitUp polls url until it answers, for at most 30 s.
func waitUp(t *testing.T, url string, logs fmt.Stringer) {
	t.Helper()
	deadline := time.Now().Add(30 * time.Second)
	for time.Now().Before(deadline) {
		if resp, err := http.Get(url); err == nil {
			resp.Body.Close()
			return
		}
		time.Sleep(100 * time.Millisecond)
	}
	t.Fatalf("%s did not answer within 30 s:\n%s", url, logs.String())
}
