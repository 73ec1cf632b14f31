// Several measures at once: the overview of the battery (the core's table,
// sortable), a picture of where each group lies on each measure, and the
// way into each measure's whole analysis and back.
import { $ } from "./dom.js";
import { protecting } from "./outgoing.js";
import { pageTable } from "./tableview.js";
import { update } from "./state.js";
import { drawAt, label, picture, svgEl, svgText, textWidth } from "./svg.js";

// sortOrder is the overview's row order: as the columns came, by adjusted
// p (smallest first) or by ε² (largest first); rows without a value last.
function sortOrder(table, by) {
  const order = [...table.values.keys()];
  const key = { p: "p_adjusted_across", effect: "epsilon_squared" }[by];
  if (!key) return order;
  const at = table.columns.findIndex((c) => c.key === key);
  const sign = by === "p" ? 1 : -1;
  const value = (i) => table.values[i][at] ?? Infinity * sign;
  return order.sort((x, y) => sign * (value(x) - value(y)));
}

// position is where a group lies among all values of a measure: (mean rank
// − 1) ÷ (N − 1), from 0 (below every other value) to 1 (above them all).
function position(group, n) {
  return n > 1 ? (group.mean_rank - 1) / (n - 1) : 0.5;
}

// shade colours a position on a two-ended scale from orange (low) through
// near-white (the middle) to purple (high), the ends of ColorBrewer's PuOr
// (Brewer 2003), which readers with the common colour-vision deficiencies
// tell apart; the text on a dark shade is white.
function shade(p) {
  const low = [179, 88, 6], mid = [247, 247, 247], high = [84, 39, 136];
  const [from, to, t] = p < 0.5 ? [low, mid, p / 0.5] : [mid, high, (p - 0.5) / 0.5];
  return "rgb(" + from.map((f, k) => Math.round(f + (to[k] - f) * t)).join(",") + ")";
}

// groupsOf are the groups' labels over all measures, in the order met.
function groupsOf(b) {
  const labels = [];
  for (const m of b.measures) for (const g of m.groups ?? []) if (!labels.includes(g.label)) labels.push(g.label);
  return labels;
}

function drawPositions(b, width) {
  const measures = b.measures.filter((m) => !m.error), labels = groupsOf(b);
  const left = Math.min(width * 0.35, 12 + Math.max(...measures.map((m) => textWidth(m.measure))));
  const top = 34, row = 24, right = 8;
  const col = (width - left - right) / labels.length;
  const height = top + row * measures.length + 40;
  const svg = picture(width, height, "Where each group lies on each measure", "plot-battery-caption");
  labels.forEach((l, j) => label(svg, left + col * (j + 0.5), top - 10, l, col - 4, { "text-anchor": "middle" }));
  measures.forEach((m, i) => {
    const y = top + row * i;
    label(svg, left - 8, y + row / 2 + 4, m.measure, left - 12, { "text-anchor": "end" });
    for (const g of m.groups) {
      const j = labels.indexOf(g.label), p = position(g, m.n);
      const cell = svgEl("g", { tabindex: 0 }, svg);
      svgEl("title", {}, cell).textContent = m.measure + ", " + g.label + ": mean rank " + g.mean_rank.toFixed(1) + " of " + m.n + " values (" + Math.round(100 * p) + "% of the way up)";
      svgEl("rect", { x: left + col * j + 1, y: y + 1, width: col - 2, height: row - 2, fill: shade(p) }, cell);
      svgText(cell, left + col * (j + 0.5), y + row / 2 + 4, Math.round(100 * p) + "%", { "text-anchor": "middle", fill: Math.abs(p - 0.5) > 0.3 ? "#ffffff" : "#1f2328" });
    }
  });
  // the key: the scale's two ends and its middle
  const ky = top + row * measures.length + 14;
  [[0, "lowest"], [0.5, "middle"], [1, "highest"]].forEach(([p, words], k) => {
    const x = left + k * 110;
    svgEl("rect", { x, y: ky, width: 14, height: 14, fill: shade(p), stroke: "currentColor", "stroke-width": 0.5 }, svg);
    svgText(svg, x + 20, ky + 12, words);
  });
  return svg;
}

