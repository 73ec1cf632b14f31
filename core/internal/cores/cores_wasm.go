//go:build wasm

package cores

// Several is false in the WebAssembly module: it runs on one thread.
const Several = false
