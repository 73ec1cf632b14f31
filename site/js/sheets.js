// Spreadsheet files (.xlsx, .ods) opened in the tab: the module turns a
// sheet into text, which goes into the box like any other text, and a menu
// offers the file's other sheets. The file stays in this tab.
import { $, showProblem } from "./dom.js";

let book = null; // {name, bytes} of the spreadsheet whose sheet is in the box

// isSpreadsheet tells a spreadsheet file by its first bytes (a ZIP file),
// whatever its name says.
export async function isSpreadsheet(file) {
  const head = new Uint8Array(await file.slice(0, 4).arrayBuffer());
  return head.length === 4 && head[0] === 0x50 && head[1] === 0x4b && head[2] === 3 && head[3] === 4;
}

// openSpreadsheet reads a spreadsheet file and puts its first sheet in the box.
export async function openSpreadsheet(file, ask, newText) {
  book = { name: file.name, bytes: new Uint8Array(await file.arrayBuffer()) };
  await showSheet("", ask, newText);
}

async function showSheet(sheet, ask, newText) {
  const { body, text } = await ask({ kind: "sheet", bytes: book.bytes, sheet });
  if (body.error) {
    showProblem({ ...body.error, message: book.name + ": " + body.error.message });
    return;
  }
  const select = $("sheet");
  select.replaceChildren(...body.sheets.map((name, i) => new Option(name, String(i + 1))));
  select.value = String(body.sheet);
  $("sheet-note").textContent = "of " + book.name + " (" + body.sheets.length + (body.sheets.length === 1 ? " sheet" : " sheets")
    + "): each row of the sheet is a line of the text, numbers with every digit stored";
  $("sheet-row").hidden = false;
  newText(new TextDecoder().decode(text));
}

// forgetSpreadsheet hides the sheet menu when the text comes from elsewhere.
export function forgetSpreadsheet() {
  book = null;
  $("sheet-row").hidden = true;
}

export function wireSheets(ask, newText) {
  $("sheet").addEventListener("change", () => { if (book) showSheet($("sheet").value, ask, newText); });
}
