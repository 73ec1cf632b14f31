// The page: reads the form, asks the worker, and renders the answer through
// the views in js/. It never touches the WebAssembly module itself, and it
// only ever sets user text as text, never as HTML. tools/build bundles it
// with its modules into one script.
import { $, setStatus, showProblem } from "./js/dom.js";
import { createBridge } from "./js/bridge.js";
import { onUpdate, state, update } from "./js/state.js";
import { KEPT, RUNNING, recall, recallWorkspace, remember } from "./js/storage.js";
import { fields, fillMenus, formOptions, setOptions } from "./js/settings.js";
import { dataInput, dataSize, dataText, heldFile, setText, wireInput } from "./js/input.js";
import { renderPreview } from "./js/preview.js";
import { NO_EDITS, UNDO_KEPT, editGroups, renderEditor, undoEdit, whenEdited } from "./js/editor.js";
import { renderResults, setStale } from "./js/results.js";
import { renderBattery, wireBattery } from "./js/battery.js";
import { renderPictures } from "./js/pictures.js";
import { wirePictures } from "./js/savepicture.js";
import { renderLevels } from "./js/levels.js";
import { renderRanks, wireRanks } from "./js/ranks.js";
import { wireReports } from "./js/reports.js";
import { wireShare } from "./js/share.js";
import { SEALED } from "./js/seal.js";
import { sharedResult } from "./js/outgoing.js";

// The single-file build carries the worker's source, the module and the
// demo data in inert text blocks (see tools/internal/sitebuild).
const offline = document.getElementById("worker-source");
const bridge = createBridge(
  offline ? { inline: offline.textContent } : { script: "worker.js", module: "midrank.wasm" },
  offline ? Uint8Array.from(atob($("module-base64").textContent), (c) => c.charCodeAt(0)) : null,
  {
    ready: moduleReady,
    startFailed: setStatus,
    preview: (preview) => update({ preview }),
    progress: (stage, done, total) => {
      const pct = Math.floor(100 * done / total);
      setStatus(({ exact: "Exact distribution", measures: "Measures analysed", trend: "Resamples for the trend" }[stage] ?? "Resamples") + ": " + pct + "%");
      $("progress").value = pct;
      $("progress").hidden = false;
    },
    // parts of Monte Carlo estimates run by helper workers, for the browser tests and make bench-page
    part: () => { document.documentElement.dataset.monteCarloParts = String(Number(document.documentElement.dataset.monteCarloParts || 0) + 1); },
  });

// The demo's text, fetched while the module loads (index.html preloads it).
const demo = offline ? Promise.resolve($("demo-data").textContent) : fetch("demo.tsv").then((r) => r.text());

for (const view of [renderPreview, renderEditor, renderResults, renderBattery, renderLevels, renderPictures, renderRanks]) onUpdate(view);

let started = false;
// Small inputs are analysed again as you type, once typing pauses.
const LIVE_LIMIT = 20000; // characters: larger texts wait for a longer pause in typing
let typingTimer = 0;

// datePrinted puts the version and today's date in the printed pages'
// margin (style.css, @page).
function datePrinted() {
  const line = "Midrank " + $("version").textContent + " \u00b7 printed " + new Date().toISOString().slice(0, 10);
  document.documentElement.style.setProperty("--printed", JSON.stringify(line));
}
addEventListener("beforeprint", datePrinted);

function moduleReady(m) {
  $("version").textContent = m.version;
  datePrinted();
  update({ defaults: m.defaults, limits: m.limits, menus: m.menus });
  fillMenus(m.menus);
  document.documentElement.dataset.moduleReadyMs = String(Math.round(m.ms));
  $("analyse").disabled = false;
  if (started) return;
  started = true;
  setOptions(m.defaults); // kept or linked settings follow in start()
  setStatus("Ready.");
  start();
}

// a reload or a closed tab is not a stop: only a page that dies keeps the flag
addEventListener("pagehide", () => remember(RUNNING, null));

const keptText = $("kept-text").textContent; // what the note says while keeping works

