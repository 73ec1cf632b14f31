// A picture as a file that stands alone: SVG or PNG with its title, its
// styles and its caption.
import { $, download, setStatus } from "./dom.js";
import { state } from "./state.js";
import { svgEl, svgText } from "./svg.js";
import { outgoing, protecting } from "./outgoing.js";
import { reportPictures } from "./pictures.js";

const TITLE_HEIGHT = 28; // pixels above the picture for its visible title

// PAPER are the colours a picture is saved in, whatever the screen's theme:
// the light theme's ink and grid on white (style.css), so that a picture
// saved in dark mode still reads on a white page.
const PAPER = { ink: "#1f2328", grid: "#d9d4c7", background: "#ffffff" };

// standalone copies a drawn picture with what it needs outside the page:
// its colours on a white background, a font, its title drawn above it, and
// its caption as its <title>.
function standalone(drawn, caption) {
  const box = drawn.viewBox.baseVal;
  const width = box.width, height = box.height + TITLE_HEIGHT;
  const svg = svgEl("svg", { viewBox: `0 0 ${width} ${height}`, width, height, role: "img", color: PAPER.ink });
  const style = svgEl("style", {}, svg);
  style.textContent = ".grid { stroke: " + PAPER.grid + "; } "
    + "text { font-family: system-ui, -apple-system, 'Segoe UI', Roboto, 'Helvetica Neue', Arial, sans-serif; }";
  svgEl("title", {}, svg).textContent = caption;
  svgEl("rect", { width, height, fill: PAPER.background }, svg);
  svgText(svg, 8, 19, drawn.dataset.title, { "font-size": 15, "font-weight": 600 });
  const body = svgEl("g", { transform: `translate(0 ${TITLE_HEIGHT})` }, svg);
  body.append(...[...drawn.childNodes].map((n) => n.cloneNode(true)));
  return svg;
}

// onScreen is the picture drawn in box id and its caption; with small
// groups protected, the picture drawn from the results as shared instead
// (the screen, private, shows everything), or null when there is none.
function onScreen(id) {
  if (protecting() && !state.readOnly) {
    const shared = { "plot-values": 0, "plot-ranks": 1 }[id]; // the others (levels, every measure's mean ranks) are not shared
    const drawn = shared === undefined ? null : reportPictures(outgoing().r)[shared];
    return drawn ? standalone(drawn.svg, drawn.caption) : null;
  }
  return standalone($(id).querySelector("svg"), $(id + "-caption").textContent);
}

// svgOf is a picture, drawn or on screen, as standalone SVG markup, without
// the XML declaration (for a report's page).
export function svgOf(drawn, caption) {
  return new XMLSerializer().serializeToString(standalone(drawn, caption));
}

// svgSource is a picture on screen as a standalone SVG file (null when
// it is not shared).
export function svgSource(id) {
  const svg = onScreen(id);
  return svg && '<?xml version="1.0" encoding="UTF-8"?>\n' + new XMLSerializer().serializeToString(svg);
}

// NOT_SHARED says why a picture is not saved.
const NOT_SHARED = "This picture is not shared while small groups are protected: it would show the protected groups' figures.";

// saveSVG saves a picture as SVG.
function saveSVG(id) {
  const source = svgSource(id);
  if (!source) return setStatus(NOT_SHARED);
  download("midrank-" + id + ".svg", "image/svg+xml", source);
}

// savePNG draws a picture at twice its size and saves it as PNG.
function savePNG(id) {
  const svg = onScreen(id);
  if (!svg) return setStatus(NOT_SHARED);
  const box = svg.viewBox.baseVal;
  const image = new Image();
  const url = URL.createObjectURL(new Blob([new XMLSerializer().serializeToString(svg)], { type: "image/svg+xml" }));
  image.onload = () => {
    const canvas = document.createElement("canvas");
    canvas.width = box.width * 2;
    canvas.height = box.height * 2;
    canvas.getContext("2d").drawImage(image, 0, 0, canvas.width, canvas.height);
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
      if (shown()) saveSVG(button.dataset.plot);
    });
  }
  for (const button of document.querySelectorAll(".save-png")) {
    button.addEventListener("click", () => { if (shown()) savePNG(button.dataset.plot); });
  }
}
