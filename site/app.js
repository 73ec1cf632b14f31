// Page logic: reads the form, talks to the worker, renders the result.
// It never touches the WebAssembly module itself, and it only ever sets
// user text as text, never as HTML.
"use strict";

const PAGE_ROWS = 200;
const $ = (id) => document.getElementById(id);

// The single-file build carries the worker's source, the module and the
// demo data in inert text blocks (see tools/internal/sitebuild).
const offline = document.getElementById("worker-source");
const moduleBytes = offline
  ? Uint8Array.from(atob(document.getElementById("module-base64").textContent), (c) => c.charCodeAt(0))
  : null;
let worker = null;
let started = false;
let nextId = 1;
let latest = 0; // the id of the latest request: older replies are dropped
let result = null;
let rankOffset = 0;
let defaults = {}; // the module's default settings, by request key
let limits = {}; // the module's bounds: text (bytes of a text read), link (characters of a link)
let analysing = false; // an analysis is running in the worker
const pending = new Map();

// The module is compiled once, here, and handed to every worker started, so
// that a Cancel (which starts a fresh worker) costs no second compilation.
const compiled = moduleBytes
  ? WebAssembly.compile(moduleBytes)
  : WebAssembly.compileStreaming(fetch("midrank.wasm"))
    .catch(async () => WebAssembly.compile(await (await fetch("midrank.wasm")).arrayBuffer()));

// startWorker starts a fresh worker; Cancel terminates the old one, since a
// running module cannot be interrupted.
function startWorker() {
  const w = offline
    ? new Worker(URL.createObjectURL(new Blob([offline.textContent], { type: "text/javascript" })))
    : new Worker("worker.js");
  w.onmessage = onWorkerMessage;
  w.onerror = (e) => { e.preventDefault(); if (w === worker) moduleFailed(e.message || "the worker stopped"); };
  compiled.then((module) => w.postMessage({ kind: "module", module }),
    (err) => { $("status").textContent = "The statistics module could not be loaded: " + err; });
  worker = w;
}

// ask sends a request to the worker; the body of the reply is the module's
// JSON, {cancelled: true}, or {failed, error} when the module stopped or
// answered something that is not JSON.
function ask(message) {
  const id = nextId++;
  return new Promise((resolve) => {
    pending.set(id, resolve);
    worker.postMessage({ id, ...message });
  }).then((reply) => {
    let body = reply;
    if (typeof reply === "string") {
      try {
        body = JSON.parse(reply);
      } catch (err) {
        body = { failed: "its answer could not be read (" + err.message + ")" };
      }
    }
    if (body.failed) {
      body.error = { message: "The statistics module stopped: " + body.failed + ". Your text and settings are kept, and the module was started again; "
        + "for data this large, try the chi-square or Monte Carlo p-value, or fewer values." };
    }
    return { id, body };
  });
}

// moduleFailed answers every waiting request with the failure and starts a
// fresh worker: the text and settings on the page stay as they are.
function moduleFailed(message) {
  const waiting = [...pending.values()];
  pending.clear();
  worker.terminate();
  analysing = false;
  startWorker();
  for (const resolve of waiting) resolve({ failed: message });
}

function onWorkerMessage(event) {
  const m = event.data;
  if (m.kind === "ready") {
    $("version").textContent = m.version;
    defaults = m.defaults;
    limits = m.limits;
    fillMenus(m.menus);
    document.documentElement.dataset.moduleReadyMs = String(Math.round(m.ms));
    $("analyse").disabled = false;
    if (!started) {
      started = true;
      for (const f of fields) $(f).value = String(defaults[f]); // kept or linked settings follow in start()
      $("status").textContent = "Ready.";
      start();
    }
    return;
  }
  if (m.kind === "failed" && m.id === undefined) {
    $("status").textContent = "The statistics module could not start: " + m.message;
    return;
  }
  if (m.kind === "failed" && m.id !== undefined) {
    moduleFailed(m.message);
    return;
  }
  if (m.kind === "blocked") {
    console.error("Content Security Policy blocked a load in the worker: " + m.what);
    return;
  }
  if (m.kind === "preview") {
    if (m.id === latest) showPreview(JSON.parse(m.json));
    return;
  }
  if (m.kind === "progress") {
    if (m.id === latest) {
      const what = m.stage === "exact" ? "Exact distribution" : "Random deals";
      const pct = Math.floor(100 * m.done / m.total);
      $("status").textContent = what + ": " + pct + "%";
      $("progress").value = pct;
      $("progress").hidden = false;
    }
    return;
  }
  const resolve = pending.get(m.id);
  pending.delete(m.id);
  if (resolve) resolve(m.json);
}

startWorker();

// fillMenus puts the methods the module offers into their menus, once:
// the module owns their keys and the words shown.
function fillMenus(menus) {
  for (const [option, choices] of Object.entries(menus)) {
    const select = $(option);
    if (select.options.length) continue;
    select.append(...choices.map((c) => new Option(c.label, c.key)));
  }
}

// restartWorker stops the worker, whatever it is doing, and starts a fresh
// one; requests waiting for it are answered as cancelled.
function restartWorker() {
  worker.terminate();
  for (const resolve of pending.values()) resolve(JSON.stringify({ cancelled: true }));
  pending.clear();
  latest = nextId++; // any reply still on its way is stale
  analysing = false;
  startWorker();
}

function cancel() {
  restartWorker();
  $("cancel").hidden = true;
  $("progress").hidden = true;
  $("status").textContent = "Cancelled. The results shown, if any, are from the previous analysis.";
}

// The settings on the form, by request key.
const fields = ["layout", "separator", "decimal", "alpha", "pvalue", "resamples", "seed", "posthoc", "adjust"];
const numeric = new Set(["alpha", "resamples", "seed"]);

function formOptions() {
  const options = {};
  for (const f of fields) options[f] = numeric.has(f) ? Number($(f).value) : $(f).value;
  return options;
}

// A large text (pasted, opened or dropped) is held here instead of in the
// text box: laying out a box of 100,000 lines costs the browser seconds. The
// preview shows it as cells, and it can be put in the box on request.
const HOLD_LIMIT = 256 * 1024; // characters
let heldText = null;

function dataText() {
  return heldText ?? $("data").value;
}

function setText(text) {
  const hold = text.length > HOLD_LIMIT;
  heldText = hold ? text : null;
  $("data").value = hold ? "" : text;
  $("data").hidden = hold;
  $("held").hidden = !hold;
  if (hold) {
    let lines = 1;
    for (let i = text.indexOf("\n"); i >= 0 && i < text.length - 1; i = text.indexOf("\n", i + 1)) lines++;
    $("held-note").textContent = "The text (" + lines.toLocaleString() + " lines, " + (text.length / 1e6).toFixed(1)
      + " million characters) is held in this tab rather than shown in the box, which would be slow. Its first lines are shown as cells below.";
  }
}