function keep() {
  // a large file is not kept (browsers keep a few megabytes): its settings are
  const kept = remember(KEPT, JSON.stringify({ data: heldFile() ? "" : dataText(), options: formOptions(), edits: state.edits, undoable: state.undoable.slice(-UNDO_KEPT) }));
  $("kept-text").textContent = !kept ? "This browser's storage is full or switched off, so what you type here is not kept: a reload would lose it. Save your text as a file if you need it later."
    : heldFile() ? "The file opened is too large to keep in this browser, so a reload would lose it; your settings are kept." : keptText;
  $("kept-note").classList.toggle("warning", !kept || heldFile());
}

function restoreKept() {
  const kept = recallWorkspace();
  if (!kept) return false;
  setText(kept.data);
  setOptions(kept.options ?? {});
  update({ edits: kept.edits ?? NO_EDITS, undoable: Array.isArray(kept.undoable) ? kept.undoable : [] });
  return kept.data.trim() !== "";
}

// each table knows its name, which the views and reports go by
function named(set) {
  for (const [name, table] of Object.entries(set ?? {})) table.name = name;
  return set;
}

// openLink restores the data and settings a link carries, or shows the
// results a results-only link carries; false when it cannot be opened (the
// message is shown).
async function openLink(fragment) {
  const { body } = await bridge.ask({ kind: "open-link", fragment });
  if (body.error) {
    showProblem(body.error);
    setStatus("The link could not be opened; the page is ready for your own data.");
    return false;
  }
  $("problem").hidden = true;
  if (body.findings) {
    showFindings(body.findings, "#f1." + fragment.slice(4)); // a sealed link comes opened as #r1. of the same bytes
    return true;
  }
  setText(body.data);
  setOptions(body.options, state.defaults);
  update({ edits: { order: body.options.order || [], exclude: body.options.exclude || [], rename: body.options.rename || {} }, undoable: [] });
  $("demo-note").hidden = true;
  analyse();
  return true;
}

// showFindings shows results that came without their data, read-only, with
// the link that passes them on; the text box stays empty for the reader's
// own data, and an analysis of it replaces them.
function showFindings(f, link) {
  setText("");
  $("demo-note").hidden = true;
  setStale(false);
  update({ result: sharedResult(f), tables: named(f.tables), shared: f, sharedTables: named(f.tables), readOnly: true, readOnlyLink: link,
    battery: null, batteryTables: null, batteryShared: null, drill: null, preview: null });
  setStatus("These results came in a link without the data: read, print or save them; paste your own data to analyse it.");
  $("results-title").scrollIntoView({ block: "start" }); // on a narrow screen the empty data box would come first
}

// A fragment that looks like a link of some format ("#r1.", "#s1.", or one
// this version does not know, which the module names in its message).
const LINK_FRAGMENT = /^#[a-z][0-9]{1,3}\./;

async function start() {
  const linked = LINK_FRAGMENT.test(location.hash);
  const kept = !linked && restoreKept();
  if (kept) $("demo-note").hidden = true;
  if (linked) {
    followLink();
    return;
  }
  if (kept && recall(RUNNING)) {
    // the page stopped during the last analysis of this text: not again by itself
    showProblem({ message: "The last analysis of this text did not finish: the page stopped or was closed while it ran. "
      + "It was not started again, so that the page stays usable. Press Analyse to try again; for large data the "
      + "chi-square or Monte Carlo p-value is much lighter than the exact one." });
    setStatus("Waiting for you: press Analyse to run the analysis again.");
    return;
  }
  if (dataText().trim() === "") $("data").value = await demo;
  analyse();
}

// followLink opens the link in the address's fragment and analyses it; a
// sealed link waits for its passphrase.
function followLink() {
  const sealed = location.hash.startsWith(SEALED);
  $("unlock").hidden = !sealed;
  if (!sealed) {
    openLink(location.hash);
    return;
  }
  $("unlock-passphrase").focus();
  setStatus("Enter the passphrase to open the link.");
}

// A link pasted into the address bar of an open tab changes only the
// fragment: it is opened as on a fresh load.
addEventListener("hashchange", () => {
  if (started && LINK_FRAGMENT.test(location.hash)) followLink();
});

