// The tables of results as the core defines and shows them (core/tables):
// {title, note, columns: [{key, heading, unit, show}], values, text}. Every
// rendering here walks the columns, so a column added in the core shows in
// the page, the CSV files and both reports at once.

// pageTable fills a <table> element: caption, headings and rows as shown;
// heading(th, column) may add to a heading, rowClass(values) names a row's class.
export function pageTable(element, table, { heading, rowClass, order } = {}) {
  const caption = document.createElement("caption");
  caption.textContent = table.note ? table.title + ". " + table.note : table.title;
  const head = document.createElement("tr");
  for (const c of table.columns) {
    const th = document.createElement("th");
    th.scope = "col";
    th.textContent = c.heading;
    if (c.show !== "text" && c.show !== "flag") th.className = "number";
    heading?.(th, c);
    head.append(th);
  }
  const thead = document.createElement("thead");
  thead.append(head);
  const tbody = document.createElement("tbody");
  for (const i of order ?? table.text.keys()) {
    const tr = document.createElement("tr");
    const name = rowClass?.(table.values[i]);
    if (name) tr.className = name;
    for (const text of table.text[i]) {
      const td = document.createElement("td");
      td.textContent = text;
      tr.append(td);
    }
    tbody.append(tr);
  }
  element.replaceChildren(caption, thead, tbody);
}

// figureList fills a <dl> with a list of figures (a one-row table), each
// value marked with its key.
export function figureList(element, table) {
  element.replaceChildren(...table.columns.map((c, i) => {
    const div = document.createElement("div");
    const dt = document.createElement("dt");
    dt.textContent = c.heading;
    const dd = document.createElement("dd");
    dd.dataset.result = c.key;
    dd.textContent = table.text[0][i];
    div.append(dt, dd);
    return div;
  }));
}

// A text cell that a spreadsheet would take for a formula (it begins with
// = + - @, a tab or a carriage return) gets a leading apostrophe, as OWASP's
// guidance on CSV injection advises; numbers are written as they are, so
// that negative values stay numbers.
function csvCell(v) {
  let s = v === null ? "" : String(v);
  if (typeof v === "string" && /^[=+\-@\t\r]/.test(s)) s = "'" + s;
  return /[",\n\r']/.test(s) ? '"' + s.replace(/"/g, '""') + '"' : s;
}

// csvOf is a table as CSV: the columns' keys, then the values at full precision.
export function csvOf(table) {
  const rows = [table.columns.map((c) => c.key)].concat(table.values);
  return rows.map((r) => r.map(csvCell).join(",")).join("\r\n") + "\r\n";
}

export function escapeHTML(s) {
  return String(s).replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]);
}

// rowsOf gives a table's headings and rows as shown; a list of figures (one
// row) is turned to run down the page: figure, value.
function rowsOf(table) {
  if (table.list) {
    return { head: ["Figure", "Value"], rows: table.columns.map((c, i) => [c.heading, table.text[0][i]]) };
  }
  return { head: table.columns.map((c) => c.heading), rows: table.text };
}

// htmlOf is a table as HTML, its text escaped.
export function htmlOf(table, level = 2) {
  const { head, rows } = rowsOf(table);
  return "<h" + level + ">" + escapeHTML(table.title) + "</h" + level + ">" + (table.note ? "<p class=\"note\">" + escapeHTML(table.note) + "</p>" : "")
    + "<table><thead><tr>" + head.map((h) => "<th>" + escapeHTML(h) + "</th>").join("") + "</tr></thead><tbody>"
    + rows.map((r) => "<tr>" + r.map((c) => "<td>" + escapeHTML(c) + "</td>").join("") + "</tr>").join("") + "</tbody></table>";
}

// plainOf is a table as plain text, its cells separated by tabs so that it
// pastes into a spreadsheet's cells: the title, the note, the headings and
// the rows as shown.
export function plainOf(table) {
  const { head, rows } = rowsOf(table);
  const line = (cells) => cells.map((c) => String(c).replace(/[\t\r\n]+/g, " ")).join("\t");
  return [table.title, ...(table.note ? [table.note] : []), line(head), ...rows.map(line)].join("\n") + "\n";
}

// mdText makes text literal in Markdown (CommonMark 0.31 with the GFM
// table, strikethrough and autolink extensions): a line break becomes a
// space; the characters that mean something wherever they stand (\ ` * _
// [ ] < > | ~ & ! $) get a backslash (§2.4, backslash escapes); a mark that
// means something only at the start of a line, before a space or the end
// (# + - and "1." or "1)") or repeated (=== and --- under a line), gets
// one there; and an address that would become a link ("www.",
// "http://", "a@b") is broken by a backslash before its "." , ":" or "@".
// Ordinary prose keeps its full stops, colons and brackets as they are.
export function mdText(v) {
  if (/^-?[0-9][0-9.]*(e-?[0-9]+)?$/.test(v)) return v;
  return String(v).replace(/\r\n|\r|\n/g, " ")
    .replace(/[\\`*_\[\]<>|~&!$]/g, "\\$&")
    .replace(/^(\s*)([#+\-=])(?=\s|$|\2)/, "$1\\$2")
    .replace(/^(\s*\d{1,9})([.)])(?=\s|$)/, "$1\\$2")
    .replace(/(www)\./gi, "$1\\.")
    .replace(/:\/\//g, "\\://")
    .replace(/(\w)@(?=\w)/g, "$1\\@");
}

// markdownOf is a table as Markdown lines.
export function markdownOf(table, level = 2) {
  const { head, rows } = rowsOf(table);
  const line = (cells) => "| " + cells.map(mdText).join(" | ") + " |";
  return ["#".repeat(level) + " " + mdText(table.title), "", ...(table.note ? [mdText(table.note), ""] : []),
    line(head), "|" + " --- |".repeat(head.length), ...rows.map(line)];
}
