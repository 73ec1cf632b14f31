// Package static serves Midrank's built site with the headers that make its
// privacy claim checkable: a Content-Security-Policy that lets the page load
// only its own files, and no referrer, sniffing or cross-origin embedding.
// The intranet server and the edge worker share it.
package static

import (
	"io"
	"io/fs"
	"net/http"
	"path"
	"regexp"
	"strings"
)

// ContentSecurityPolicy allows the page its own scripts, styles, module and
// data, and nothing from anywhere else.
const ContentSecurityPolicy = "default-src 'none'; script-src 'self' 'wasm-unsafe-eval'; connect-src 'self'; " +
	"img-src 'self' data: blob:; style-src 'self'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'"

// contentTypes are set explicitly so that no server guesses; application/wasm
// is what WebAssembly.instantiateStreaming requires.
var contentTypes = map[string]string{
	".html": "text/html; charset=utf-8",
	".js":   "text/javascript; charset=utf-8",
	".css":  "text/css; charset=utf-8",
	".wasm": "application/wasm",
	".tsv":  "text/tab-separated-values; charset=utf-8",
	".svg":  "image/svg+xml",
	".json": "application/json",
	".txt":  "text/plain; charset=utf-8",
}

// Headers sets the security headers every response carries.
func Headers(h http.Header) {
	h.Set("Content-Security-Policy", ContentSecurityPolicy)
	h.Set("X-Content-Type-Options", "nosniff")
	h.Set("Referrer-Policy", "no-referrer")
	h.Set("Cross-Origin-Opener-Policy", "same-origin")
	h.Set("Cross-Origin-Resource-Policy", "same-origin")
	h.Set("Permissions-Policy", "camera=(), microphone=(), geolocation=(), usb=(), serial=(), payment=(), interest-cohort=()")
}

// hashed matches the names the build gives assets: name.<10 hex digits>.ext.
var hashed = regexp.MustCompile(`\.[0-9a-f]{10}\.[a-z]+$`)

// Handler serves the files of site: GET and HEAD only, "/" as index.html,
// with the precompressed .br or .gz copy when the client accepts it, and
// caching that never goes stale: hashed names are immutable, the page is
// revalidated every time.
func Handler(site fs.FS) http.Handler {
	return http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
		h := w.Header()
		Headers(h)
		if r.Method != http.MethodGet && r.Method != http.MethodHead {
			h.Set("Allow", "GET, HEAD")
			http.Error(w, "only GET and HEAD are served", http.StatusMethodNotAllowed)
			return
		}
		name := strings.TrimPrefix(path.Clean("/"+r.URL.Path), "/")
		if name == "" || strings.HasSuffix(r.URL.Path, "/") {
			name = path.Join(name, "index.html")
		}
		if strings.HasSuffix(name, ".gz") || strings.HasSuffix(name, ".br") {
			http.NotFound(w, r) // the copies are served by negotiation only
			return
		}
		f, info, err := open(site, name)
		if err != nil {
			http.NotFound(w, r)
			return
		}
		defer f.Close()
		if t, ok := contentTypes[path.Ext(name)]; ok {
			h.Set("Content-Type", t)
		}
		if hashed.MatchString(name) {
			h.Set("Cache-Control", "public, max-age=31536000, immutable")
		} else {
			h.Set("Cache-Control", "no-cache")
		}
		h.Add("Vary", "Accept-Encoding")
		accepted := r.Header.Get("Accept-Encoding")
		for _, enc := range [...]struct{ token, ext string }{{"br", ".br"}, {"gzip", ".gz"}} {
			if !acceptsEncoding(accepted, enc.token) {
				continue
			}
			if cf, cinfo, err := open(site, name+enc.ext); err == nil {
				defer cf.Close()
				h.Set("Content-Encoding", enc.token)
				http.ServeContent(w, r, name, cinfo.ModTime(), cf)
				return
			}
		}
		http.ServeContent(w, r, name, info.ModTime(), f)
	})
}

// open opens a regular file of site for seeking.
func open(site fs.FS, name string) (io.ReadSeekCloser, fs.FileInfo, error) {
	f, err := site.Open(name)
	if err != nil {
		return nil, nil, err
	}
	info, err := f.Stat()
	if err != nil || info.IsDir() {
		f.Close()
		return nil, nil, fs.ErrNotExist
	}
	rs, ok := f.(io.ReadSeekCloser)
	if !ok {
		f.Close()
		return nil, nil, fs.ErrNotExist
	}
	return rs, info, nil
}

// acceptsEncoding reports whether an Accept-Encoding header allows token
// (listed without q=0).
func acceptsEncoding(header, token string) bool {
	for _, part := range strings.Split(header, ",") {
		name, params, _ := strings.Cut(strings.TrimSpace(part), ";")
		if strings.EqualFold(strings.TrimSpace(name), token) {
			q := strings.ReplaceAll(params, " ", "")
			return q != "q=0" && q != "q=0.0" && q != "q=0.00" && q != "q=0.000"
		}
	}
	return false
}