// analyse asks for an analysis of the text and settings on the page; the
// latest request wins.
async function analyse() {
  const began = performance.now();
  performance.mark("midrank:asked");
  clearTimeout(typingTimer); // an analysis asked for now makes the one waiting for a pause in typing needless
  setStale(true);
  keep();
  setStatus("Analysing…");
  $("link-box").hidden = true;
  $("cancel").hidden = false;
  remember(RUNNING, "1");
  const reply = await bridge.analyse({ data: dataInput(), options: formOptions(), edits: state.edits });
  if (!reply) return; // a later analysis, or a cancel, took its place
  remember(RUNNING, null);
  $("cancel").hidden = true;
  $("progress").hidden = true;
  const { body, tables, shared } = reply;
  if (body.error) {
    // results of another text (or of none) must not stay on screen
    setStale(false);
    update({ result: null, tables: null, shared: null, sharedTables: null, readOnly: false, battery: null, batteryTables: null, batteryShared: null, drill: null });
    showProblem(body.error);
    return;
  }
  $("problem").hidden = true;
  const answered = performance.now();
  if (body.measures) {
    named({ overview: tables.overview });
    tables.measures.forEach(named);
    if (shared) {
      named({ overview: shared.overview });
      for (const m of shared.measures) if (m) named(m.tables);
    }
    update({ result: null, tables: null, shared: null, sharedTables: null, readOnly: false, battery: body, batteryTables: tables, batteryShared: shared, drill: null });
  } else {
    update({ result: body, tables: named(tables), shared, sharedTables: named(shared && shared.tables), readOnly: false, battery: null, batteryTables: null, batteryShared: null, drill: null });
  }
  setStale(false);
  // how long the last analysis took, for the browser tests' notes and make bench-page
  document.documentElement.dataset.analysisMs = Math.round(answered - began) + "+" + Math.round(performance.now() - answered);
  performance.mark("midrank:shown");
  performance.measure("midrank:analysis", "midrank:asked", "midrank:shown");
  setStatus(body.measures ? "Done: " + body.measures.length + " measures." : "Done: " + body.n + " values in " + body.k + " groups.");
}

function cancel() {
  bridge.cancel();
  remember(RUNNING, null);
  $("cancel").hidden = true;
  $("progress").hidden = true;
  setStatus("Cancelled. The results shown, if any, are from the previous analysis.");
}

// reanalyseSoon marks the results out of date and analyses again after a
// pause, a longer one for texts too large to analyse at every keystroke (not
// with Monte Carlo chosen, whose long runs wait for Analyse).
function reanalyseSoon(pause) {
  setStale(true);
  clearTimeout(typingTimer);
  if ($("pvalue").value !== "monte-carlo") {
    typingTimer = setTimeout(analyse, dataSize() <= LIVE_LIMIT ? pause : Math.max(pause, 1500));
  }
}

whenEdited(() => { keep(); analyse(); });
wireInput((text) => {
  // a new table (a file, a sheet, a large paste) is read afresh: columns chosen for the last one are let go
  $("group").value = "";
  $("measure").value = "";
  setText(text);
  $("demo-note").hidden = true;
  keep();
  analyse();
}, bridge.ask);
wirePictures(() => state.result !== null || state.battery !== null);
wireRanks(bridge.ask);
wireReports();
wireBattery();
wireShare(bridge.ask, openLink);
$("analyse").addEventListener("click", analyse);
$("cancel").addEventListener("click", cancel);
$("data").addEventListener("input", () => { $("demo-note").hidden = true; keep(); reanalyseSoon(400); });
// a changed setting counts at once; a new way of reading the text also shows its preview
for (const f of [...fields, "measures-box"]) $(f).addEventListener("change", () => { keep(); reanalyseSoon(0); });
$("pvalue").addEventListener("change", () => { if ($("pvalue").value === "monte-carlo") bridge.prepare(); });
$("undo").addEventListener("click", () => undoEdit(state));
$("reset-edits").addEventListener("click", () => editGroups(state, NO_EDITS));
$("forget").addEventListener("click", () => {
  remember(KEPT, null);
  setStatus("Nothing is kept in this browser any more; the text on the page stays until you leave it.");
});
