// The pictures: SVG drawn from the core's numbers, and their downloads.
import { $, download } from "./dom.js";

// Pictures are SVG drawn from the core's numbers. The palette is Okabe &
// Ito's (2008), safe for colour-blind readers, and every group also has its
// own marker shape, so the pictures read in grey print too.
const MAX_MARKERS = 5000; // beyond this many values the picture shows the boxes only
// Okabe & Ito's black is the text colour here, so that it shows in dark mode
// too; every marker and bar has a thin outline in the text colour, so that
// the light colours (yellow, sky blue) stand out from the paper (WCAG 1.4.11).
const PALETTE = ["#0072B2", "#D55E00", "#009E73", "#CC79A7", "#E69F00", "#56B4E9", "currentColor", "#F0E442"];
export const OUTLINE = { stroke: "currentColor", "stroke-width": 0.7 };
const SVG = "http://www.w3.org/2000/svg";

export function svgEl(name, attrs, parent) {
  const el = document.createElementNS(SVG, name);
  for (const [k, v] of Object.entries(attrs)) el.setAttribute(k, String(v));
  if (parent) parent.append(el);
  return el;
}

export function svgText(parent, x, y, text, attrs = {}) {
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

function drawValues(r) {
  const width = 720, height = 320, left = 56, right = 16, top = 16, bottom = 48;
  const lo = Math.min(...r.groups.map((g) => g.min)), hi = Math.max(...r.groups.map((g) => g.max));
  const pad = (hi - lo) * 0.05 || 1;
  const y = (v) => top + (height - top - bottom) * (1 - (v - (lo - pad)) / (hi - lo + 2 * pad));
  const band = (width - left - right) / r.groups.length;
  const svg = svgEl("svg", { viewBox: `0 0 ${width} ${height}`, role: "img", "aria-labelledby": "plot-values-caption" });
  for (const t of niceTicks(lo - pad, hi + pad, 6)) {
    svgEl("line", { x1: left, x2: width - right, y1: y(t), y2: y(t), class: "grid" }, svg);
    svgText(svg, left - 6, y(t) + 4, String(t), { "text-anchor": "end" });
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
  svgText(svg, 14, top + (height - top - bottom) / 2, r.input.measure || "value", { transform: `rotate(-90 14 ${top + (height - top - bottom) / 2})`, "text-anchor": "middle" });
  $("plot-values").replaceChildren(svg);
  $("plot-values-caption").textContent = "Each group's values: the box runs from the lower to the upper quartile with a thick line at the median, the whisker from the lowest to the highest value" +
    (drawEach ? "; every value is a marker beside its box, tied values side by side." : " (with " + r.n.toLocaleString() + " values, too many to draw each one).");
}

function drawMeanRanks(r) {
  const row = 28, left = 120, right = 24, top = 12, bottom = 36;
  const width = 720, height = top + bottom + row * r.groups.length;
  const x = (v) => left + (width - left - right) * (v - 1) / Math.max(1, r.n - 1);
  const svg = svgEl("svg", { viewBox: `0 0 ${width} ${height}`, role: "img", "aria-labelledby": "plot-ranks-caption" });
  for (const t of niceTicks(1, r.n, 6)) {
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
    svgText(svg, left - 8, cy + 4, g.label, { "text-anchor": "end" });
  });
  svgEl("line", { x1: x(centre), x2: x(centre), y1: top, y2: height - bottom, stroke: "currentColor", "stroke-dasharray": "4 3" }, svg);
  svgText(svg, (left + width - right) / 2, height - 4, "mean rank", { "text-anchor": "middle" });
  $("plot-ranks").replaceChildren(svg);
  $("plot-ranks-caption").textContent = "Mean rank of each group, drawn from the dashed line at " + centre +
    ", the mean rank every group would have if the groups did not differ. Ranks run from 1 (smallest value) to " + r.n + ".";
}

export function renderPictures(state, changed) {
  if (!changed.has("result") || !state.result) return;
  drawValues(state.result);
  drawMeanRanks(state.result);
}

// svgSource serialises a drawn picture as a standalone SVG file: it carries
// the page's styles it needs (grid lines, a sans-serif font) and its
// caption as its title, so that it reads the same outside the page.
export function svgSource(id) {
  const svg = $(id).querySelector("svg").cloneNode(true);
  svg.setAttribute("xmlns", "http://www.w3.org/2000/svg");
  svg.setAttribute("color", getComputedStyle($(id)).color);
  const style = svgEl("style", {});
  style.textContent = ".grid { stroke: " + getComputedStyle($(id).querySelector(".grid") ?? $(id)).stroke + "; } "
    + "text { font-family: system-ui, -apple-system, 'Segoe UI', Roboto, 'Helvetica Neue', Arial, sans-serif; }";
  const title = svgEl("title", {});
  title.textContent = $(id + "-caption").textContent;
  svg.prepend(title, style);
  return '<?xml version="1.0" encoding="UTF-8"?>\n' + new XMLSerializer().serializeToString(svg);
}

// savePNG draws a picture at twice its size on white and saves it as PNG.
function savePNG(id) {
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
    canvas.toBlob((png) => download("midrank-" + id + ".png", "image/png", png), "image/png");
  };
  image.src = url;
}

// wirePictures connects the download buttons; shown() tells whether
// results are on screen.
export function wirePictures(shown) {
  for (const button of document.querySelectorAll(".save-svg")) {
    button.addEventListener("click", () => {
      if (shown()) download("midrank-" + button.dataset.plot + ".svg", "image/svg+xml", svgSource(button.dataset.plot));
    });
  }
  for (const button of document.querySelectorAll(".save-png")) {
    button.addEventListener("click", () => { if (shown()) savePNG(button.dataset.plot); });
  }
}
