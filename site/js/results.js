// The results: the decision, the test's figures, the trend test, the
// groups, the pairs and the notes, from the module's answer and its tables of results.
import { $ } from "./dom.js";
import { figureList, pageTable } from "./tableview.js";
import { fillReference } from "./settings.js";
import { update } from "./state.js";

// setStale marks the results on screen as not from the text and settings
// now on the page (or clears the mark): greyed out, with a note, and nothing
// in them can be copied, downloaded or linked until a new analysis answers.
export function setStale(stale) {
  const results = $("results"), battery = $("battery");
  const resultsStale = stale && !results.hidden, batteryStale = stale && !battery.hidden;
  results.classList.toggle("stale", resultsStale);
  $("stale-note").hidden = !resultsStale;
  for (const el of results.querySelectorAll(".headline > :not(#stale-note), .details")) el.inert = resultsStale;
  battery.classList.toggle("stale", batteryStale);
  battery.inert = batteryStale;
}

export function renderResults(state, changed) {
  if (!changed.has("result") && !changed.has("pairsSorted")) return;
  const r = state.result;
  $("results").hidden = !r;
  if (!r) return;
  const t = state.tables;
  if (changed.has("result")) {
    if (!r.shared) fillReference(r.groups);
    showSharedNote(state);
    $("decision").textContent = r.decision;
    $("result-line").textContent = r.result_line;
    figureList($("figures"), t.figures);
    $("figures-note").textContent = t.figures.note;
    $("method-reason").textContent = r.p_method_reason;
    $("trend-box").hidden = !t.trend;
    if (t.trend) {
      figureList($("trend-figures"), t.trend);
      $("trend-note").textContent = t.trend.note;
    }
    // groups hidden in what is shared are marked on this private page
    const hidden = new Set(r.protection ? [...r.protection.small, ...r.protection.others] : []);
    pageTable($("groups-table"), t.groups, { rowClass: (values) => hidden.has(values[0]) ? "not-shared" : "" });
    const notes = r.warnings.map((w) => { const li = document.createElement("li"); li.textContent = w; return li; });
    $("notes").replaceChildren(...notes);
    $("notes-box").hidden = notes.length === 0;
  }
  renderPairs(state);
}

// SMALL is the group size under which the page suggests protecting small
// groups before sharing (protect.Worth in the core).
const SMALL = 10;

// showSharedNote says what of the results on screen leaves the tab: at the
// top, that results came without data; beside the sharing, that small
// groups are hidden in what is shared (this page, private, shows
// everything), or a suggestion to protect groups under SMALL values.
function showSharedNote(state) {
  const r = state.result;
  const small = r.shared ? [] : r.groups.filter((g) => g.n < SMALL).map((g) => g.label);
  let top = "", beside = "";
  if (state.readOnly) {
    top = "Results only: these came in a link without the data (Midrank " + r.version + "), so there is nothing to analyse again. " + (r.protection_note || "");
  } else if (r.protection) {
    beside = "Not shared: this page shows you every figure. What you copy, download or link shows the results as shared. " + (state.shared ? state.shared.protection : "");
  } else if (small.length) {
    beside = (small.length === 1 ? "Group " + small[0] + " has" : "Groups " + small.join(", ") + " have") + " fewer than " + SMALL +
      " values. If the results will be shared, consider \u201cProtect small groups in what I share\u201d among the settings: people in a small group can be recognised from its figures.";
  }
  for (const [id, text] of [["shared-note", top], ["protect-note", beside]]) {
    $(id).textContent = text;
    $(id).hidden = text === "";
  }
  document.querySelector(".link-kind").hidden = state.readOnly;
}

// pairsHint says how to read the pairs: by their letters, or as
// comparisons with the reference group, and not as findings when the
// overall test is not significant.
function pairsHint(r) {
  const reference = r.posthoc.reference;
  if (!r.significant) {
    return "The overall test is not significant: these " + (reference === null ? "pairwise results" : "comparisons with " + reference)
      + " are shown for completeness and should not be read as findings.";
  }
  return reference === null ? "Groups that share a letter in the table above could not be told apart at the chosen level."
    : "Each other group was compared with " + reference + " only, so the groups get no letters.";
}

function renderPairs(state) {
  const r = state.result, pairs = state.tables.pairs;
  $("pairs-box").hidden = !pairs;
  if (!pairs) return;
  $("pairs-hint").textContent = pairsHint(r);
  const at = (key) => pairs.columns.findIndex((c) => c.key === key);
  const adjusted = at("p_adjusted"), differ = at("significant");
  const order = [...pairs.values.keys()];
  if (state.pairsSorted && adjusted >= 0) order.sort((x, y) => pairs.values[x][adjusted] - pairs.values[y][adjusted]);
  pageTable($("pairs-table"), pairs, {
    order,
    rowClass: (values) => values[differ] ? "tied" : "",
    heading: (th, c) => {
      if (c.key !== "p_adjusted") return;
      const b = document.createElement("button");
      b.type = "button";
      b.className = "quiet sort";
      b.textContent = c.heading + " ⇅";
      b.setAttribute("aria-label", c.heading + ", press to sort");
      b.addEventListener("click", () => update({ pairsSorted: !state.pairsSorted }));
      th.replaceChildren(b);
    },
  });
  // the matrix shows every pair's adjusted p: with a reference group it
  // would be mostly empty, and results shared with groups protected may have none
  const matrix = r.posthoc.reference === null && adjusted >= 0 && !r.shared;
  $("matrix-box").hidden = !matrix;
  if (matrix) renderMatrix(r, pairs, adjusted, differ);
}

// renderMatrix shows the adjusted p of every pair at a glance.
function renderMatrix(r, pairs, adjusted, differ) {
  const labels = r.groups.map((g) => g.label);
  const head = document.createElement("tr");
  for (const text of [""].concat(labels)) {
    const th = document.createElement("th");
    th.scope = "col";
    th.textContent = text;
    head.append(th);
  }
  $("matrix-head").replaceChildren(head);
  const cell = new Map(pairs.values.map((v, i) => [v[0] + "\u0000" + v[1], i]));
  $("matrix-rows").replaceChildren(...labels.map((a) => {
    const tr = document.createElement("tr");
    const th = document.createElement("th");
    th.scope = "row";
    th.textContent = a;
    tr.append(th);
    for (const b of labels) {
      const td = document.createElement("td");
      const i = cell.get(a + "\u0000" + b) ?? cell.get(b + "\u0000" + a);
      td.textContent = i === undefined ? "–" : pairs.text[i][adjusted];
      if (i !== undefined && pairs.values[i][differ]) td.className = "differ";
      tr.append(td);
    }
    return tr;
  }));
}
