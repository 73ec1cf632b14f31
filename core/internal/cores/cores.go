//go:build !wasm

// Package cores says whether the code may run on several cores at once: the
// command line may, the WebAssembly module, which runs on one thread, may
// not, and the code that splits work between cores is left out of it (a
// constant false drops it at compile time).
package cores

// Several is true where goroutines can run side by side.
const Several = true