function showHeldAsText() {
  const text = heldText;
  heldText = null;
  $("held").hidden = true;
  $("data").hidden = false;
  $("data").value = text;
}

// What the user typed and chose is kept in this browser's own storage,
// on this computer only, so that a reload loses nothing.
const KEPT = "midrank.workspace.v1";

// RUNNING is set while an analysis runs: found on a load, it means that the
// page died during the last analysis (out of memory, a crashed tab), so the
// kept text is not analysed again by itself.
const RUNNING = "midrank.running.v1";
// a reload or a closed tab is not a stop: only a page that dies keeps the flag
addEventListener("pagehide", () => remember(RUNNING, null));

const keptText = $("kept-text").textContent; // what the note says while keeping works

function keep() {
  const kept = remember(KEPT, JSON.stringify({ data: dataText(), options: formOptions(), edits, undoable: undoable.slice(-UNDO_KEPT) }));
  $("kept-text").textContent = kept ? keptText
    : "This browser's storage is full or switched off, so what you type here is not kept: a reload would lose it. Save your text as a file if you need it later.";
  $("kept-note").classList.toggle("warning", !kept);
}

// remember sets (or, with null, removes) an item of this browser's storage;
// false when the storage refuses (full, or switched off).
function remember(key, value) {
  try {
    if (value === null) localStorage.removeItem(key);
    else localStorage.setItem(key, value);
    return true;
  } catch {
    return false;
  }
}

// recall reads an item of this browser's storage; null when there is none
// or the storage is switched off.
function recall(key) {
  try {
    return localStorage.getItem(key);
  } catch {
    return null;
  }
}

function restoreKept() {
  try {
    const kept = JSON.parse(recall(KEPT) || "null");
    if (!kept) return false;
    setText(kept.data);
    for (const f of fields) if (kept.options[f] !== undefined) $(f).value = String(kept.options[f]);
    if (kept.edits) edits = kept.edits;
    if (Array.isArray(kept.undoable)) undoable = kept.undoable;
    return kept.data.trim() !== "";
  } catch {
    return false;
  }
}

// Sealed links (#s1.) wrap the plain link's DEFLATE bytes in AES-256-GCM
// under a key from PBKDF2-HMAC-SHA-256 (600,000 rounds), the format of Go's
// core/sealed, here with the browser's own Web Crypto.
const SEALED = "#s1.";
const ITERATIONS = 600000;

function fromBase64url(s) {
  s = s.replace(/-/g, "+").replace(/_/g, "/");
  while (s.length % 4) s += "=";
  return Uint8Array.from(atob(s), (c) => c.charCodeAt(0));
}

