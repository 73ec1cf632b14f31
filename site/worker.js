// Worker: owns Go's wasm_exec.js and the statistics module, so the page never
// freezes. The page compiles the module once and sends it to every worker it
// starts: {kind: "module", module}. Then messages: {id, kind: "analyze",
// data, options, edits, helpers} (answered by the module's workspace, with
// the help of that many other workers for a Monte Carlo estimate: see farm
// below), {id, kind: "page", list, offset, count[, measure]} (measure: the
// index of a battery's measure), {id, kind: "link", data, options, edits},
// {id, kind: "results-link"[, measure]} (of the last analysis, or of one
// measure of its battery), {id, kind: "open-link", fragment} and {id, kind: "text-file", bytes} (a text file
// that is not UTF-8, made UTF-8), {id, kind: "sheet",
// bytes, sheet}; replies: {id, json}, for a sheet
// {id, json, text} with the sheet's text as UTF-8 bytes (handed over, not
// copied), and for an analysis that answered
// {id, json, tables, shared} with the module's tables of results of that very
// analysis and, with small groups protected, its results as shared (package
// findings). For "analyze" the preview of the text comes
// first, {id, kind: "preview", json}, and {id, kind: "progress", stage, done,
// total} during long computations. When the module itself fails, the reply
// is {id, kind: "failed", message}. Served, it loads wasm_exec.js; in the
// single-file build it runs from a blob: URL with wasm_exec.js prepended.
const fromBlob = self.location.protocol === "blob:";
if (!fromBlob) importScripts("wasm_exec.js");

// ready settles once the module has come from the page and runs; requests
// that arrive before it wait for it.
let begin;
const ready = new Promise((resolve) => { begin = resolve; }).then(async (module) => {
  const arrived = performance.now();
  const go = new Go();
  const instance = await WebAssembly.instantiate(module, go.importObject);
  go.run(instance); // main registers globalThis.midrank, then waits for calls
  const m = globalThis.midrank;
  postMessage({ kind: "ready", version: m.version, defaults: JSON.parse(m.defaults), limits: JSON.parse(m.limits), menus: JSON.parse(m.menus), ms: performance.now() - arrived });
  return m;
});
ready.catch((err) => postMessage({ kind: "failed", message: String(err) }));

// A load the security policy blocks here would show only in the worker's own
// console; it is passed to the page, which reports it in its console.
self.addEventListener("securitypolicyviolation", (e) =>
  postMessage({ kind: "blocked", what: e.blockedURI + " (" + e.effectiveDirective + ")" }));

// request is the module's options JSON: the settings and the group edits
// (the module leaves out edits naming groups the text does not have).
function request(q) {
  return JSON.stringify({ ...q.options, ...q.edits });
}

// A Monte Carlo estimate is shared with the page's other workers: the
// module hands parts of it to share (a farm, see wasm/farm.go), which the
// page passes to a helper worker as {kind: "mc-part", part, job, from, to}
// and whose count comes back as {kind: "mc-part-done", part, json}. A
// helper answers {kind: "mc-part-done", part, json} with the module's
// monteCarloPart.
const parts = new Map(); // part → {resolve, reject}
let nextPart = 1;

function farm(q) {
  if (!q.helpers) return undefined;
  return {
    helpers: q.helpers,
    share: (job, from, to) => new Promise((resolve, reject) => {
      const part = nextPart++;
      parts.set(part, { resolve, reject });
      postMessage({ id: q.id, kind: "mc-part", part, job, from, to });
    }),
  };
}

onmessage = async (event) => {
  const q = event.data;
  if (q.kind === "module") {
    begin(q.module);
    return;
  }
  if (q.kind === "mc-part-done") { // a helper's count, for the analysis running here
    const waiting = parts.get(q.part);
    parts.delete(q.part);
    const answer = JSON.parse(q.json);
    if (waiting) answer.error ? waiting.reject(answer.error.message) : waiting.resolve(answer.exceed);
    return;
  }
  let json, tables, shared, text;
  try {
    const m = await ready;
    switch (q.kind) {
      case "page":
        json = q.measure === null || q.measure === undefined ? m.page(q.list, q.offset, q.count) : m.page(q.list, q.offset, q.count, q.measure);
        break;
      case "link":
        json = m.link(q.data, request(q));
        break;
      case "results-link":
        json = q.measure === null || q.measure === undefined ? m.resultsLink() : m.resultsLink(q.measure);
        break;
      case "open-link":
        json = m.openLink(q.fragment);
        break;
      case "mc-part": // this worker helps another with its Monte Carlo estimate
        postMessage({ kind: "mc-part-done", part: q.part, json: m.monteCarloPart(q.job, q.from, q.to) });
        return;
      case "sheet": // the text comes as bytes beside the JSON, or an error as JSON alone
      case "text-file": {
        const answer = q.kind === "sheet" ? m.sheet(q.bytes, q.sheet) : m.textFile(q.bytes);
        if (typeof answer === "string") json = answer;
        else ({ json, text } = answer);
        break;
      }
      default:
        json = await m.workspace(typeof q.data === "string" ? new TextEncoder().encode(q.data) : q.data, request(q),
          (preview) => postMessage({ id: q.id, kind: "preview", json: preview }),
          (stage, done, total) => postMessage({ id: q.id, kind: "progress", stage, done, total }), farm(q));
        if (!json.startsWith('{"error"')) {
          tables = m.tables();
          // the results as shared serve the downloads only while small groups are protected
          // (a results-only link is made by the module on request)
          if (Number(q.options.min_group_size) > 0) shared = m.findings();
        }
    }
  } catch (err) {
    // the module stopped (out of memory, a fault in it): the page is told,
    // keeps the text and starts a fresh worker
    postMessage({ id: q.id, kind: "failed", message: String(err && err.message || err) });
    return;
  }
  postMessage({ id: q.id, kind: q.kind, json, tables, shared, text }, text ? [text.buffer] : []);
};
