// The downloads of the results: the reports (one HTML file, Markdown) and
// the tables as CSV. Every table comes from the core's definition.
import { $, download } from "./dom.js";
import { state } from "./state.js";
import { formOptions } from "./settings.js";
import { svgSource } from "./savepicture.js";
import { csvOf, escapeHTML, htmlOf, markdownOf, mdText } from "./tableview.js";

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

// tablesInOrder are the tables a report shows, in the core's order.
function tablesInOrder() {
  return Object.values(state.tables);
}

function htmlReport() {
  const r = state.result;
  const settings = formOptions();
  const picture = (id) => svgSource(id).replace(/^<\?xml[^>]*>\n/, "") + "<p class=\"note\">" + escapeHTML($(id + "-caption").textContent) + "</p>";
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
    "<h2>In plain words</h2><p><strong>" + escapeHTML(r.result_line) + "</strong></p><p>" + escapeHTML(r.decision) + "</p>",
    ...tablesInOrder().map((t) => htmlOf(t) + (t.name === "figures" ? "<p class=\"note\">" + escapeHTML(r.p_method_reason) + "</p>" : "")),
    "<h2>Pictures</h2>" + (state.result.levels ? picture("plot-levels") : "") + picture("plot-values") + picture("plot-ranks"),
  ];
  if (r.warnings.length) parts.push("<h2>Take note</h2><ul>" + r.warnings.map((w) => "<li>" + escapeHTML(w) + "</li>").join("") + "</ul>");
  parts.push("</body></html>\n");
  return parts.join("");
}

function markdownReport() {
  const r = state.result;
  const lines = ["# Kruskal–Wallis H test", "", "Midrank " + r.version + ", " + new Date().toISOString().slice(0, 10) + ".", "",
    ...(groupEditsText(r) ? [mdText(groupEditsText(r)), ""] : []), "**" + mdText(r.result_line) + "**", "", mdText(r.decision)];
  for (const t of tablesInOrder()) {
    lines.push("", ...markdownOf(t));
    if (t.name === "figures") lines.push("", mdText(r.p_method_reason));
  }
  if (r.warnings.length) lines.push("", "## Take note", "", ...r.warnings.map((w) => "- " + mdText(w)));
  return lines.join("\n") + "\n";
}

// wireReports connects the download buttons; nothing is saved while no
// results are on screen.
export function wireReports() {
  const when = (id, make) => $(id).addEventListener("click", () => { if (state.result) make(); });
  when("save-html", () => download("midrank-report.html", "text/html", htmlReport()));
  when("save-markdown", () => download("midrank-report.md", "text/markdown", markdownReport()));
  when("save-groups", () => download("midrank-groups.csv", "text/csv", csvOf(state.tables.groups)));
  when("save-pairs", () => { if (state.tables.pairs) download("midrank-pairs.csv", "text/csv", csvOf(state.tables.pairs)); });
  when("save-levels", () => { if (state.tables.levels) download("midrank-levels.csv", "text/csv", csvOf(state.tables.levels)); });
}
