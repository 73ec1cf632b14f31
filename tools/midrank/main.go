// Command midrank runs the Kruskal–Wallis H test on a file of groups and
// prints a readable report, or with --json the same JSON as the WebAssembly
// module. Run midrank -h for the flags.
package main

import "os"

func main() {
	os.Exit(run(os.Args[1:], os.Stdin, os.Stdout, os.Stderr))
}
