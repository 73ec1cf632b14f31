// What leaves the tab — reports, files, copied text, pictures saved, links
// — comes from here: the results as shared (package findings: no single
// person's value, small groups protected) when protection is on or the
// results came in a results-only link, else the results as on screen.
import { state } from "./state.js";

// sharedResult gives results as shared in the shape the views and reports
// read: no values, ranks, lowest or highest; a hidden group's figures null.
export function sharedResult(f) {
  return {
    version: f.version, n: f.n, k: f.k, alpha: f.alpha, significant: f.significant, decision: f.decision,
    result_line: f.result_line, p_method_reason: f.p_method_reason, warnings: f.warnings, protection_note: f.protection,
    input: { measure: f.measure, excluded: [] },
    groups: f.groups.map((g) => ({ label: g.label, label_in_data: g.label, size: g.size, median: g.median, q1: g.q1, q3: g.q3, mean_rank: g.mean_rank })),
    posthoc: { reference: f.reference }, levels: null, ranks: [], ranks_complete: false, protection: null, shared: true,
  };
}

// protecting reports whether what leaves the tab is the results as shared.
export function protecting() {
  return state.readOnly || Boolean(state.result ? state.result.protection : state.battery && state.battery.measures.some((m) => m.protection));
}

// outgoing is {r, tables}: the result and its tables as they may leave the tab.
export function outgoing() {
  return protecting() ? { r: sharedResult(state.shared), tables: state.sharedTables } : { r: state.result, tables: state.tables };
}

// outgoingBattery is {overview, measures: [{r, tables} or null]}: a
// battery's overview and measures as they may leave the tab.
export function outgoingBattery() {
  const b = state.battery;
  if (!protecting()) return { overview: state.batteryTables.overview, measures: b.measures.map((m, i) => m.error ? null : { r: m, tables: state.batteryTables.measures[i] }) };
  const s = state.batteryShared;
  return { overview: s.overview, measures: s.measures.map((f) => f && { r: sharedResult(f), tables: f.tables }) };
}
