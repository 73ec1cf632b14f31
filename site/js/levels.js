// A table of counts (one row per group, a count per level of a scale):
// each group level by level, as the core's table and as a bar of 100% per
// group, split by level, with the middle (50%) marked.
import { $ } from "./dom.js";
import { pageTable } from "./tableview.js";
import { OUTLINE, drawAt, label, picture, svgEl, svgText, textWidth } from "./svg.js";

// shade is level i of n on a light-to-dark blue scale (ColorBrewer's Blues
// ends, Brewer 2003), so that the order of the levels reads in the colours
// and in grey print; the text on a dark shade is white.
function shade(i, n) {
  const t = n === 1 ? 1 : i / (n - 1);
  const from = [222, 235, 247], to = [8, 48, 107];
  return "rgb(" + from.map((f, k) => Math.round(f + (to[k] - f) * t)).join(",") + ")";
}

function drawLevels(levels, width) {
  const n = levels.names.length;
  const row = 30, right = 24, top = 12;
  const left = Math.min(width * 0.35, 12 + Math.max(...levels.groups.map((g) => textWidth(g.label))));
  // the legend runs in rows as wide as the picture
  const legend = [];
  let lx = left, ly = 0;
  levels.names.forEach((name) => {
    const w = 22 + textWidth(name);
    if (lx + w > width - right && lx > left) { lx = left; ly += 20; }
    legend.push({ x: lx, y: ly });
    lx += w + 12;
  });
  const bottom = 48 + ly;
  const height = top + bottom + row * levels.groups.length;
  const x = (share) => left + (width - left - right) * share;
  const svg = picture(width, height, "Groups level by level", "plot-levels-caption");
  for (const tick of [0, 0.25, 0.5, 0.75, 1]) {
    svgEl("line", { x1: x(tick), x2: x(tick), y1: top, y2: height - bottom, class: "grid" }, svg);
    svgText(svg, x(tick), height - bottom + 16, Math.round(tick * 100) + "%", { "text-anchor": "middle" });
  }
  levels.groups.forEach((g, i) => {
    const y = top + row * i + 5;
    let from = 0;
    g.shares.forEach((share, level) => {
      const rect = svgEl("rect", { x: x(from), y, width: x(from + share) - x(from), height: row - 10, fill: shade(level, n), ...OUTLINE }, svg);
      svgEl("title", {}, rect).textContent = g.label + ", " + levels.names[level] + ": " + g.counts[level] + " (" + Math.round(share * 100) + "%)";
      const text = Math.round(share * 100) + "%";
      if (x(from + share) - x(from) >= textWidth(text) + 4) {
        svgText(svg, x(from + share / 2), y + row / 2, text, { "text-anchor": "middle", fill: level >= n / 2 ? "#ffffff" : "#1f2328" });
      }
      from += share;
    });
    label(svg, left - 8, y + row / 2, g.label, left - 12, { "text-anchor": "end" });
  });
  svgEl("line", { x1: x(0.5), x2: x(0.5), y1: top - 4, y2: height - bottom + 2, stroke: "currentColor", "stroke-width": 1.5, "stroke-dasharray": "4 3" }, svg);
  const legendTop = height - bottom + 30;
  levels.names.forEach((name, level) => {
    const at = legend[level];
    svgEl("rect", { x: at.x, y: legendTop + at.y, width: 12, height: 12, fill: shade(level, n), ...OUTLINE }, svg);
    svgText(svg, at.x + 16, legendTop + at.y + 10, name);
  });
  $("plot-levels-caption").textContent = "Each group's values level by level, as shares of the group, from "
    + levels.names[0] + " (left, lightest) to " + levels.names[n - 1] + " (right, darkest). A group's median level is the one the dashed line at 50% crosses.";
  return svg;
}

export function renderLevels(state, changed) {
  if (!changed.has("result")) return;
  const levels = state.result?.levels;
  $("levels-box").hidden = !levels;
  if (!levels) return;
  pageTable($("levels-table"), state.tables.levels, { rowClass: (values) => (values[5] ? "median" : "") });
  drawAt("plot-levels", (width) => drawLevels(levels, width));
}
