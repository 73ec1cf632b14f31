// The downloads of the results: the reports (one HTML file, Markdown) and
// the tables as CSV. Every table comes from the core's definition.
import { $, download } from "./dom.js";
import { state } from "./state.js";
import { formOptions } from "./settings.js";
import { svgOf, svgSource } from "./savepicture.js";
import { reportPictures } from "./pictures.js";
import { csvOf, escapeHTML, htmlOf, markdownOf, mdText } from "./tableview.js";
import { outgoing, outgoingBattery, protecting } from "./outgoing.js";

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

// picture is an on-screen picture and its caption for the HTML report.
function picture(id) {
  return svgSource(id).replace(/^<\?xml[^>]*>\n/, "") + "<p class=\"note\">" + escapeHTML($(id + "-caption").textContent) + "</p>";
}

// measurePictures are a battery measure's pictures, drawn for the report.
function measurePictures(r) {
  return reportPictures(r).map(({ svg, caption }) => svgOf(svg, caption) + "<p class=\"note\">" + escapeHTML(caption) + "</p>");
}

// htmlPage wraps a report's body: it runs nothing and loads nothing,
// wherever it is opened.
function htmlPage(title, version, body, wide = false) {
  const settings = state.readOnly ? state.shared.options : formOptions();
  return ["<!doctype html><html lang=\"en\"><head><meta charset=\"utf-8\">",
    "<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; style-src 'unsafe-inline'; img-src data:\">",
    "<title>" + escapeHTML(title) + "</title>",
    "<style>body{font:15px/1.5 system-ui,sans-serif;max-width:" + (wide ? "80rem" : "60rem") + ";margin:2rem auto;padding:0 1rem;color:#1f2328}",
    "table{border-collapse:collapse;margin:.5rem 0 1rem}th,td{border-bottom:1px solid #d9d4c7;padding:.2rem .6rem;text-align:right}",
    "th:first-child,td:first-child{text-align:left}svg{max-width:100%;height:auto}.note{color:#555d66}</style></head><body>",
    "<h1>" + escapeHTML(title) + "</h1>",
    "<p class=\"note\">Made with Midrank " + escapeHTML(version) + " on " + new Date().toISOString().slice(0, 10) +
      ". Settings: " + escapeHTML(Object.entries(settings).filter(([, v]) => v !== "").map(([k, v]) => k + " " + (Array.isArray(v) ? v.join(" · ") : v)).join(", ")) + ".</p>",
    ...body, "</body></html>\n"].join("");
}

// protectionText says how the results were protected for sharing, and
// that results from a results-only link came without their data.
function protectionText(r) {
  const came = state.readOnly ? "These results came in a link without the data. " : "";
  return came + (r.protection_note || "");
}

// htmlAnalysis is one measure's analysis: the plain words, its tables and
// its notes, with headings from level down.
function htmlAnalysis(r, tables, level) {
  const h = (text) => "<h" + level + ">" + escapeHTML(text) + "</h" + level + ">";
  const parts = [groupEditsText(r) ? "<p class=\"note\">" + escapeHTML(groupEditsText(r)) + "</p>" : "",
    protectionText(r) ? "<p class=\"note\"><strong>" + escapeHTML(protectionText(r)) + "</strong></p>" : "",
    h("In plain words") + "<p><strong>" + escapeHTML(r.result_line) + "</strong></p><p>" + escapeHTML(r.decision) + "</p>",
    ...Object.values(tables).map((t) => htmlOf(t, level) + (t.name === "figures" ? "<p class=\"note\">" + escapeHTML(r.p_method_reason) + "</p>" : ""))];
  if (r.warnings.length) parts.push(h("Take note") + "<ul>" + r.warnings.map((w) => "<li>" + escapeHTML(w) + "</li>").join("") + "</ul>");
  return parts;
}

function htmlReport() {
  const { r, tables } = outgoing();
  const pictures = r.shared ? measurePictures(r).join("") // drawn from the results as shared
    : (r.levels ? picture("plot-levels") : "") + picture("plot-values") + picture("plot-ranks");
  return htmlPage("Kruskal–Wallis H test", r.version, [...htmlAnalysis(r, tables, 2), "<h2>Pictures</h2>" + pictures]);
}

