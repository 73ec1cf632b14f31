// The preview shows how the text was read: the first lines as cells, and
// every unreadable cell marked and listed with the core's message.
import { $ } from "./dom.js";
import { selectLine } from "./input.js";
import { chooseAlternative, fillColumns } from "./settings.js";

const separatorNames = { tab: "tab-separated", semicolon: "semicolon-separated", comma: "comma-separated" };
const layoutNames = { wide: "one column per group", long: "one row per value", counts: "one row per group, a count per level" };

export function renderPreview(state, changed) {
  if (!changed.has("preview") || !state.preview) return;
  const p = state.preview;
  const input = p.input;
  $("read-as").textContent = !input.layout ? "it could not be read"
    : layoutNames[input.layout] + ", " + separatorNames[input.separator] + ", decimal " + input.decimal_mark
      + (input.thousands !== "none" ? ", " + input.thousands + " between thousands" : "")
      + (input.unit ? ", values in \u201c" + input.unit + "\u201d (taken off " + input.unit_cells.toLocaleString() + " cells)" : "")
      + (p.groups.length ? ", " + p.groups.length + " groups" : "")
      + (p.problems.length ? ", " + p.problems.length + (p.problems.length === 1 ? " cell" : " cells") + " to correct" : "");
  $("read-reason").textContent = !input.reason ? "" : "Read with " + input.reason + "."
    + (input.other_readings ? " It could also be read with " + input.other_readings + ": if that is meant, choose it below." : "")
    + (input.other_numbers ? " Some numbers could be read two ways: " + input.other_numbers + " above." : "");
  fillColumns(p.columns);
  const rows = p.columns.whole ? "" : " in the first " + p.columns.records.toLocaleString() + " rows";
  $("read-alternatives").replaceChildren(...(input.alternatives ?? []).map((a) => {
    const button = document.createElement("button");
    button.type = "button";
    button.className = "quiet";
    button.textContent = "Read with " + a.words + ": " + a.groups.toLocaleString() + " groups, " + a.values.toLocaleString() + " values" + rows;
    button.addEventListener("click", () => chooseAlternative(a));
    return button;
  }));
  const marks = new Map(); // "line:column" → message
  for (const q of p.problems) if (q.line && q.column) marks.set(q.line + ":" + q.column, q.message);
  const width = Math.max(1, ...p.rows.map((r) => r.cells.length));
  const headed = input.layout === "wide" || input.header;
  $("preview-rows").replaceChildren(...p.rows.map((r, i) => {
    const tr = document.createElement("tr");
    if (i === 0 && headed) tr.className = "head";
    const th = document.createElement("th");
    th.scope = "row";
    th.textContent = String(r.line);
    tr.append(th);
    for (let c = 0; c < width; c++) {
      const td = document.createElement("td");
      td.textContent = r.cells[c] ?? "";
      const message = marks.get(r.line + ":" + (c + 1));
      if (message) {
        td.className = "bad";
        td.title = message;
        td.setAttribute("aria-label", (r.cells[c] ?? "") + " — " + message);
      }
      tr.append(td);
    }
    return tr;
  }));
  const problems = p.problems.length ? p.problems : p.message ? [{ message: p.message }] : [];
  $("problem-list").replaceChildren(...problems.map((q) => {
    const li = document.createElement("li");
    if (q.line) {
      const b = document.createElement("button");
      b.type = "button";
      b.className = "quiet";
      b.textContent = q.message;
      b.title = "Select line " + q.line + " in the text";
      b.addEventListener("click", () => selectLine(q.line));
      li.append(b);
    } else {
      li.textContent = q.message;
    }
    return li;
  }));
}
