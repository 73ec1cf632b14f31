# The local edge runtime's configuration: one service running the edge
# worker built by make edge into build/, one socket on loopback.
using Workerd = import "/workerd/workerd.capnp";

const config :Workerd.Config = (
  services = [ (name = "midrank", worker = .midrank) ],
  sockets = [ (name = "http", address = "127.0.0.1:8787", http = (), service = "midrank") ],
);

const midrank :Workerd.Worker = (
  modules = [
    (name = "worker.mjs", esModule = embed "build/worker.mjs"),
    (name = "runtime.mjs", esModule = embed "build/runtime.mjs"),
    (name = "wasm_exec.js", esModule = embed "build/wasm_exec.js"),
    (name = "app.wasm", wasm = embed "build/app.wasm"),
  ],
  compatibilityDate = "2025-01-01",
);
