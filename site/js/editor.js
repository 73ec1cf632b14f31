// The group editor: order, groups left out and names shown live beside the
// text, which is never rewritten. Each change can be undone.
import { $ } from "./dom.js";
import { update } from "./state.js";

export const NO_EDITS = { order: [], exclude: [], rename: {} };
export const UNDO_KEPT = 50;

// shownOrder is the order of the text's groups after the edits.
function shownOrder(state) {
  const labels = (state.preview?.groups ?? []).map((g) => g.label);
  const first = state.edits.order.filter((l) => labels.includes(l));
  return first.concat(labels.filter((l) => !first.includes(l)));
}

let edited = () => {};

// whenEdited sets what follows a change of the edits by the analyst.
export function whenEdited(then) {
  edited = then;
}

// editGroups makes a change of the edits that can be undone.
export function editGroups(state, next) {
  update({ edits: next, undoable: state.undoable.concat([state.edits]).slice(-UNDO_KEPT) });
  edited();
}

// undoEdit takes back the last change of the edits.
export function undoEdit(state) {
  if (state.undoable.length === 0) return;
  update({ edits: state.undoable.at(-1), undoable: state.undoable.slice(0, -1) });
  edited();
}

export function renderEditor(state, changed) {
  if (!changed.has("preview") && !changed.has("edits")) return;
  const { edits } = state;
  const order = shownOrder(state);
  $("editor-box").hidden = order.length === 0;
  $("undo").disabled = state.undoable.length === 0;
  const byLabel = new Map((state.preview?.groups ?? []).map((g) => [g.label, g]));
  $("editor-rows").replaceChildren(...order.map((label, i) => {
    const g = byLabel.get(label);
    const tr = document.createElement("tr");
    const included = !edits.exclude.includes(label);
    if (!included) tr.className = "left-out";
    const cell = (child) => { const td = document.createElement("td"); td.append(child); tr.append(td); return td; };
    const box = document.createElement("input");
    box.type = "checkbox";
    box.checked = included;
    box.setAttribute("aria-label", "Include " + label + " in the test");
    box.addEventListener("change", () => editGroups(state, { ...edits,
      exclude: box.checked ? edits.exclude.filter((l) => l !== label) : edits.exclude.concat([label]) }));
    cell(box);
    cell(document.createTextNode(label));
    const name = document.createElement("input");
    name.type = "text";
    name.value = edits.rename[label] || "";
    name.placeholder = label;
    name.setAttribute("aria-label", "Name to show for " + label);
    name.addEventListener("change", () => {
      const rename = { ...edits.rename };
      if (name.value.trim() === "" || name.value === label) delete rename[label];
      else rename[label] = name.value;
      editGroups(state, { ...edits, rename });
    });
    cell(name);
    cell(document.createTextNode(String(g.n)));
    cell(document.createTextNode(String(g.missing)));
    const moves = cell(document.createTextNode(""));
    for (const [text, by, words] of [["↑", -1, "up"], ["↓", 1, "down"]]) {
      const b = document.createElement("button");
      b.type = "button";
      b.className = "quiet move";
      b.textContent = text;
      b.setAttribute("aria-label", "Move " + label + " " + words);
      b.disabled = i + by < 0 || i + by >= order.length;
      b.addEventListener("click", () => {
        const next = order.slice();
        [next[i], next[i + by]] = [next[i + by], next[i]];
        editGroups(state, { ...edits, order: next });
        document.querySelector('[aria-label="' + CSS.escape("Move " + label + " " + words) + '"]')?.focus();
      });
      moves.append(b);
    }
    return tr;
  }));
}
