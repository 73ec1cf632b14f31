// The settings on the form, by the module's request keys.
import { $ } from "./dom.js";

export const fields = ["layout", "separator", "decimal", "alpha", "pvalue", "resamples", "seed", "posthoc", "adjust"];
const numeric = new Set(["alpha", "resamples", "seed"]);

// formOptions reads the settings as the module's options.
export function formOptions() {
  const options = {};
  for (const f of fields) options[f] = numeric.has(f) ? Number($(f).value) : $(f).value;
  return options;
}

// setOptions puts settings on the form; a setting not given takes its
// value from fallback (the module's defaults), or stays as it is.
export function setOptions(options, fallback = {}) {
  for (const f of fields) {
    const v = options[f] ?? fallback[f];
    if (v !== undefined) $(f).value = String(v);
  }
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
