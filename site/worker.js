// Worker: owns Go's wasm_exec.js and the statistics module, so the page never
// freezes. Messages: {id, kind: "analyze", data, options} and
// {id, kind: "page", list, offset, count}, {id, kind: "link", data, options}
// and {id, kind: "open-link", fragment}; replies: {id, json}, and
// {id, kind: "progress", stage, done, total} during long computations.
// Served, it loads wasm_exec.js and fetches the module itself; in the
// single-file build it runs from a blob: URL with wasm_exec.js prepended,
// and the page sends the module's bytes first: {kind: "module", bytes}.
const fromBlob = self.location.protocol === "blob:";
if (!fromBlob) importScripts("wasm_exec.js");

let ready = null;

// start compiles and runs the module from its bytes or its address, and
// reports how long the module took to be ready once its bytes were there.
function start(source) {
  let arrived = 0;
  ready = (async () => {
    const bytes = source instanceof Uint8Array ? source : await (await fetch(source)).arrayBuffer();
    arrived = performance.now();
    const go = new Go();
    const { instance } = await WebAssembly.instantiate(bytes, go.importObject);
    go.run(instance); // main registers globalThis.midrank, then waits for calls
    return globalThis.midrank;
  })();
  ready.then((m) => postMessage({ kind: "ready", version: m.version, ms: performance.now() - arrived }),
    (err) => postMessage({ kind: "failed", message: String(err) }));
}

if (!fromBlob) start("midrank.wasm");

onmessage = async (event) => {
  const q = event.data;
  if (q.kind === "module") {
    start(q.bytes);
    return;
  }
  const m = await ready;
  let json;
  switch (q.kind) {
    case "page":
      json = m.page(q.list, q.offset, q.count);
      break;
    case "link":
      json = m.link(q.data, JSON.stringify(q.options));
      break;
    case "open-link":
      json = m.openLink(q.fragment);
      break;
    default:
      json = m.analyze(new TextEncoder().encode(q.data), JSON.stringify(q.options),
        (stage, done, total) => postMessage({ id: q.id, kind: "progress", stage, done, total }));
  }
  postMessage({ id: q.id, kind: q.kind, json });
};
