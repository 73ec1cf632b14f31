// The settings on the form, by the module's request keys.
import { $ } from "./dom.js";

export const fields = ["layout", "separator", "decimal", "thousands", "group", "measure", "alpha", "pvalue", "resamples", "seed", "posthoc", "adjust"];
const numeric = new Set(["alpha", "resamples", "seed"]);

// formOptions reads the settings as the module's options.
export function formOptions() {
  const options = {};
  for (const f of fields) options[f] = numeric.has(f) ? Number($(f).value) : $(f).value;
  return options;
}

// setOptions puts settings on the form; a setting not given takes its
// value from fallback (the module's defaults), or stays as it is. A column
// chosen before the text's columns are known is kept as a choice of its own.
export function setOptions(options, fallback = {}) {
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
