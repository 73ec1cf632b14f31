// The bridge to the worker that runs the statistics module. It knows no
// element of the page: it starts the worker, sends requests, lets the
// latest analysis win (a new one stops a running one), cancels by
// terminating the worker, and answers every request with its id. A Monte
// Carlo estimate is shared with helper workers, one for each other core,
// started when Monte Carlo is chosen or first needed: the worker asks for a
// part, the bridge hands it to a helper and the count back to the worker.

// LARGE_TEXT is the length, in characters (or bytes), from which a text's analysis
// leaves the worker's memory large (about 1 million values).
const LARGE_TEXT = 16e6;

// failedBody is the reply when the module stopped or its answer cannot be read.
function failedBody(why) {
  return { failed: why, error: { message: "The statistics module stopped: " + why + ". Your text and settings are kept, and the module was started again; "
    + "for data this large, try the chi-square or Monte Carlo p-value, or fewer values." } };
}

function parse(text) {
  if (typeof text !== "string") return text;
  try {
    return JSON.parse(text);
  } catch (err) {
    return { failed: "its answer could not be read (" + err.message + ")" };
  }
}

// createBridge starts the worker. source: {script} (served: the worker's
// file name) or {inline} (the single-file build: the worker's source text,
// with moduleBytes). on: {ready(info), startFailed(message), preview(json),
// progress(stage, done, total)}, called for the latest analysis only, and
// part(), told of each part of a Monte Carlo estimate handed to a helper.
export function createBridge(source, moduleBytes, on) {
  let worker = null;
  let nextId = 1;
  let latest = 0; // the id of the latest analysis: replies and progress of older ones are dropped
  let running = false; // an analysis is running in the worker
  let heavy = false; // the worker's memory holds a large text's analysis
  const pending = new Map();
  // HELPERS share a Monte Carlo estimate with the worker: one for each other core, at most 7
  const HELPERS = Math.max(0, Math.min(7, (navigator.hardwareConcurrency || 1) - 1));
  let helpers = []; // started when first asked for a part: {worker, busy}
  const queued = []; // parts waiting for a helper

  // The module is compiled once, here, and handed to every worker started,
  // so that a Cancel (which starts a fresh worker) costs no second compilation.
  const compiled = moduleBytes
    ? WebAssembly.compile(moduleBytes)
    : WebAssembly.compileStreaming(fetch(source.module))
      .catch(async () => WebAssembly.compile(await (await fetch(source.module)).arrayBuffer()));

  // spawn starts a worker with the compiled module.
  function spawn(onmessage) {
    const w = source.inline
      ? new Worker(URL.createObjectURL(new Blob([source.inline], { type: "text/javascript" })))
      : new Worker(source.script);
    w.onmessage = onmessage;
    compiled.then((module) => w.postMessage({ kind: "module", module }),
      (err) => on.startFailed("The statistics module could not be loaded: " + err));
    return w;
  }

  function start() {
    const w = spawn(receive);
    w.onerror = (e) => { e.preventDefault(); if (w === worker) failed(e.message || "the worker stopped"); };
    worker = w;
  }

  // prepare starts the helpers, unless they run: when Monte Carlo is
  // chosen, so that its first estimate does not wait for them to start
  // (each holds a copy of the module's memory, so not before).
  function prepare() {
    if (helpers.length > 0) return;
    for (let i = 0; i < HELPERS; i++) {
      const helper = { worker: null, busy: null };
      helper.worker = spawn((event) => helped(helper, event.data));
      helper.worker.onerror = (e) => { e.preventDefault(); helped(helper, { kind: "failed", message: e.message || "a helper stopped" }); };
      helpers.push(helper);
    }
  }

  // share hands a part of a Monte Carlo estimate to an idle helper, starting
  // the helpers when first needed; a part waits while every helper is busy.
  function share(part) {
    prepare();
    const idle = helpers.find((h) => !h.busy);
    if (!idle) {
      queued.push(part);
      return;
    }
    idle.busy = part;
    idle.worker.postMessage(part);
    on.part?.();
  }

  // helped passes a helper's count (or its failure) to the worker and gives
  // the helper the next part waiting.
  // A helper that fails is ended and let go (its part, if any, fails the
  // analysis); the others take the parts still waiting.
  function helped(helper, m) {
    if (m.kind !== "mc-part-done" && m.kind !== "failed") return;
    const part = helper.busy;
    helper.busy = null;
    if (m.kind === "failed") {
      helper.worker.terminate();
      helpers = helpers.filter((h) => h !== helper);
    }
    if (part) worker.postMessage({ kind: "mc-part-done", part: part.part, json: m.kind === "failed" ? JSON.stringify({ error: { message: m.message } }) : m.json });
    if (queued.length && helpers.length) share(queued.shift());
    else if (queued.length) for (const p of queued.splice(0)) worker.postMessage({ kind: "mc-part-done", part: p.part, json: JSON.stringify({ error: { message: "no helper worker is left" } }) });
  }

  // stopHelpers ends the helpers, whatever they are computing (for an
  // analysis that is stopped); new ones start when next needed.
  function stopHelpers() {
    for (const h of helpers) h.worker.terminate();
    helpers = [];
    queued.length = 0;
  }

  // failed answers every waiting request with the failure and starts a
  // fresh worker.
  function failed(message) {
    const waiting = [...pending.values()];
    pending.clear();
    worker.terminate();
    stopHelpers();
    running = false;
    start();
    for (const resolve of waiting) resolve({ failed: message });
  }

  function receive(event) {
    const m = event.data;
    switch (m.kind) {
      case "ready":
        on.ready(m);
        return;
      case "failed":
        if (m.id === undefined) on.startFailed("The statistics module could not start: " + m.message);
        else failed(m.message);
        return;
      case "blocked":
        console.error("Content Security Policy blocked a load in the worker: " + m.what);
        return;
      case "preview":
        if (m.id === latest) on.preview(JSON.parse(m.json));
        return;
      case "progress":
        if (m.id === latest) on.progress(m.stage, m.done, m.total);
        return;
      case "mc-part":
        share({ kind: "mc-part", part: m.part, job: m.job, from: m.from, to: m.to });
        return;
    }
    const resolve = pending.get(m.id);
    pending.delete(m.id);
    if (resolve) resolve(m);
  }

  // ask sends a request; the reply is {id, body, tables, shared, text}: body
  // is the module's JSON, {cancelled: true}, or {failed, error} when the
  // module stopped or answered something that is not JSON; tables, with an
  // analysis, are the tables of results, and shared its results as shared
  // (null unless small groups are protected);
  // text, with a sheet, its UTF-8 bytes.
  function ask(message) {
    const id = nextId++;
    return new Promise((resolve) => {
      pending.set(id, resolve);
      worker.postMessage({ id, ...message });
    }).then((reply) => {
      let body = reply.failed ? reply : parse(reply.json);
      if (body.failed) body = failedBody(body.failed);
      const shared = reply.shared ? parse(reply.shared) : null;
      return { id, body, tables: reply.tables ? parse(reply.tables) : null, shared: shared && !shared.error && !shared.failed ? shared : null, text: reply.text };
    });
  }

  // restart stops the worker, whatever it is doing, and starts a fresh one;
  // requests waiting for it are answered as cancelled.
  function restart() {
    worker.terminate();
    stopHelpers();
    for (const resolve of pending.values()) resolve({ json: { cancelled: true } });
    pending.clear();
    latest = nextId++; // any reply still on its way is stale
    running = false;
    start();
  }

  // analyse asks for an analysis that replaces any running one; the reply
  // is null when a later analysis (or a cancel) has taken its place. After
  // a large text the worker is started afresh for the next: a WebAssembly
  // module's memory only grows, and a second large text would otherwise sit
  // on top of the first one's high-water mark.
  async function analyse(message) {
    if (running || (heavy && message.data.length > LARGE_TEXT)) restart();
    heavy = message.data.length > LARGE_TEXT;
    running = true;
    latest = nextId; // the id ask is about to use
    const reply = await ask({ kind: "analyze", helpers: HELPERS, ...message });
    if (reply.id !== latest) return null;
    running = false;
    return reply.body.cancelled ? null : reply;
  }

  start();
  return { ask, analyse, prepare, cancel: restart };
}
