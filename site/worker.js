// Worker: owns Go's wasm_exec.js and the statistics module, so the page never
// freezes. Messages: {id, kind: "analyze", data, options} and
// {id, kind: "page", list, offset, count}; replies: {id, json}, and
// {id, kind: "progress", stage, done, total} during long computations.
importScripts("wasm_exec.js");

const ready = (async () => {
  const go = new Go();
  const { instance } = await WebAssembly.instantiateStreaming(fetch("midrank.wasm"), go.importObject);
  go.run(instance); // main registers globalThis.midrank, then waits for calls
  return globalThis.midrank;
})();

ready.then((m) => postMessage({ kind: "ready", version: m.version }),
  (err) => postMessage({ kind: "failed", message: String(err) }));

onmessage = async (event) => {
  const m = await ready;
  const q = event.data;
  const json = q.kind === "page"
    ? m.page(q.list, q.offset, q.count)
    : m.analyze(new TextEncoder().encode(q.data), JSON.stringify(q.options),
      (stage, done, total) => postMessage({ id: q.id, kind: "progress", stage, done, total }));
  postMessage({ id: q.id, kind: q.kind, json });
};
