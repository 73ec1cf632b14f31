package static

import (
	"net/http/httptest"
	"strings"
	"testing"
	"testing/fstest"
)

func TestHandler(t *testing.T) {
	site := fstest.MapFS{
		"index.html":           {Data: []byte("<!doctype html><p>page")},
		"app.0123456789.js":    {Data: []byte("plain")},
		"app.0123456789.js.gz": {Data: []byte("gzipped")},
		"app.0123456789.js.br": {Data: []byte("brotli")},
		"m.abcdef0123.wasm":    {Data: []byte("\x00asm")},
		"m.abcdef0123.wasm.gz": {Data: []byte("gz wasm")},
	}
	h := Handler(site)
	tests := []struct {
		method, path, accept string
		status               int
		body                 string
		header               map[string]string
	}{
		{"GET", "/", "", 200, "<!doctype html><p>page", map[string]string{"Cache-Control": "no-cache", "Content-Type": "text/html; charset=utf-8",
			"Content-Security-Policy": ContentSecurityPolicy, "X-Content-Type-Options": "nosniff", "Referrer-Policy": "no-referrer",
			"Cross-Origin-Opener-Policy": "same-origin", "Cross-Origin-Resource-Policy": "same-origin"}},
		{"GET", "/app.0123456789.js", "gzip, br", 200, "brotli", map[string]string{"Content-Encoding": "br", "Cache-Control": "public, max-age=31536000, immutable", "Vary": "Accept-Encoding"}},
		{"GET", "/app.0123456789.js", "gzip", 200, "gzipped", map[string]string{"Content-Encoding": "gzip"}},
		{"GET", "/app.0123456789.js", "br;q=0, gzip", 200, "gzipped", map[string]string{"Content-Encoding": "gzip"}},
		{"GET", "/app.0123456789.js", "", 200, "plain", map[string]string{"Content-Encoding": ""}},
		{"GET", "/m.abcdef0123.wasm", "br, gzip", 200, "gz wasm", map[string]string{"Content-Type": "application/wasm", "Content-Encoding": "gzip"}},
		{"HEAD", "/", "", 200, "", map[string]string{"Content-Length": "22"}},
		{"GET", "/missing.js", "", 404, "", nil},
		{"GET", "/app.0123456789.js.gz", "", 404, "", nil},
		{"POST", "/", "", 405, "", map[string]string{"Allow": "GET, HEAD"}},
		{"GET", "/../index.html", "", 200, "<!doctype html><p>page", nil},
	}
	for _, tt := range tests {
		req := httptest.NewRequest(tt.method, tt.path, nil)
		if tt.accept != "" {
			req.Header.Set("Accept-Encoding", tt.accept)
		}
		rec := httptest.NewRecorder()
		h.ServeHTTP(rec, req)
		if rec.Code != tt.status || (tt.body != "" && rec.Body.String() != tt.body) {
			t.Errorf("%s %s (%s): %d %q, want %d %q", tt.method, tt.path, tt.accept, rec.Code, rec.Body.String(), tt.status, tt.body)
		}
		for k, v := range tt.header {
			if got := rec.Header().Get(k); got != v {
				t.Errorf("%s %s: %s = %q, want %q", tt.method, tt.path, k, got, v)
			}
		}
		if tt.method == "HEAD" && rec.Body.Len() != 0 {
			t.Errorf("HEAD has a body")
		}
	}
	if p := ContentSecurityPolicy; !strings.Contains(p, "default-src 'none'") {
		t.Errorf("CSP %q", p)
	}
}
