// The pieces every picture is drawn with: SVG elements, the palette and
// markers, axis ticks, and drawing at the size the picture has on screen.
import { $ } from "./dom.js";

// The palette is Okabe & Ito's (2008), safe for colour-blind readers, and
// every group also has its own marker shape, so the pictures read in grey
// print too. Okabe & Ito's black is the text colour here, so that it shows
// in dark mode too; every marker and bar has a thin outline in the text
// colour, so that the light colours (yellow, sky blue) stand out from the
// paper (WCAG 1.4.11).
export const PALETTE = ["#0072B2", "#D55E00", "#009E73", "#CC79A7", "#E69F00", "#56B4E9", "currentColor", "#F0E442"];
export const OUTLINE = { stroke: "currentColor", "stroke-width": 0.7 };
const SVG = "http://www.w3.org/2000/svg";

// TEXT_SIZE is the pictures' text size in pixels: pictures are drawn at the
// width they have on screen (see drawAt), so it stays this size on a phone
// instead of being scaled down with the picture.
const TEXT_SIZE = 12;
// CHAR_WIDTH is about the width of one character of that text, for laying
// out labels before they are drawn.
const CHAR_WIDTH = 7;
const MIN_WIDTH = 280, MAX_WIDTH = 800; // pixels

export function svgEl(name, attrs, parent) {
  const el = document.createElementNS(SVG, name);
  for (const [k, v] of Object.entries(attrs)) el.setAttribute(k, String(v));
  if (parent) parent.append(el);
  return el;
}

export function svgText(parent, x, y, text, attrs = {}) {
  const t = svgEl("text", { x, y, fill: "currentColor", "font-size": TEXT_SIZE, ...attrs }, parent);
  t.textContent = text;
  return t;
}

// label draws a label that fits in room pixels: a longer one is cut with an
// ellipsis and keeps its full text as a tooltip.
export function label(parent, x, y, text, room, attrs = {}) {
  const fits = Math.max(3, Math.floor(room / CHAR_WIDTH));
  const t = svgText(parent, x, y, text.length > fits ? text.slice(0, fits - 1) + "…" : text, attrs);
  if (text.length > fits) svgEl("title", {}, t).textContent = text;
  return t;
}

// textWidth is about how wide text is drawn, in pixels.
export function textWidth(text) {
  return text.length * CHAR_WIDTH;
}

// marker draws group g's shape at (x, y).
export function marker(parent, g, x, y) {
  const colour = PALETTE[g % PALETTE.length];
  const r = 3.2;
  switch (g % 4) {
    case 0: return svgEl("circle", { cx: x, cy: y, r, fill: colour, ...OUTLINE }, parent);
    case 1: return svgEl("rect", { x: x - r, y: y - r, width: 2 * r, height: 2 * r, fill: colour, ...OUTLINE }, parent);
    case 2: return svgEl("path", { d: `M${x},${y - r - 1}L${x + r + 1},${y + r}L${x - r - 1},${y + r}Z`, fill: colour, ...OUTLINE }, parent);
    default: return svgEl("path", { d: `M${x},${y - r - 1}L${x + r + 1},${y}L${x},${y + r + 1}L${x - r - 1},${y}Z`, fill: colour, ...OUTLINE }, parent);
  }
}

export function niceTicks(lo, hi, count) {
  const span = hi - lo || 1;
  const step = Math.pow(10, Math.floor(Math.log10(span / count)));
  const unit = [1, 2, 5, 10].map((m) => m * step).find((s) => span / s <= count) || 10 * step;
  const ticks = [];
  for (let v = Math.ceil(lo / unit) * unit; v <= hi + unit / 1e6; v += unit) ticks.push(Number(v.toPrecision(12)));
  return ticks;
}

// picture starts a picture of width × height pixels with its title (which
// the downloads show) and its caption's id.
export function picture(width, height, title, caption) {
  return svgEl("svg", { viewBox: `0 0 ${width} ${height}`, width, height, role: "img", "aria-labelledby": caption, "data-title": title });
}

// sizeOf is the width a picture in box id is drawn at, its width on screen
// (from MIN_WIDTH to MAX_WIDTH), and the height its box asks for with the
// CSS property --picture-height (pixels, no unit), or fallback.
function sizeOf(id, fallback) {
  const box = $(id);
  const width = Math.max(MIN_WIDTH, Math.min(MAX_WIDTH, Math.floor(box.clientWidth || MAX_WIDTH)));
  const height = Number.parseFloat(getComputedStyle(box).getPropertyValue("--picture-height")) || fallback;
  return { width, height };
}

const drawn = new Map(); // box id → its size and how to draw it again
const resized = new ResizeObserver((entries) => {
  for (const { target } of entries) {
    const again = drawn.get(target.id);
    if (again && sizeOf(target.id, again.height).width !== again.width) again.redraw();
  }
});

// drawAt draws a picture into box id at the box's size, draw(width, height)
// giving the <svg>, and draws it again whenever the box's width changes (a
// turned phone, a resized window, the results shown after being hidden).
export function drawAt(id, draw, fallbackHeight = 320) {
  const { width, height } = sizeOf(id, fallbackHeight);
  $(id).replaceChildren(draw(width, height));
  if (!drawn.has(id)) resized.observe($(id));
  drawn.set(id, { width, height: fallbackHeight, redraw: () => drawAt(id, draw, fallbackHeight) });
}
