package main

import (
	"bytes"
	"log"
	"net/http"
	"net/http/httptest"
	"strings"
	"testing"
)

// TestAccessLog: one line a request, whatever the path holds: encoded line
// breaks and NULs stay encoded, a share link's %23 is not decoded into a
// readable #, long paths are cut, and the query string is left out.
func TestAccessLog(t *testing.T) {
	var out bytes.Buffer
	h := accessLog(log.New(&out, "", 0), http.NotFoundHandler())
	for _, c := range []struct{ target, want string }{
		{"/a%0aGET%20/forged%20200", `GET "/a%0aGET%20/forged%20200" 404`},
		{"/x%00y", `GET "/x%00y" 404`},
		{"/%23r1.secretdata", `GET "/%23r1.secretdata" 404`},
		{"/index.html?q=private", `GET "/index.html" 404`},
		{"/" + strings.Repeat("A", 500), `bytes more)" 404`},
	} {
		out.Reset()
		h.ServeHTTP(httptest.NewRecorder(), httptest.NewRequest("GET", c.target, nil))
		line := out.String()
		if strings.Count(line, "\n") != 1 || !strings.Contains(line, c.want) || strings.Contains(line, "#r1") || strings.Contains(line, "private") {
			t.Errorf("request %.40q logged %q, want one line with %q", c.target, line, c.want)
		}
	}
}
