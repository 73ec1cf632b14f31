//go:build js && wasm

// Command edge serves the built site from a Cloudflare-style edge worker,
// written with github.com/syumai/workers: the same handler and headers as
// tools/serve (package static), over a copy of dist/ embedded at build time
// (make edge copies it into site/, without the precompressed copies, which
// the edge network makes itself). A HEAD request is answered as GET without
// a body, because the workers package refuses a Content-Length with no body.
package main

import (
	"embed"
	"io/fs"
	"net/http"

	"github.com/syumai/workers"

	"midrank/tools/internal/static"
)

//go:embed site
var embedded embed.FS

func main() {
	site, err := fs.Sub(embedded, "site")
	if err != nil {
		panic(err)
	}
	workers.Serve(headAsGet(static.Handler(site)))
}

// headAsGet runs HEAD requests as GET and drops the body and its length.
func headAsGet(next http.Handler) http.Handler {
	return http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
		if r.Method != http.MethodHead {
			next.ServeHTTP(w, r)
			return
		}
		get := r.Clone(r.Context())
		get.Method = http.MethodGet
		next.ServeHTTP(&bodiless{ResponseWriter: w}, get)
	})
}

// bodiless forwards headers and status but no body.
type bodiless struct {
	http.ResponseWriter
	wrote bool
}

func (b *bodiless) WriteHeader(code int) {
	if b.wrote {
		return
	}
	b.wrote = true
	b.Header().Del("Content-Length")
	b.ResponseWriter.WriteHeader(code)
}

func (b *bodiless) Write(p []byte) (int, error) {
	b.WriteHeader(http.StatusOK)
	return len(p), nil
}