// positionsTable gives the picture's numbers to screen readers.
function positionsTable(b) {
  const labels = groupsOf(b);
  const caption = document.createElement("caption");
  caption.textContent = "Where each group lies on each measure: mean rank as a share of the way from the lowest value to the highest";
  const head = document.createElement("tr");
  for (const text of ["Measure", ...labels]) {
    const th = document.createElement("th");
    th.scope = "col";
    th.textContent = text;
    head.append(th);
  }
  const rows = b.measures.filter((m) => !m.error).map((m) => {
    const tr = document.createElement("tr");
    const th = document.createElement("th");
    th.scope = "row";
    th.textContent = m.measure;
    tr.append(th);
    for (const l of labels) {
      const g = m.groups.find((x) => x.label === l);
      const td = document.createElement("td");
      td.textContent = g ? Math.round(100 * position(g, m.n)) + "% (mean rank " + g.mean_rank.toFixed(1) + ")" : "–";
      tr.append(td);
    }
    return tr;
  });
  $("battery-positions").replaceChildren(caption, head, ...rows);
}

export function renderBattery(state, changed) {
  if (!["battery", "batterySort", "drill"].some((k) => changed.has(k))) return;
  const b = state.battery;
  const shown = b !== null && state.drill === null;
  $("battery").hidden = !shown;
  const drilled = b !== null && state.drill !== null;
  $("back-to-battery").hidden = $("drill-note").hidden = !drilled;
  if (drilled) {
    const overview = state.batteryTables.overview, at = overview.columns.findIndex((c) => c.key === "p_adjusted_across");
    $("drill-note").textContent = "One of " + b.measures.length + " measures: " + b.measures[state.drill].measure
      + ". Its p adjusted across the measures: " + overview.text[state.drill][at] + ".";
  }
  // one link panel, in whichever results are in view; a battery's link carries every measure
  $(shown ? "battery-share-slot" : "results-share-slot").append($("share"));
  if (!shown) return;
  $("battery-summary").textContent = b.summary;
  $("battery-protect-note").hidden = !protecting();
  $("battery-protect-note").textContent = "Not shared: this page shows you every figure. What you download or link shows each measure's results as shared, "
    + "with its small groups protected (each measure's report says which), and without this picture of every group's mean rank.";
  const overview = state.batteryTables.overview;
  pageTable($("battery-table"), overview, {
    order: sortOrder(overview, state.batterySort),
    rowClass: (values) => b.measures.some((m) => m.measure === values[0] && m.differs_across) ? "differ" : "",
  });
  // each measure's name opens its whole analysis
  const rows = $("battery-table").tBodies[0].rows;
  sortOrder(overview, state.batterySort).forEach((i, k) => {
    if (b.measures[i].error) return;
    const button = document.createElement("button");
    button.type = "button";
    button.className = "quiet";
    button.textContent = b.measures[i].measure;
    button.addEventListener("click", () => drill(state, i));
    rows[k].cells[0].replaceChildren(button);
  });
  $("plot-battery-caption").textContent = "Each cell is a group's mean rank on a measure, as a share of the way from the lowest value (0%) to the highest (100%): orange lies low, purple high. The same numbers are in a table for screen readers.";
  drawAt("plot-battery", (width) => drawPositions(b, width), 200);
  positionsTable(b);
}

// drill shows measure i's whole analysis in the results; the overview
// stays one step back.
function drill(state, i) {
  const shared = state.batteryShared ? state.batteryShared.measures[i] : null;
  update({ drill: i, result: state.battery.measures[i], tables: state.batteryTables.measures[i], shared, sharedTables: shared && shared.tables });
  $("results-title").scrollIntoView({ block: "start" });
}

export function wireBattery() {
  $("back-to-battery").addEventListener("click", () => update({ drill: null, result: null, tables: null, shared: null, sharedTables: null }));
  for (const [id, by] of [["battery-sort-p", "p"], ["battery-sort-effect", "effect"], ["battery-sort-none", null]]) {
    $(id).addEventListener("click", () => update({ batterySort: by }));
  }
}
