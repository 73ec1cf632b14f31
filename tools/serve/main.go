// Command serve serves the built site (dist/) on the intranet or this
// machine, with the security headers of package static.
//
//	go run ./tools/serve --addr 127.0.0.1:8080 --dir dist
package main

import (
	"context"
	"errors"
	"flag"
	"fmt"
	"io"
	"log"
	"net"
	"net/http"
	"os"
	"os/signal"
	"strconv"
	"strings"
	"syscall"
	"time"

	"midrank/tools/internal/static"
)

func main() { os.Exit(run(os.Args[1:], os.Stdout, os.Stderr)) }

func run(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("serve", flag.ContinueOnError)
	fs.SetOutput(stderr)
	addr := fs.String("addr", "127.0.0.1:8080", "address to listen on")
	dir := fs.String("dir", "dist", "folder of the built site")
	if err := fs.Parse(args); err != nil {
		return 2
	}
	if _, err := os.Stat(*dir + "/index.html"); err != nil {
		fmt.Fprintf(stderr, "serve: %s/index.html is missing; run make build first\n", *dir)
		return 1
	}
	ln, err := net.Listen("tcp", *addr)
	if err != nil {
		fmt.Fprintln(stderr, "serve:", err)
		return 1
	}
	logger := log.New(stderr, "", log.LstdFlags)
	srv := &http.Server{
		Handler:           accessLog(logger, static.Handler(os.DirFS(*dir))),
		ReadHeaderTimeout: 10 * time.Second,
		IdleTimeout:       60 * time.Second, // an idle keep-alive connection is closed, not kept for ever
	}
	fmt.Fprintf(stdout, "Midrank is served at http://%s/ (Ctrl-C stops)\n", ln.Addr())

	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt, syscall.SIGTERM)
	defer stop()
	done := make(chan error, 1)
	go func() { done <- srv.Serve(ln) }()
	select {
	case err := <-done:
		fmt.Fprintln(stderr, "serve:", err)
		return 1
	case <-ctx.Done():
	}
	shutdown, cancel := context.WithTimeout(context.Background(), 5*time.Second)
	defer cancel()
	if err := srv.Shutdown(shutdown); err != nil && !errors.Is(err, http.ErrServerClosed) {
		fmt.Fprintln(stderr, "serve:", err)
		return 1
	}
	return 0
}

// accessLog logs method, path and status: the path as the client sent it,
// still percent-encoded (so that %0a or %00 cannot start a forged line, and
// a share link's %23 is not turned into a readable #), quoted, and cut at
// loggedPath bytes, since a long path is most likely a link's data, which
// has no place in a log; never the query string.
func accessLog(l *log.Logger, next http.Handler) http.Handler {
	return http.HandlerFunc(func(w http.ResponseWriter, r *http.Request) {
		rec := &statusRecorder{ResponseWriter: w, status: http.StatusOK}
		next.ServeHTTP(rec, r)
		path, _, _ := strings.Cut(r.RequestURI, "?")
		if len(path) > loggedPath {
			path = fmt.Sprintf("%s…(%d bytes more)", path[:loggedPath], len(path)-loggedPath)
		}
		l.Printf("%s %s %d", r.Method, strconv.Quote(path), rec.status)
	})
}

// loggedPath is the most of a path that the log keeps.
const loggedPath = 120

type statusRecorder struct {
	http.ResponseWriter
	status int
}

func (s *statusRecorder) WriteHeader(code int) {
	s.status = code
	s.ResponseWriter.WriteHeader(code)
}
