// Command build writes the static site to dist/ (see package sitebuild).
//
//	go run ./tools/build --out dist
package main

import (
	"flag"
	"fmt"
	"io"
	"os"

	"midrank/tools/internal/sitebuild"
)

func main() { os.Exit(run(os.Args[1:], os.Stdout, os.Stderr)) }

func run(args []string, stdout, stderr io.Writer) int {
	fs := flag.NewFlagSet("build", flag.ContinueOnError)
	fs.SetOutput(stderr)
	out := fs.String("out", "dist", "folder to write")
	edge := fs.Bool("edge", false, "also build the edge worker in tools/edge/build")
	if err := fs.Parse(args); err != nil {
		return 2
	}
	if _, err := sitebuild.Build(".", *out, stdout); err != nil {
		fmt.Fprintln(stderr, "build:", err)
		return 1
	}
	if *edge {
		if err := sitebuild.Edge(".", *out); err != nil {
			fmt.Fprintln(stderr, "build:", err)
			return 1
		}
		fmt.Fprintln(stdout, "edge worker: tools/edge/build (workerd.capnp runs it)")
	}
	return 0
}
