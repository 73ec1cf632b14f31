// The pictures of the groups: their values (boxes and markers) and their
// mean ranks, drawn in SVG from the core's numbers at the size they have on
// screen.
import { $ } from "./dom.js";
import { OUTLINE, PALETTE, drawAt, label, marker, niceTicks, picture, svgEl, svgText, textWidth } from "./svg.js";

const MAX_MARKERS = 5000; // beyond this many values the picture shows the boxes only

function drawValues(r, width, height) {
  const left = 56, right = 16, top = 16;
  const band = (width - left - right) / r.groups.length;
  // labels that do not fit under their box are slanted, and cut to fit
  const longest = Math.max(...r.groups.map((g) => textWidth(g.label)));
  const slant = longest > band - 6;
  const room = slant ? Math.min(longest, 110) : band - 6;
  const bottom = slant ? 30 + room * 0.6 : 40;
  // results as shared have no lowest or highest values (the whiskers go), and no figures for a hidden group
  const drawn = r.groups.filter((g) => g.median !== null);
  const lo = drawn.length ? Math.min(...drawn.map((g) => g.min ?? g.q1)) : 0, hi = drawn.length ? Math.max(...drawn.map((g) => g.max ?? g.q3)) : 1;
  const pad = (hi - lo) * 0.05 || 1;
  const y = (v) => top + (height - top - bottom) * (1 - (v - (lo - pad)) / (hi - lo + 2 * pad));
  const measure = r.input.measure || "value";
  const svg = picture(width, height, (r.input.measure ? r.input.measure + " by group" : "Values by group"), "plot-values-caption");
  for (const t of niceTicks(lo - pad, hi + pad, Math.max(3, Math.round((height - top - bottom) / 35)))) {
    svgEl("line", { x1: left, x2: width - right, y1: y(t), y2: y(t), class: "grid" }, svg);
    svgText(svg, left - 6, y(t) + 4, String(t), { "text-anchor": "end" });
  }
  r.groups.forEach((g, i) => {
    const cx = left + band * (i + 0.5), w = Math.min(60, band * 0.5);
    const ly = height - bottom + 18;
    label(svg, cx, ly, g.label, room, slant ? { "text-anchor": "end", transform: `rotate(-35 ${cx} ${ly})` } : { "text-anchor": "middle" });
    if (g.median === null) {
      svgText(svg, cx, top + (height - top - bottom) / 2, "not shown", { "text-anchor": "middle" });
      return;
    }
    if (g.min !== undefined) svgEl("line", { x1: cx, x2: cx, y1: y(g.min), y2: y(g.max), stroke: "currentColor" }, svg);
    svgEl("rect", { x: cx - w / 2, y: y(g.q3), width: w, height: Math.max(1, y(g.q1) - y(g.q3)), fill: "none", stroke: "currentColor" }, svg);
    svgEl("line", { x1: cx - w / 2, x2: cx + w / 2, y1: y(g.median), y2: y(g.median), stroke: "currentColor", "stroke-width": 3 }, svg);
  });
  const drawEach = r.ranks_complete && r.n <= MAX_MARKERS;
  if (drawEach) {
    // tied values are stacked side by side, others spread by their rank
    const index = new Map(r.groups.map((g, i) => [g.label, i]));
    const seen = new Map();
    const step = Math.min(5, band / 16);
    for (const v of r.ranks) {
      const i = index.get(v.group);
      const key = i + "\u0000" + v.value;
      const n = seen.get(key) || 0;
      seen.set(key, n + 1);
      const cx = left + band * (i + 0.5) + band * 0.32 + ((n % 6) - 2.5) * step;
      marker(svg, i, cx, y(v.value));
    }
  }
  const middle = top + (height - top - bottom) / 2;
  label(svg, 14, middle, measure, height - top - bottom, { transform: `rotate(-90 14 ${middle})`, "text-anchor": "middle" });
  const caption = r.shared
    ? "Each group's values: the box runs from the lower to the upper quartile with a thick line at the median; no whiskers or single values, which would show people's own values" +
      (drawn.length < r.groups.length ? "; a protected group is not shown." : ".")
    : "Each group's values: the box runs from the lower to the upper quartile with a thick line at the median, the whisker from the lowest to the highest value" +
      (drawEach ? "; every value is a marker beside its box, tied values side by side." : r.ranks_complete ? " (with " + r.n.toLocaleString() + " values, too many to draw each one)." : ".");
  return { svg, caption };
}

function drawMeanRanks(r, width) {
  const row = 28, right = 24, top = 12, bottom = 36;
  const left = Math.min(width * 0.35, 12 + Math.max(...r.groups.map((g) => textWidth(g.label))));
  const height = top + bottom + row * r.groups.length;
  const x = (v) => left + (width - left - right) * (v - 1) / Math.max(1, r.n - 1);
  const svg = picture(width, height, "Mean rank by group", "plot-ranks-caption");
  for (const t of niceTicks(1, r.n, Math.max(3, Math.round((width - left - right) / 70)))) {
    svgEl("line", { x1: x(t), x2: x(t), y1: top, y2: height - bottom, class: "grid" }, svg);
    svgText(svg, x(t), height - bottom + 16, String(t), { "text-anchor": "middle" });
  }
  const centre = (r.n + 1) / 2;
  r.groups.forEach((g, i) => {
    const cy = top + row * (i + 0.5);
    const from = Math.min(x(centre), x(g.mean_rank));
    svgEl("rect", { x: from, y: cy - 4, width: Math.abs(x(g.mean_rank) - x(centre)), height: 8,
      fill: PALETTE[i % PALETTE.length], ...OUTLINE }, svg);
    marker(svg, i, x(g.mean_rank), cy);
    label(svg, left - 8, cy + 4, g.label, left - 12, { "text-anchor": "end" });
  });
  svgEl("line", { x1: x(centre), x2: x(centre), y1: top, y2: height - bottom, stroke: "currentColor", "stroke-dasharray": "4 3" }, svg);
  svgText(svg, (left + width - right) / 2, height - 4, "mean rank", { "text-anchor": "middle" });
  const caption = "Mean rank of each group, drawn from the dashed line at " + centre +
    ", the mean rank every group would have if the groups did not differ. Ranks run from 1 (smallest value) to " + r.n + ".";
  return { svg, caption };
}

// REPORT_WIDTH is the width, in pixels, of the pictures drawn for a report
// rather than the screen.
const REPORT_WIDTH = 720;

// shownAt draws a picture into box id, its caption beside it.
function shownAt(id, draw) {
  drawAt(id, (width, height) => {
    const { svg, caption } = draw(width, height);
    $(id + "-caption").textContent = caption;
    return svg;
  });
}

// meanRanksShown reports whether r has every group's mean rank (results
// shared with small groups protected have none).
function meanRanksShown(r) {
  return r.groups.every((g) => g.mean_rank !== null);
}

export function renderPictures(state, changed) {
  if (!changed.has("result") || !state.result) return;
  const r = state.result;
  shownAt("plot-values", (width, height) => drawValues(r, width, height));
  $("mean-ranks-box").hidden = !meanRanksShown(r);
  if (meanRanksShown(r)) shownAt("plot-ranks", (width) => drawMeanRanks(r, width));
}

// reportPictures are a result's pictures of its groups, drawn for a report
// (as for a measure of a battery, which is not on screen, or for results
// as shared): [{svg, caption}].
export function reportPictures(r) {
  return meanRanksShown(r) ? [drawValues(r, REPORT_WIDTH, 320), drawMeanRanks(r, REPORT_WIDTH)] : [drawValues(r, REPORT_WIDTH, 320)];
}