// markdownAnalysis is htmlAnalysis in Markdown.
function markdownAnalysis(r, tables, level) {
  const lines = [...(groupEditsText(r) ? [mdText(groupEditsText(r)), ""] : []), ...(protectionText(r) ? ["**" + mdText(protectionText(r)) + "**", ""] : []),
    "**" + mdText(r.result_line) + "**", "", mdText(r.decision)];
  for (const t of Object.values(tables)) {
    lines.push("", ...markdownOf(t, level));
    if (t.name === "figures") lines.push("", mdText(r.p_method_reason));
  }
  if (r.warnings.length) lines.push("", "#".repeat(level) + " Take note", "", ...r.warnings.map((w) => "- " + mdText(w)));
  return lines;
}

function markdownReport() {
  const { r, tables } = outgoing();
  return ["# Kruskal–Wallis H test", "", "Midrank " + r.version + ", " + new Date().toISOString().slice(0, 10) + ".", "",
    ...markdownAnalysis(r, tables, 2)].join("\n") + "\n";
}

// inFull are the battery's measures its reports show in full, with their
// tables (every one analysed, or only those that differ), and a note that
// says which.
function inFull() {
  const b = state.battery, onlyDiffering = $("battery-report").value === "differ", out = outgoingBattery();
  const shown = b.measures.flatMap((m, i) => m.error || onlyDiffering && !m.differs_across ? [] : [{ m, ...out.measures[i] }]);
  const note = onlyDiffering ? shown.length + " of the " + b.measures.length + " measures follow in full: those that differ after the adjustment across measures."
    : "Every measure analysed follows in full.";
  return { shown, note };
}

function batteryHTML() {
  const b = state.battery, { shown, note } = inFull();
  // the picture of every group's mean rank is not shared while small groups are protected
  return htmlPage("Kruskal–Wallis H test, " + b.measures.length + " measures", b.version, [
    "<p><strong>" + escapeHTML(b.summary) + "</strong></p>",
    htmlOf(outgoingBattery().overview), protecting() ? "" : picture("plot-battery"), "<p class=\"note\">" + escapeHTML(note) + "</p>",
    ...shown.flatMap(({ m, r, tables }) => ["<h2>" + escapeHTML(m.measure) + "</h2>", ...htmlAnalysis(r, tables, 3), ...measurePictures(r)])], true);
}

function batteryMarkdown() {
  const b = state.battery, { shown, note } = inFull();
  return ["# Kruskal–Wallis H test, " + b.measures.length + " measures", "", "Midrank " + b.version + ", " + new Date().toISOString().slice(0, 10) + ".", "",
    "**" + mdText(b.summary) + "**", "", ...markdownOf(outgoingBattery().overview), "",
    note,
    ...shown.flatMap(({ m, r, tables }) => ["", "## " + mdText(m.measure), "", ...markdownAnalysis(r, tables, 3)])].join("\n") + "\n";
}

// wireReports connects the download buttons; nothing is saved while no
// results are on screen.
export function wireReports() {
  const when = (id, make) => $(id).addEventListener("click", () => { if (state.result) make(); });
  when("save-html", () => download("midrank-report.html", "text/html", htmlReport()));
  when("save-markdown", () => download("midrank-report.md", "text/markdown", markdownReport()));
  when("save-groups", () => download("midrank-groups.csv", "text/csv", csvOf(outgoing().tables.groups)));
  when("save-pairs", () => { if (outgoing().tables.pairs) download("midrank-pairs.csv", "text/csv", csvOf(outgoing().tables.pairs)); });
  when("save-levels", () => { if (outgoing().tables.levels) download("midrank-levels.csv", "text/csv", csvOf(outgoing().tables.levels)); });
  const whenBattery = (id, make) => $(id).addEventListener("click", () => { if (state.battery) make(); });
  whenBattery("save-battery-html", () => download("midrank-measures-report.html", "text/html", batteryHTML()));
  whenBattery("save-battery-markdown", () => download("midrank-measures-report.md", "text/markdown", batteryMarkdown()));
  whenBattery("save-overview", () => download("midrank-overview.csv", "text/csv", csvOf(outgoingBattery().overview)));
}