function toBase64url(bytes) {
  let s = "";
  for (let i = 0; i < bytes.length; i += 0x8000) s += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(s).replace(/\+/g, "-").replace(/\//g, "_").replace(/=+$/, "");
}

async function sealingKey(passphrase, salt) {
  if (!globalThis.crypto || !crypto.subtle) {
    throw new Error("passphrase links need the page opened over HTTPS, from this computer or from a file");
  }
  const base = await crypto.subtle.importKey("raw", new TextEncoder().encode(passphrase), "PBKDF2", false, ["deriveKey"]);
  return crypto.subtle.deriveKey({ name: "PBKDF2", hash: "SHA-256", salt, iterations: ITERATIONS }, base,
    { name: "AES-GCM", length: 256 }, false, ["encrypt", "decrypt"]);
}

async function seal(plainLink, passphrase) {
  const packed = fromBase64url(plainLink.slice("#r1.".length));
  const head = crypto.getRandomValues(new Uint8Array(28)); // salt (16) and nonce (12)
  const key = await sealingKey(passphrase, head.subarray(0, 16));
  const sealed = new Uint8Array(await crypto.subtle.encrypt(
    { name: "AES-GCM", iv: head.subarray(16), additionalData: new TextEncoder().encode(SEALED) }, key, packed));
  const out = new Uint8Array(head.length + sealed.length);
  out.set(head);
  out.set(sealed, head.length);
  return SEALED + toBase64url(out);
}

async function unseal(fragment, passphrase) {
  if (fragment.length > limits.link) throw new Error("the link cannot be opened: it is longer than " + limits.link + " characters");
  let raw;
  try {
    raw = fromBase64url(fragment.slice(SEALED.length));
  } catch {
    throw new Error("the link cannot be opened: it is damaged; it may have been cut or changed in transit");
  }
  if (raw.length < 28 + 16) throw new Error("the link cannot be opened: it is damaged; it may have been cut or changed in transit");
  const key = await sealingKey(passphrase, raw.subarray(0, 16));
  try {
    const packed = await crypto.subtle.decrypt(
      { name: "AES-GCM", iv: raw.subarray(16, 28), additionalData: new TextEncoder().encode(SEALED) }, key, raw.subarray(28));
    return "#r1." + toBase64url(new Uint8Array(packed));
  } catch {
    throw new Error("the link cannot be opened: the passphrase does not open it, or the link was changed");
  }
}

// openLink restores the data and settings a link carries; false when it
// cannot be opened (the message is shown).
async function openLink(fragment) {
  const { body } = await ask({ kind: "open-link", fragment });
  if (body.error) {
    showProblem(body.error);
    $("status").textContent = "The link could not be opened; the page is ready for your own data.";
    return false;
  }
  $("problem").hidden = true;
  setText(body.data);
  for (const f of fields) $(f).value = String(body.options[f] ?? defaults[f]);
  edits = { order: body.options.order || [], exclude: body.options.exclude || [], rename: body.options.rename || {} };
  undoable = [];
  $("demo-note").hidden = true;
  return true;
}

// A fragment that looks like a link of some format ("#r1.", "#s1.", or one
// this version does not know, which the module names in its message).
const LINK_FRAGMENT = /^#[a-z][0-9]{1,3}\./;

async function start() {
  const linked = LINK_FRAGMENT.test(location.hash);
  const kept = !linked && restoreKept();
  if (kept) $("demo-note").hidden = true;
  if (linked) {
    await followLink();
    return;
  }
  if (kept && recall(RUNNING)) {
    // the page stopped during the last analysis of this text: not again by itself
    showProblem({ message: "The last analysis of this text did not finish: the page stopped or was closed while it ran. "
      + "It was not started again, so that the page stays usable. Press Analyse to try again; for large data the "
      + "chi-square or Monte Carlo p-value is much lighter than the exact one." });
    $("status").textContent = "Waiting for you: press Analyse to run the analysis again.";
    return;
  }
  if (dataText().trim() === "") {
    $("data").value = offline
      ? document.getElementById("demo-data").textContent
      : await (await fetch("demo.tsv")).text();
  }
  analyse();
}

// followLink opens the link in the address's fragment and analyses it; a
// sealed link waits for its passphrase.
async function followLink() {
  $("unlock").hidden = true;
  if (location.hash.startsWith(SEALED)) {
    $("unlock").hidden = false;
    $("unlock-passphrase").focus();
    $("status").textContent = "Enter the passphrase to open the link.";
    return;
  }
  if (await openLink(location.hash)) analyse();
}

// A link pasted into the address bar of an open tab changes only the
// fragment: it is opened as on a fresh load.
addEventListener("hashchange", () => {
  if (started && LINK_FRAGMENT.test(location.hash)) followLink();
});

// setStale marks the results on screen as not from the text and settings
// now on the page (or clears the mark): greyed out, with a note, and nothing
// in them can be copied, downloaded or linked until a new analysis answers.
function setStale(stale) {
  const results = $("results");
  stale = stale && !results.hidden;
  results.classList.toggle("stale", stale);
  $("stale-note").hidden = !stale;
  for (const el of results.children) if (el.id !== "stale-note") el.inert = stale;
}

async function analyse() {
  const began = performance.now();
  const options = formOptions();
  setStale(true);
  keep();
  $("status").textContent = "Analysing…";
  $("link-box").hidden = true;
  $("cancel").hidden = false;
  // the latest request wins: one still running is stopped, not waited for
  if (analysing) restartWorker();
  analysing = true;
  latest = nextId; // the id ask is about to use: progress of older runs is ignored
  remember(RUNNING, "1");
  const { id, body } = await ask({ kind: "analyze", data: dataText(), options, edits });
  if (id !== latest) return;
  remember(RUNNING, null);
  if (body.cancelled) return;
  analysing = false;
  $("cancel").hidden = true;
  $("progress").hidden = true;
  if (body.error) {
    // results of another text (or of none) must not stay on screen
    result = null;
    setStale(false);
    $("results").hidden = true;
    showProblem(body.error);
    return;
  }
  $("problem").hidden = true;
  result = body;
  const answered = performance.now();
  render();
  setStale(false);
  // how long the last analysis took, for the browser tests' notes
  document.documentElement.dataset.analysisMs = Math.round(answered - began) + "+" + Math.round(performance.now() - answered);
  $("status").textContent = "Done: " + result.n + " values in " + result.k + " groups.";
}

function showProblem(error) {
  const p = $("problem");
  p.textContent = error.message;
  p.hidden = false;
  $("status").textContent = "The data could not be analysed.";
}

// The preview shows how the text was read: the first lines as cells, every
// unreadable cell marked and listed with the core's message, and the groups
// with their edits.
const separatorNames = { tab: "tab-separated", semicolon: "semicolon-separated", comma: "comma-separated" };
const layoutNames = { wide: "one column per group", long: "group, value per row" };
let previewGroups = []; // the groups of the text as written, in text order

function showPreview(p) {
  const input = p.input;
  $("read-as").textContent = !input.layout ? "it could not be read"
    : layoutNames[input.layout] + ", " + separatorNames[input.separator] + ", decimal " + input.decimal_mark
      + (p.groups.length ? ", " + p.groups.length + " groups" : "")
      + (p.problems.length ? ", " + p.problems.length + (p.problems.length === 1 ? " cell" : " cells") + " to correct" : "");
  const marks = new Map(); // "line:column" → message
  for (const q of p.problems) if (q.line && q.column) marks.set(q.line + ":" + q.column, q.message);
  const width = Math.max(1, ...p.rows.map((r) => r.cells.length));
  const headed = input.layout === "wide" || input.header;
  $("preview-rows").replaceChildren(...p.rows.map((r, i) => {
    const tr = document.createElement("tr");
    if (i === 0 && headed) tr.className = "head";
    const th = document.createElement("th");
    th.scope = "row";
    th.textContent = String(r.line);
    tr.append(th);
    for (let c = 0; c < width; c++) {
      const td = document.createElement("td");
      td.textContent = r.cells[c] ?? "";
      const message = marks.get(r.line + ":" + (c + 1));
      if (message) {
        td.className = "bad";
        td.title = message;
        td.setAttribute("aria-label", (r.cells[c] ?? "") + " — " + message);
      }
      tr.append(td);
    }
    return tr;
  }));
  const problems = p.problems.length ? p.problems : p.message ? [{ message: p.message }] : [];
  $("problem-list").replaceChildren(...problems.map((q) => {
    const li = document.createElement("li");
    if (q.line) {
      const b = document.createElement("button");
      b.type = "button";
      b.className = "quiet";
      b.textContent = q.message;
      b.title = "Select line " + q.line + " in the text";
      b.addEventListener("click", () => selectLine(q.line));
      li.append(b);
    } else {
      li.textContent = q.message;
    }
    return li;
  }));
  previewGroups = p.groups;
  showEditor();
}

// selectLine selects a line of the text box, so a marked cell is found at once.
function selectLine(line) {
  if (heldText !== null) showHeldAsText();
  const text = dataText();
  let start = 0;
  for (let l = 1; l < line && start >= 0; l++) start = text.indexOf("\n", start) + 1 || -1;
  if (start < 0) return;
  const end = text.indexOf("\n", start);
  const box = $("data");
  box.focus();
  box.setSelectionRange(start, end < 0 ? text.length : end);
}

// Group edits (order, groups left out, names) live beside the text: the text
// is never rewritten. Each change can be undone; all of it is kept.
let edits = { order: [], exclude: [], rename: {} };
let undoable = []; // earlier edits, newest last
const UNDO_KEPT = 50;

// shownOrder is the order of the text's groups after the edits.
function shownOrder() {
  const labels = previewGroups.map((g) => g.label);
  const first = edits.order.filter((l) => labels.includes(l));
  return first.concat(labels.filter((l) => !first.includes(l)));
}

function changeEdits(next) {
  undoable.push(edits);
  if (undoable.length > UNDO_KEPT) undoable.shift();
  edits = next;
  keep();
  showEditor();
  analyse();
}

function showEditor() {
  const order = shownOrder();
  $("editor-box").hidden = order.length === 0;
  $("undo").disabled = undoable.length === 0;
  const byLabel = new Map(previewGroups.map((g) => [g.label, g]));
  $("editor-rows").replaceChildren(...order.map((label, i) => {
    const g = byLabel.get(label);
    const tr = document.createElement("tr");
    const included = !edits.exclude.includes(label);
    if (!included) tr.className = "left-out";
    const cell = (child) => { const td = document.createElement("td"); td.append(child); tr.append(td); return td; };
    const box = document.createElement("input");
    box.type = "checkbox";
    box.checked = included;
    box.setAttribute("aria-label", "Include " + label + " in the test");
    box.addEventListener("change", () => changeEdits({ ...edits,
      exclude: box.checked ? edits.exclude.filter((l) => l !== label) : edits.exclude.concat([label]) }));
    cell(box);
    cell(document.createTextNode(label));
    const name = document.createElement("input");
    name.type = "text";
    name.value = edits.rename[label] || "";
    name.placeholder = label;
    name.setAttribute("aria-label", "Name to show for " + label);
    name.addEventListener("change", () => {
      const rename = { ...edits.rename };
      if (name.value.trim() === "" || name.value === label) delete rename[label];
      else rename[label] = name.value;
      changeEdits({ ...edits, rename });
    });
    cell(name);
    cell(document.createTextNode(String(g.n)));
    cell(document.createTextNode(String(g.missing)));
    const moves = cell(document.createTextNode(""));
    for (const [text, by, words] of [["↑", -1, "up"], ["↓", 1, "down"]]) {
      const b = document.createElement("button");
      b.type = "button";
      b.className = "quiet move";
      b.textContent = text;
      b.setAttribute("aria-label", "Move " + label + " " + words);
      b.disabled = i + by < 0 || i + by >= order.length;
      b.addEventListener("click", () => {
        const next = order.slice();
        [next[i], next[i + by]] = [next[i + by], next[i]];
        changeEdits({ ...edits, order: next });
        document.querySelector('[aria-label="' + CSS.escape("Move " + label + " " + words) + '"]')?.focus();
      });
      moves.append(b);
    }
    return tr;
  }));
}

$("undo").addEventListener("click", () => {
  if (undoable.length === 0) return;
  edits = undoable.pop();
  keep();
  showEditor();
  analyse();
});
$("reset-edits").addEventListener("click", () => changeEdits({ order: [], exclude: [], rename: {} }));

// fmt shows a figure with four significant digits, switching to powers of
// ten only for very small or very large numbers.
function fmt(v) {
  if (v === null || v === undefined) return "undefined";
  const a = Math.abs(v);
  if (a !== 0 && (a < 1e-4 || a >= 1e6)) return v.toExponential(3);
  return String(Number(v.toPrecision(4)));
}

function fmtP(p) {
  return p < 1e-4 ? p.toExponential(2) : String(Number(p.toPrecision(3)));
}

const methodNames = { asymptotic: "chi-square approximation", exact: "exact permutation", "monte-carlo": "Monte Carlo" };

function render() {
  const r = result;
  $("results").hidden = false;
  $("decision").textContent = r.decision;
  setFigure("h", fmt(r.h));
  setFigure("df", String(r.df));
  setFigure("p_value", fmtP(r.p_value));
  setFigure("p_method", methodNames[r.p_method] || r.p_method);
  setFigure("critical_value", fmt(r.critical_value));
  setFigure("exact_critical_value", r.p_method !== "exact" ? "not computed"
    : r.exact_critical_value === null ? "none reachable" : fmt(r.exact_critical_value));
  let reason = r.p_method_reason;
  if (r.monte_carlo) {
    reason += " 99% interval for p: " + fmtP(r.monte_carlo.ci_low) + " to " + fmtP(r.monte_carlo.ci_high) + ".";
  }
  $("method-reason").textContent = reason;
  setFigure("epsilon_squared", fmt(r.epsilon_squared));
  setFigure("eta_squared", fmt(r.eta_squared));
  setFigure("tie_correction", fmt(r.tie_correction));
  setFigure("h_uncorrected", fmt(r.h_uncorrected));
  $("epsilon-word").textContent = "(" + r.epsilon_squared_size + ")";
  $("eta-word").textContent = r.eta_squared_size ? "(" + r.eta_squared_size + ")" : "";

  const letters = r.posthoc ? r.posthoc.letters : {};
  const rows = r.groups.map((g) => row([g.label, g.n, g.missing, fmt(g.median), fmt(g.q1), fmt(g.q3),
    fmt(g.min), fmt(g.max), fmt(g.mean_rank), fmt(g.rank_sum), letters[g.label] || ""]));
  $("group-rows").replaceChildren(...rows);
  showPairs();

  const notes = r.warnings.map((w) => { const li = document.createElement("li"); li.textContent = w; return li; });
  $("notes").replaceChildren(...notes);
  $("notes-box").hidden = notes.length === 0;

  showTies();
  rankOffset = 0;
  showRanks();
  drawValues();
  drawMeanRanks();
}

// Pictures are SVG drawn from the core's numbers. The palette is Okabe &
// Ito's (2008), safe for colour-blind readers, and every group also has its
// own marker shape, so the pictures read in grey print too.
const MAX_MARKERS = 5000; // beyond this many values the picture shows the boxes only
// Okabe & Ito's black is the text colour here, so that it shows in dark mode
// too; every marker and bar has a thin outline in the text colour, so that
// the light colours (yellow, sky blue) stand out from the paper (WCAG 1.4.11).
const PALETTE = ["#0072B2", "#D55E00", "#009E73", "#CC79A7", "#E69F00", "#56B4E9", "currentColor", "#F0E442"];
const OUTLINE = { stroke: "currentColor", "stroke-width": 0.7 };
const SVG = "http://www.w3.org/2000/svg";

function svgEl(name, attrs, parent) {
  const el = document.createElementNS(SVG, name);
  for (const [k, v] of Object.entries(attrs)) el.setAttribute(k, String(v));
  if (parent) parent.append(el);
  return el;
}

function svgText(parent, x, y, text, attrs = {}) {
  const t = svgEl("text", { x, y, fill: "currentColor", "font-size": 12, ...attrs }, parent);
  t.textContent = text;
  return t;
}

// marker draws group g's shape at (x, y).
function marker(parent, g, x, y) {
  const colour = PALETTE[g % PALETTE.length];
  const r = 3.2;
  switch (g % 4) {
    case 0: return svgEl("circle", { cx: x, cy: y, r, fill: colour, ...OUTLINE }, parent);
    case 1: return svgEl("rect", { x: x - r, y: y - r, width: 2 * r, height: 2 * r, fill: colour, ...OUTLINE }, parent);
    case 2: return svgEl("path", { d: `M${x},${y - r - 1}L${x + r + 1},${y + r}L${x - r - 1},${y + r}Z`, fill: colour, ...OUTLINE }, parent);
    default: return svgEl("path", { d: `M${x},${y - r - 1}L${x + r + 1},${y}L${x},${y + r + 1}L${x - r - 1},${y}Z`, fill: colour, ...OUTLINE }, parent);
  }
}

function niceTicks(lo, hi, count) {
  const span = hi - lo || 1;
  const step = Math.pow(10, Math.floor(Math.log10(span / count)));
  const unit = [1, 2, 5, 10].map((m) => m * step).find((s) => span / s <= count) || 10 * step;
  const ticks = [];
  for (let v = Math.ceil(lo / unit) * unit; v <= hi + unit / 1e6; v += unit) ticks.push(Number(v.toPrecision(12)));
  return ticks;
}

function drawValues() {
  const r = result;
  const width = 720, height = 320, left = 56, right = 16, top = 16, bottom = 48;
  const lo = Math.min(...r.groups.map((g) => g.min)), hi = Math.max(...r.groups.map((g) => g.max));
  const pad = (hi - lo) * 0.05 || 1;
  const y = (v) => top + (height - top - bottom) * (1 - (v - (lo - pad)) / (hi - lo + 2 * pad));
  const band = (width - left - right) / r.groups.length;
  const svg = svgEl("svg", { viewBox: `0 0 ${width} ${height}`, role: "img", "aria-labelledby": "plot-values-caption" });
  for (const t of niceTicks(lo - pad, hi + pad, 6)) {
    svgEl("line", { x1: left, x2: width - right, y1: y(t), y2: y(t), class: "grid" }, svg);
    svgText(svg, left - 6, y(t) + 4, fmt(t), { "text-anchor": "end" });
  }
  r.groups.forEach((g, i) => {
    const cx = left + band * (i + 0.5), w = Math.min(60, band * 0.5);
    svgEl("line", { x1: cx, x2: cx, y1: y(g.min), y2: y(g.max), stroke: "currentColor" }, svg);
    svgEl("rect", { x: cx - w / 2, y: y(g.q3), width: w, height: Math.max(1, y(g.q1) - y(g.q3)), fill: "none", stroke: "currentColor" }, svg);
    svgEl("line", { x1: cx - w / 2, x2: cx + w / 2, y1: y(g.median), y2: y(g.median), stroke: "currentColor", "stroke-width": 3 }, svg);
    svgText(svg, cx, height - bottom + 18, g.label, { "text-anchor": "middle" });
  });
  const drawEach = r.ranks_complete && r.n <= MAX_MARKERS;
  if (drawEach) {
    // tied values are stacked side by side, others spread by their rank
    const index = new Map(r.groups.map((g, i) => [g.label, i]));
    const seen = new Map();
    for (const v of r.ranks) {
      const i = index.get(v.group);
      const key = i + "\u0000" + v.value;
      const n = seen.get(key) || 0;
      seen.set(key, n + 1);
      const cx = left + band * (i + 0.5) + band * 0.32 + ((n % 6) - 2.5) * 5;
      marker(svg, i, cx, y(v.value));
    }
  }
  svgText(svg, 14, top + (height - top - bottom) / 2, "value", { transform: `rotate(-90 14 ${top + (height - top - bottom) / 2})`, "text-anchor": "middle" });
  $("plot-values").replaceChildren(svg);
  $("plot-values-caption").textContent = "Each group's values: the box runs from the lower to the upper quartile with a thick line at the median, the whisker from the lowest to the highest value" +
    (drawEach ? "; every value is a marker beside its box, tied values side by side." : " (with " + r.n.toLocaleString() + " values, too many to draw each one).");
}

function drawMeanRanks() {
  const r = result;
  const row = 28, left = 120, right = 24, top = 12, bottom = 36;
  const width = 720, height = top + bottom + row * r.groups.length;
  const x = (v) => left + (width - left - right) * (v - 1) / Math.max(1, r.n - 1);
  const svg = svgEl("svg", { viewBox: `0 0 ${width} ${height}`, role: "img", "aria-labelledby": "plot-ranks-caption" });
  for (const t of niceTicks(1, r.n, 6)) {
    svgEl("line", { x1: x(t), x2: x(t), y1: top, y2: height - bottom, class: "grid" }, svg);
    svgText(svg, x(t), height - bottom + 16, fmt(t), { "text-anchor": "middle" });
  }
  const centre = (r.n + 1) / 2;
  r.groups.forEach((g, i) => {
    const cy = top + row * (i + 0.5);
    const from = Math.min(x(centre), x(g.mean_rank));
    svgEl("rect", { x: from, y: cy - 4, width: Math.abs(x(g.mean_rank) - x(centre)), height: 8,
      fill: PALETTE[i % PALETTE.length], ...OUTLINE }, svg);
    marker(svg, i, x(g.mean_rank), cy);
    svgText(svg, left - 8, cy + 4, g.label, { "text-anchor": "end" });
  });
  svgEl("line", { x1: x(centre), x2: x(centre), y1: top, y2: height - bottom, stroke: "currentColor", "stroke-dasharray": "4 3" }, svg);
  svgText(svg, (left + width - right) / 2, height - 4, "mean rank", { "text-anchor": "middle" });
  $("plot-ranks").replaceChildren(svg);
  $("plot-ranks-caption").textContent = "Mean rank of each group, drawn from the dashed line at " + fmt(centre) +
    ", the mean rank every group would have if the groups did not differ. Ranks run from 1 (smallest value) to " + r.n + ".";
}

let pairsSorted = false;

function showPairs() {
  const ph = result.posthoc;
  $("pairs-box").hidden = !ph;
  if (!ph) return;
  $("pairs-hint").textContent = result.significant
    ? "Groups that share a letter in the table above could not be told apart at the chosen level."
    : "The overall test is not significant: these pairwise results are shown for completeness and should not be read as findings.";
  const pairs = ph.pairs.slice();
  if (pairsSorted) pairs.sort((x, y) => x.p_adjusted - y.p_adjusted);
  $("pair-rows").replaceChildren(...pairs.map((p) => row([p.a, p.b, fmt(p.statistic), fmtP(p.p), fmtP(p.p_adjusted),
    p.significant ? "yes" : "", p.probability_of_superiority.toFixed(3), p.cliffs_delta.toFixed(3), fmt(p.hodges_lehmann),
    fmt(p.hodges_lehmann_low) + " to " + fmt(p.hodges_lehmann_high)], p.significant ? "tied" : "")));
  const labels = result.groups.map((g) => g.label);
  const head = document.createElement("tr");
  for (const text of [""].concat(labels)) {
    const th = document.createElement("th");
    th.scope = "col";
    th.textContent = text;
    head.append(th);
  }
  $("matrix-head").replaceChildren(head);
  const cell = new Map(ph.pairs.map((p) => [p.a + "\u0000" + p.b, p]));
  $("matrix-rows").replaceChildren(...labels.map((a) => {
    const tr = document.createElement("tr");
    const th = document.createElement("th");
    th.scope = "row";
    th.textContent = a;
    tr.append(th);
    for (const b of labels) {
      const td = document.createElement("td");
      const p = cell.get(a + "\u0000" + b) || cell.get(b + "\u0000" + a);
      td.textContent = p ? fmtP(p.p_adjusted) : "–";
      if (p && p.significant) td.className = "differ";
      tr.append(td);
    }
    return tr;
  }));
}

function setFigure(key, text) {
  document.querySelector('[data-result="' + key + '"]').textContent = text;
}

function row(cells, className) {
  const tr = document.createElement("tr");
  if (className) tr.className = className;
  for (const c of cells) {
    const td = document.createElement("td");
    td.textContent = String(c);
    tr.append(td);
  }
  return tr;
}

// listPage gives a page of "ranks", "ranked" or "ties": from the result when
// it holds the whole list, else from the module, which keeps the last analysis.
async function listPage(list, offset) {
  const complete = list === "ranks" ? result.ranks_complete : list === "ties" ? result.ties_complete : false;
  if (complete) return result[list].slice(offset, offset + PAGE_ROWS);
  const { body } = await ask({ kind: "page", list, offset, count: PAGE_ROWS });
  return body[list === "ranked" ? "ranks" : list] || [];
}

async function showRanks() {
  const shown = result;
  const order = $("rank-order").value;
  $("rank-caption").textContent = order === "ranked" ? "Values by rank, smallest first; tied values together" : "Values in the order they were read";
  const entries = await listPage(order, rankOffset);
  if (shown !== result) return;
  $("rank-rows").replaceChildren(...entries.map((v) =>
    row([v.line, v.group, fmt(v.value), fmt(v.rank), v.shared], v.shared > 1 ? "tied" : "")));
  const last = Math.min(rankOffset + PAGE_ROWS, result.n);
  $("page-info").textContent = "Rows " + (rankOffset + 1) + "–" + last + " of " + result.n;
  $("prev-page").disabled = rankOffset === 0;
  $("next-page").disabled = last >= result.n;
}

async function showTies() {
  const shown = result;
  const entries = await listPage("ties", 0);
  if (shown !== result) return;
  const rows = entries.map((t) => row([fmt(t.value), t.count]));
  if (result.ties_total === 0) rows.push(row(["none", ""]));
  if (result.ties_total > entries.length) rows.push(row(["… " + (result.ties_total - entries.length) + " more", ""]));
  $("tie-rows").replaceChildren(...rows);
}

$("analyse").addEventListener("click", analyse);
$("data").addEventListener("input", keep);
// a large paste is held rather than laid out in the box (it replaces the box's text)
$("data").addEventListener("paste", (e) => {
  const text = e.clipboardData?.getData("text/plain") ?? "";
  if (text.length <= HOLD_LIMIT) return;
  e.preventDefault();
  setText(text);
  $("demo-note").hidden = true;
  keep();
  analyse();
});
$("held-edit").addEventListener("click", () => { showHeldAsText(); $("data").focus(); });
$("held-clear").addEventListener("click", () => { setText(""); keep(); $("data").focus(); });

// Small inputs are analysed again as you type, once typing pauses.
const LIVE_LIMIT = 20000; // characters: larger texts wait for a longer pause in typing
let typingTimer = 0;

// reanalyseSoon marks the results out of date and analyses again after a
// pause, a longer one for texts too large to analyse at every keystroke (not
// with Monte Carlo chosen, whose long runs wait for Analyse).
function reanalyseSoon(pause) {
  setStale(true);
  clearTimeout(typingTimer);
  if ($("pvalue").value !== "monte-carlo") {
    typingTimer = setTimeout(analyse, dataText().length <= LIVE_LIMIT ? pause : Math.max(pause, 1500));
  }
}
$("data").addEventListener("input", () => reanalyseSoon(400));
// a changed setting counts at once; a new way of reading the text also shows its preview
for (const f of fields) $(f).addEventListener("change", () => { keep(); reanalyseSoon(0); });
$("forget").addEventListener("click", () => {
  localStorage.removeItem(KEPT);
  $("status").textContent = "Nothing is kept in this browser any more; the text on the page stays until you leave it.";
});

// Files are read with the File API in this tab; nothing is sent anywhere.
function readFile(file) {
  if (file.size > limits.text) {
    showProblem({ message: "The file " + file.name + " is " + (file.size / 1048576).toFixed(1) + " MB; the most that is read is "
      + (limits.text / 1048576) + " MB. Save only the group and value columns, or a part of the rows." });
    return;
  }
  const reader = new FileReader();
  reader.onload = () => {
    setText(reader.result);
    $("demo-note").hidden = true;
    keep();
    analyse();
  };
  reader.onerror = () => showProblem({ message: "The file " + file.name + " could not be read: " + reader.error });
  reader.readAsText(file);
}
$("file").addEventListener("change", () => { if ($("file").files[0]) readFile($("file").files[0]); });
for (const target of [$("data"), $("held")]) {
  target.addEventListener("dragover", (e) => { e.preventDefault(); target.classList.add("dropping"); });
  target.addEventListener("dragleave", () => target.classList.remove("dropping"));
  target.addEventListener("drop", (e) => {
    e.preventDefault();
    target.classList.remove("dropping");
    if (e.dataTransfer.files[0]) readFile(e.dataTransfer.files[0]);
  });
}

// Downloads are made in the page from the result: a Blob and a link.
function download(name, type, text) {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = document.createElement("a");
  a.href = url;
  a.download = name;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

// A text cell that a spreadsheet would take for a formula (it begins with
// = + - @, a tab or a carriage return) gets a leading apostrophe, as OWASP's
// guidance on CSV injection advises; numbers are written as they are, so
// that negative values stay numbers.
function csvCell(v) {
  let s = String(v);
  if (typeof v === "string" && /^[=+\-@\t\r]/.test(s)) s = "'" + s;
  return /[",\n\r']/.test(s) ? '"' + s.replace(/"/g, '""') + '"' : s;
}

function csv(rows) {
  return rows.map((r) => r.map(csvCell).join(",")).join("\r\n") + "\r\n";
}

$("save-groups").addEventListener("click", () => {
  if (!result) return;
  const letters = result.posthoc ? result.posthoc.letters : {};
  download("midrank-groups.csv", "text/csv", csv([["group", "values", "missing", "median", "lower_quartile", "upper_quartile",
    "lowest", "highest", "mean_rank", "rank_sum", "letters"]].concat(result.groups.map((g) => [g.label, g.n, g.missing,
    g.median, g.q1, g.q3, g.min, g.max, g.mean_rank, g.rank_sum, letters[g.label] || ""]))));
});
$("save-pairs").addEventListener("click", () => {
  if (!result || !result.posthoc) return;
  download("midrank-pairs.csv", "text/csv", csv([["first", "second", "statistic", "p", "p_adjusted", "significant",
    "probability_of_superiority", "cliffs_delta", "hodges_lehmann", "hodges_lehmann_low", "hodges_lehmann_high"]].concat(
    result.posthoc.pairs.map((p) => [p.a, p.b, p.statistic, p.p, p.p_adjusted, p.significant, p.probability_of_superiority,
      p.cliffs_delta, p.hodges_lehmann, p.hodges_lehmann_low, p.hodges_lehmann_high]))));
});
// svgText serialises a drawn picture as a standalone SVG file.
function svgSource(id) {
  const svg = $(id).querySelector("svg").cloneNode(true);
  svg.setAttribute("xmlns", "http://www.w3.org/2000/svg");
  svg.setAttribute("color", getComputedStyle($(id)).color);
  return '<?xml version="1.0" encoding="UTF-8"?>\n' + new XMLSerializer().serializeToString(svg);
}

for (const button of document.querySelectorAll(".save-svg")) {
  button.addEventListener("click", () => {
    if (result) download("midrank-" + button.dataset.plot + ".svg", "image/svg+xml", svgSource(button.dataset.plot));
  });
}
for (const button of document.querySelectorAll(".save-png")) {
  button.addEventListener("click", () => {
    if (!result) return;
    const id = button.dataset.plot;
    const box = $(id).querySelector("svg").viewBox.baseVal;
    const image = new Image();
    const url = URL.createObjectURL(new Blob([svgSource(id)], { type: "image/svg+xml" }));
    image.onload = () => {
      const canvas = document.createElement("canvas");
      canvas.width = box.width * 2;
      canvas.height = box.height * 2;
      const ctx = canvas.getContext("2d");
      ctx.fillStyle = "#ffffff";
      ctx.fillRect(0, 0, canvas.width, canvas.height);
      ctx.drawImage(image, 0, 0, canvas.width, canvas.height);
      URL.revokeObjectURL(url);
      canvas.toBlob((png) => {
        const a = document.createElement("a");
        a.href = URL.createObjectURL(png);
        a.download = "midrank-" + id + ".png";
        document.body.append(a);
        a.click();
        a.remove();
      }, "image/png");
    };
    image.src = url;
  });
}

// The HTML report is one file with everything inside: figures, tables,
// pictures, settings, version and date. User text is escaped.
function escapeHTML(s) {
  return String(s).replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]);
}

function htmlTable(head, rows) {
  return "<table><thead><tr>" + head.map((h) => "<th>" + escapeHTML(h) + "</th>").join("") + "</tr></thead><tbody>" +
    rows.map((r) => "<tr>" + r.map((c) => "<td>" + escapeHTML(c) + "</td>").join("") + "</tr>").join("") + "</tbody></table>";
}

// groupEditsText says which groups were shown under another name and which
// were left out, for the reports ("" when the groups are as in the text).
function groupEditsText(r) {
  const parts = [];
  const renamed = r.groups.filter((g) => g.label !== g.label_in_data).map((g) => "\u201c" + g.label_in_data + "\u201d is shown as \u201c" + g.label + "\u201d");
  if (renamed.length) parts.push("Renamed: " + renamed.join("; ") + ".");
  const left = r.input.excluded.map((e) => "\u201c" + e.label + "\u201d (" + e.n + " values, " + e.missing + " missing)");
  if (left.length) parts.push("Left out by request: " + left.join("; ") + ".");
  return parts.join(" ");
}

$("save-html").addEventListener("click", () => {
  if (!result) return;
  const r = result;
  const settings = formOptions();
  const letters = r.posthoc ? r.posthoc.letters : {};
  const parts = [
    "<!doctype html><html lang=\"en\"><head><meta charset=\"utf-8\">",
    // the report runs nothing and loads nothing, wherever it is opened
    "<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; style-src 'unsafe-inline'; img-src data:\">",
    "<title>Kruskal–Wallis report</title>",
    "<style>body{font:15px/1.5 system-ui,sans-serif;max-width:60rem;margin:2rem auto;padding:0 1rem;color:#1f2328}",
    "table{border-collapse:collapse;margin:.5rem 0 1rem}th,td{border-bottom:1px solid #d9d4c7;padding:.2rem .6rem;text-align:right}",
    "th:first-child,td:first-child{text-align:left}svg{max-width:100%;height:auto}.note{color:#555d66}</style></head><body>",
    "<h1>Kruskal–Wallis H test</h1>",
    "<p class=\"note\">Made with Midrank " + escapeHTML(r.version) + " on " + new Date().toISOString().slice(0, 10) +
      ". Settings: " + escapeHTML(Object.entries(settings).map(([k, v]) => k + " " + v).join(", ")) + ".</p>",
    groupEditsText(r) ? "<p class=\"note\">" + escapeHTML(groupEditsText(r)) + "</p>" : "",
    "<h2>In plain words</h2><p>" + escapeHTML(r.decision) + "</p>",
    "<h2>Test figures</h2>" + htmlTable(["figure", "value"], [["H, corrected for ties", r.h], ["H before the correction", r.h_uncorrected],
      ["tie correction C", r.tie_correction], ["degrees of freedom", r.df], ["p-value", r.p_value], ["how p was found", r.p_method_reason],
      ["H needed at alpha " + r.alpha + " (chi-square)", r.critical_value],
      ["epsilon squared", r.epsilon_squared + " (" + r.epsilon_squared_size + ")"],
      ["eta squared (H)", r.eta_squared === null ? "undefined" : r.eta_squared + " (" + r.eta_squared_size + ")"]]),
    "<h2>Groups</h2><p class=\"note\">Quartiles: " + escapeHTML(r.quantile_method) + ".</p>" +
      htmlTable(["group", "values", "missing", "median", "lower quartile", "upper quartile", "lowest", "highest", "mean rank", "rank sum", "letters"],
        r.groups.map((g) => [g.label, g.n, g.missing, g.median, g.q1, g.q3, g.min, g.max, g.mean_rank, g.rank_sum, letters[g.label] || ""])),
  ];
  if (r.posthoc) {
    parts.push("<h2>Pairs</h2><p class=\"note\">" + escapeHTML(r.posthoc.method + ", p adjusted by " + r.posthoc.adjust +
      "; two-sided; shift: Hodges–Lehmann with its " + Math.round(100 * r.posthoc.confidence) + "% interval.") + "</p>" +
      htmlTable(["first", "second", "statistic", "p", "adjusted p", "differ", "P(first > second)", "shift", "interval"],
        r.posthoc.pairs.map((p) => [p.a, p.b, p.statistic, p.p, p.p_adjusted, p.significant ? "yes" : "", p.probability_of_superiority,
          p.hodges_lehmann, p.hodges_lehmann_low + " to " + p.hodges_lehmann_high])));
  }
  parts.push("<h2>Pictures</h2>" + svgSource("plot-values").replace(/^<\?xml[^>]*>\n/, "") + "<p class=\"note\">" +
    escapeHTML($("plot-values-caption").textContent) + "</p>" + svgSource("plot-ranks").replace(/^<\?xml[^>]*>\n/, "") +
    "<p class=\"note\">" + escapeHTML($("plot-ranks-caption").textContent) + "</p>");
  if (r.warnings.length) parts.push("<h2>Take note</h2><ul>" + r.warnings.map((w) => "<li>" + escapeHTML(w) + "</li>").join("") + "</ul>");
  parts.push("</body></html>\n");
  download("midrank-report.html", "text/html", parts.join(""));
});

$("save-markdown").addEventListener("click", () => {
  if (!result) return;
  const r = result;
  const md = (cells) => "| " + cells.map(mdText).join(" | ") + " |";
  const lines = ["# Kruskal–Wallis H test", "", "Midrank " + r.version + ", " + new Date().toISOString().slice(0, 10) + ".", "",
    ...(groupEditsText(r) ? [mdText(groupEditsText(r)), ""] : []), mdText(r.decision), "", "## Test figures", "", md(["figure", "value"]), "| --- | --- |",
    md(["H, corrected for ties", r.h]), md(["H before the correction", r.h_uncorrected]), md(["tie correction C", r.tie_correction]),
    md(["degrees of freedom", r.df]), md(["p-value", r.p_value]), md(["how p was found", r.p_method_reason]),
    md(["H needed at alpha " + r.alpha + " (chi-square)", r.critical_value]),
    md(["epsilon squared", r.epsilon_squared + " (" + r.epsilon_squared_size + ")"]),
    md(["eta squared (H)", r.eta_squared === null ? "undefined" : r.eta_squared + " (" + r.eta_squared_size + ")"]),
    "", "## Groups", "", "Quartiles: " + mdText(r.quantile_method) + ".", "",
    md(["group", "values", "missing", "median", "lower quartile", "upper quartile", "mean rank", "rank sum"]),
    "|" + " --- |".repeat(8)].concat(
    r.groups.map((g) => md([g.label, g.n, g.missing, g.median, g.q1, g.q3, g.mean_rank, g.rank_sum])));
  if (r.posthoc) {
    lines.push("", "## Pairs (" + mdText(r.posthoc.method + ", adjusted by " + r.posthoc.adjust) + ")", "",
      md(["first", "second", "statistic", "p", "adjusted p", "P(first > second)", "shift"]),
      "|" + " --- |".repeat(7));
    for (const p of r.posthoc.pairs) {
      lines.push(md([p.a, p.b, p.statistic, p.p, p.p_adjusted, p.probability_of_superiority, p.hodges_lehmann]));
    }
  }
  if (r.warnings.length) lines.push("", "## Take note", "", ...r.warnings.map((w) => "- " + mdText(w)));
  download("midrank-report.md", "text/markdown", lines.join("\n") + "\n");
});

// mdText makes text literal in Markdown: every character that Markdown,
// its table and autolink extensions or the HTML inside it give a meaning is
// escaped with a backslash (CommonMark 0.31, §2.4, backslash escapes; ":",
// "." and "@" stop addresses from becoming links), and a line break becomes
// a space, so that a label can neither start a link, an image or a tag nor
// break a table row. Numbers are written as they are.
function mdText(v) {
  if (typeof v !== "string") return String(v);
  return v.replace(/\r\n|\r|\n/g, " ").replace(/[\\`*_{}\[\]()#+\-.!|<>~&:@$]/g, "\\$&");
}
$("cancel").addEventListener("click", cancel);

// Links longer than this are cut by some mail and chat programs.
const SAFE_LINK = 2000;

$("unlock").addEventListener("submit", async (event) => {
  event.preventDefault();
  $("status").textContent = "Opening the link…";
  let fragment;
  try {
    fragment = await unseal(location.hash, $("unlock-passphrase").value);
  } catch (err) {
    showProblem({ message: err.message });
    $("status").textContent = "The link is still locked.";
    return;
  }
  if (await openLink(fragment)) {
    $("unlock").hidden = true;
    analyse();
  }
});

$("make-link").addEventListener("click", async () => {
  const passphrase = $("link-passphrase").value;
  $("status").textContent = passphrase ? "Sealing the link with the passphrase…" : "Making the link…";
  const { body } = await ask({ kind: "link", data: dataText(), options: formOptions(), edits });
  if (body.error) {
    showProblem(body.error);
    return;
  }
  let fragment = body.link;
  if (passphrase) {
    try {
      fragment = await seal(fragment, passphrase);
    } catch (err) {
      showProblem({ message: "The link could not be sealed: " + err.message + "." });
      return;
    }
  }
  const url = location.href.split("#")[0] + fragment;
  let note = passphrase
    ? "This link contains your data, encrypted (" + url.length.toLocaleString() + " characters): only someone who also has the passphrase can open it. Send the passphrase another way. "
    : "This link contains your data itself (" + url.length.toLocaleString() + " characters): anyone who has it can see the data. ";
  note += "It never reaches a server, because browsers do not send the part after # anywhere.";
  $("status").textContent = "The link is ready.";
  if (url.length > SAFE_LINK) note += " It is longer than " + SAFE_LINK.toLocaleString() + " characters, which some mail and chat programs cut: send it as a file or check that it arrives whole.";
  $("link-note").textContent = note;
  $("link-text").value = url;
  $("link-box").hidden = false;
});
$("copy-link").addEventListener("click", async () => {
  try {
    await navigator.clipboard.writeText($("link-text").value);
    $("status").textContent = "The link is on the clipboard.";
  } catch {
    $("link-text").select();
    $("status").textContent = "Copying was refused by the browser; the link is selected, copy it by hand.";
  }
});
$("sort-pairs").addEventListener("click", () => { pairsSorted = !pairsSorted; showPairs(); });
$("rank-order").addEventListener("change", () => { rankOffset = 0; showRanks(); });
$("prev-page").addEventListener("click", () => { rankOffset = Math.max(0, rankOffset - PAGE_ROWS); showRanks(); });
$("next-page").addEventListener("click", () => { rankOffset += PAGE_ROWS; showRanks(); });
$("copy-decision").addEventListener("click", async () => {
  try {
    await navigator.clipboard.writeText($("decision").textContent);
    $("status").textContent = "The paragraph is on the clipboard.";
  } catch {
    $("status").textContent = "Copying was refused by the browser; select the paragraph and copy it by hand.";
  }
});
