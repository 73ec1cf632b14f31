// The text to analyse: the box, a large text held in the tab instead of
// the box, files opened or dropped, and pastes.
import { $, showProblem } from "./dom.js";
import { state } from "./state.js";
import { forgetSpreadsheet, isSpreadsheet, openSpreadsheet, wireSheets } from "./sheets.js";

// A large text (pasted, opened or dropped) is held here instead of in the
// text box: laying out a box of 100,000 lines costs the browser seconds. The
// preview shows it as cells, and it can be put in the box on request. A
// large file is held as its bytes, never made a string here: the module
// reads them (and their encoding) itself.
export const HOLD_LIMIT = 256 * 1024; // characters (or bytes of a file)
let heldText = null; // a large paste
let heldBytes = null; // a large file's bytes

// dataText is the text to analyse as a string (a held file's bytes are
// decoded, which costs as much as the file: for a link or the box only).
export function dataText() {
  return heldBytes ? new TextDecoder().decode(heldBytes) : heldText ?? $("data").value;
}

// dataInput is the text to analyse as the module takes it: a string, or a
// held file's bytes.
export function dataInput() {
  return heldBytes ?? dataText();
}

// dataSize is the length of the text to analyse, in characters (in bytes
// for a held file).
export function dataSize() {
  return heldBytes ? heldBytes.length : dataText().length;
}

// heldFile tells whether the text is a held file's bytes.
export function heldFile() {
  return heldBytes !== null;
}

// setText puts a text in the box, or holds it when it is large: a string,
// or a file's bytes.
export function setText(text) {
  const hold = text.length > HOLD_LIMIT;
  const bytes = typeof text !== "string";
  if (bytes && !hold) text = new TextDecoder().decode(text);
  heldText = hold && !bytes ? text : null;
  heldBytes = hold && bytes ? text : null;
  $("data").value = hold ? "" : text;
  $("data").hidden = hold;
  $("held").hidden = !hold;
  if (hold) {
    let lines = 1;
    if (bytes) {
      for (let i = 0; i < text.length - 1; i++) if (text[i] === 10) lines++;
    } else {
      for (let i = text.indexOf("\n"); i >= 0 && i < text.length - 1; i = text.indexOf("\n", i + 1)) lines++;
    }
    $("held-note").textContent = "The " + (bytes ? "file" : "text") + " (" + lines.toLocaleString() + " lines, " + (text.length / 1e6).toFixed(1)
      + (bytes ? " MB" : " million characters") + ") is held in this tab rather than shown in the box, which would be slow. Its first lines are shown as cells below.";
  }
}

// fileNote says how the file opened was read when it was not UTF-8 ("":
// nothing to say).
function fileNote(text) {
  $("file-note").textContent = text;
  $("file-note").hidden = text === "";
}

function showHeldAsText() {
  const text = dataText();
  heldText = heldBytes = null;
  $("held").hidden = true;
  $("data").hidden = false;
  $("data").value = text;
}

// selectLine selects a line of the text box, so a marked cell is found at once.
export function selectLine(line) {
  if (heldText !== null) showHeldAsText();
  const text = dataText();
  let start = 0;
  for (let l = 1; l < line && start >= 0; l++) start = text.indexOf("\n", start) + 1 || -1;
  if (start < 0) return;
  const end = text.indexOf("\n", start);
  const box = $("data");
  box.focus();
  box.setSelectionRange(start, end < 0 ? text.length : end);
}

// wireInput connects the box, the file chooser and drops; newText(text) is
// called with a text that replaces the box's (a file, a sheet of a
// spreadsheet, a large paste; a large file's bytes); ask sends the worker a
// request.
export function wireInput(newText, ask) {
  wireSheets(ask, newText);
  $("held-clear").addEventListener("click", () => fileNote(""));
  // a large paste is held rather than laid out in the box (it replaces the box's text)
  $("data").addEventListener("paste", (e) => {
    const text = e.clipboardData?.getData("text/plain") ?? "";
    if (text.length <= HOLD_LIMIT) return;
    e.preventDefault();
    fileNote("");
    forgetSpreadsheet();
    newText(text);
  });
  $("held-edit").addEventListener("click", () => { showHeldAsText(); $("data").focus(); });
  $("held-clear").addEventListener("click", () => { setText(""); $("data").dispatchEvent(new Event("input")); $("data").focus(); });

  // Files are read with the File API in this tab; nothing is sent anywhere.
  async function readFile(file) {
    if (file.size > state.limits.text) {
      showProblem({ message: "The file " + file.name + " is " + (file.size / 1048576).toFixed(1) + " MB; the most that is read is "
        + (state.limits.text / 1048576) + " MB. Save only the group and value columns, or a part of the rows." });
      return;
    }
    if (await isSpreadsheet(file)) {
      openSpreadsheet(file, ask, newText);
      return;
    }
    forgetSpreadsheet();
    let bytes;
    try {
      bytes = new Uint8Array(await file.arrayBuffer());
    } catch (err) {
      showProblem({ message: "The file " + file.name + " could not be read: " + err });
      return;
    }
    if (bytes.length > HOLD_LIMIT) { // held as bytes: the reading says their encoding
      fileNote("");
      newText(bytes);
      return;
    }
    try {
      const text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
      fileNote("");
      newText(text);
    } catch {
      // not UTF-8: the module reads UTF-16 and Windows-1252 (core/textenc), and says how
      const { body, text } = await ask({ kind: "text-file", bytes });
      if (body.error) {
        showProblem({ ...body.error, message: file.name + ": " + body.error.message });
        return;
      }
      fileNote(file.name + ": " + body.note + ".");
      newText(new TextDecoder().decode(text));
    }
  }
  $("file").addEventListener("change", () => { if ($("file").files[0]) readFile($("file").files[0]); });
  for (const target of [$("data"), $("held")]) {
    target.addEventListener("dragover", (e) => { e.preventDefault(); target.classList.add("dropping"); });
    target.addEventListener("dragleave", () => target.classList.remove("dropping"));
    target.addEventListener("drop", (e) => {
      e.preventDefault();
      target.classList.remove("dropping");
      if (e.dataTransfer.files[0]) readFile(e.dataTransfer.files[0]);
    });
  }
}
