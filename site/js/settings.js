// The settings on the form, by the module's request keys.
import { $ } from "./dom.js";

export const fields = ["layout", "separator", "decimal", "thousands", "group", "measure", "alpha", "pvalue", "resamples", "seed", "posthoc", "adjust", "reference", "trend", "min_group_size"];
const numeric = new Set(["alpha", "resamples", "seed", "min_group_size"]);

// Several measures: the columns ticked, kept by key while the text's
// columns are not known yet (a kept workspace, a link).
let wantedMeasures = [];

// measuresChosen are the request's measures: ["all"], two or more
// columns' keys, or none (one measure, from the measure menu).
function measuresChosen() {
  if ($("measures-all").checked) return ["all"];
  const ticked = [...$("measures-list").querySelectorAll("input:checked")].map((c) => c.value);
  if (ticked.length >= 2) return ticked;
  return wantedMeasures.length >= 2 ? wantedMeasures : []; // asked for before the columns are known
}

// formOptions reads the settings as the module's options.
export function formOptions() {
  const options = {};
  for (const f of fields) options[f] = numeric.has(f) ? Number($(f).value) : $(f).value;
  const measures = measuresChosen();
  if (measures.length) {
    options.measures = measures;
    options.adjust_across = $("adjust_across").value;
  }
  return options;
}

// setMeasures ticks the measures of a request (none: one measure).
function setMeasures(measures, across) {
  wantedMeasures = measures[0] === "all" ? [] : measures;
  $("measures-all").checked = measures[0] === "all";
  for (const c of $("measures-list").querySelectorAll("input")) c.checked = wantedMeasures.includes(c.value);
  if (across) $("adjust_across").value = across;
  if (measures.length) $("measures-box").open = true;
}

// setOptions puts settings on the form; a setting not given takes its
// value from fallback (the module's defaults), or stays as it is. A column
// chosen before the text's columns are known is kept as a choice of its own.
export function setOptions(options, fallback = {}) {
  setMeasures(options.measures ?? [], options.adjust_across);
  for (const f of fields) {
    const v = options[f] ?? fallback[f];
    if (v === undefined) continue;
    const el = $(f);
    if (el.tagName === "SELECT" && ![...el.options].some((o) => o.value === String(v))) el.append(new Option(String(v), String(v)));
    el.value = String(v);
  }
}

// fillColumns offers the text's columns in the group and measure menus,
// each with what it holds; a choice made stays chosen.
export function fillColumns(columns) {
  const note = columns.whole ? "" : " in the first " + columns.records.toLocaleString() + " rows";
  for (const id of ["group", "measure"]) {
    const select = $(id);
    const chosen = select.value;
    const choices = columns.list.map((c, i) => {
      const key = columns.header ? c.name : String(i + 1);
      return new Option(c.name + " (" + c.distinct.toLocaleString() + " different, " + c.numbers.toLocaleString() + " numbers"
        + (c.unit ? " in \u201c" + c.unit + "\u201d" : "") + ", " + c.blanks.toLocaleString() + " blank" + note + ")", key);
    });
    if (chosen && !choices.some((o) => o.value === chosen)) choices.push(new Option(chosen + " (not in this text)", chosen));
    select.replaceChildren(new Option("as read", ""), ...choices);
    select.value = chosen;
  }
  // the checklist of measures: the columns that hold numbers
  const ticked = new Set([...wantedMeasures, ...[...$("measures-list").querySelectorAll("input:checked")].map((c) => c.value)]);
  wantedMeasures = [];
  $("measures-list").replaceChildren(...columns.list.flatMap((c, i) => {
    const key = columns.header ? c.name : String(i + 1);
    if (c.numbers === 0 || key === $("group").value) return [];
    const box = document.createElement("input");
    box.type = "checkbox";
    box.value = key;
    box.checked = ticked.has(key);
    const label = document.createElement("label");
    label.className = "inline";
    label.append(box, " " + c.name);
    return [label];
  }));
}

// fillReference offers the groups of the last analysis as the reference
// group (by their labels as written in the data, shown by their names); a
// choice made stays chosen.
export function fillReference(groups) {
  const select = $("reference"), chosen = select.value;
  const choices = groups.map((g) => new Option("each group with " + g.label + " only", g.label_in_data));
  if (chosen && !groups.some((g) => g.label_in_data === chosen)) choices.push(new Option("each group with " + chosen + " only (not in this analysis)", chosen));
  select.replaceChildren(new Option("every group with every other", ""), ...choices);
  select.value = chosen;
}

// chooseAlternative sets the reading's settings to another reading the
// core offered ({layout, group, measure}), as one change.
export function chooseAlternative(a) {
  $("layout").value = a.layout === "long" ? "auto" : a.layout;
  $("group").value = a.group;
  $("measure").value = a.measure;
  $("layout").dispatchEvent(new Event("change"));
}

// fillMenus puts the methods the module offers into their menus, once:
// the module owns their keys and the words shown.
export function fillMenus(menus) {
  for (const [option, choices] of Object.entries(menus)) {
    const select = $(option);
    if (select.options.length) continue;
    select.append(...choices.map((c) => new Option(c.label, c.key)));
  }
}
