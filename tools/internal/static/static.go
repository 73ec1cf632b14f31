// Package static serves Midrank's built site with the headers that make its
// privacy claim checkable: a Content-Security-Policy that lets the page load
// only its own files, and no referrer, sniffing or cross-origin embedding.
// The intranet server and the edge worker share it.
package static

import (
	"io/fs"
	"net/http"
	"path"
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
	h.Set("Permissions-Policy", "camera=(), microphone=(), geolocation=(), usb=(), serial=(), bluetooth=(), payment=(), interest-cohort=()")
}

// Handler serves the files of site: GET and HEAD only, "/" as index.html.
func Handler(site fs.FS) http.Handler {
	files := http.FileServerFS(site)
	return http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
		Headers(w.Header())
		if r.Method != http.MethodGet && r.Method != http.MethodHead {
			w.Header().Set("Allow", "GET, HEAD")
			http.Error(w, "only GET and HEAD are served", http.StatusMethodNotAllowed)
			return
		}
		name := r.URL.Path
		if strings.HasSuffix(name, "/") {
			name += "index.html"
		}
		if t, ok := contentTypes[path.Ext(name)]; ok {
			w.Header().Set("Content-Type", t)
		}
		w.Header().Set("Cache-Control", "no-cache")
		files.ServeHTTP(w, r)
	})
}
