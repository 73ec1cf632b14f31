// How every value was ranked, page by page, and the tied values: the audit
// trail. Values and ranks are shown with every digit they were read with.
import { $, row } from "./dom.js";

const PAGE_ROWS = 200;
let ask = null; // the bridge's ask, for pages the answer does not hold
let shown = null; // the analysis whose ranks are on screen
let measure = null; // its index in the battery of measures it belongs to, null for one measure
let offset = 0;

// listPage gives a page of "ranks", "ranked" or "ties": from the result when
// it holds the whole list, else from the module, which keeps the last analysis.
async function listPage(r, list, from) {
  const complete = list === "ranks" ? r.ranks_complete : list === "ties" ? r.ties_complete : false;
  if (complete) return r[list].slice(from, from + PAGE_ROWS);
  const { body } = await ask({ kind: "page", list, offset: from, count: PAGE_ROWS, measure });
  return body[list === "ranked" ? "ranks" : list] || [];
}

async function showRanks() {
  const r = shown;
  const order = $("rank-order").value;
  $("rank-caption").textContent = order === "ranked" ? "Values by rank, smallest first; tied values together" : "Values in the order they were read";
  const entries = await listPage(r, order, offset);
  if (r !== shown) return;
  $("rank-rows").replaceChildren(...entries.map((v) =>
    row([v.line, v.group, String(v.value), String(v.rank), v.shared], v.shared > 1 ? "tied" : "")));
  const last = Math.min(offset + PAGE_ROWS, r.n);
  $("page-info").textContent = "Rows " + (offset + 1) + "–" + last + " of " + r.n;
  $("print-rank-note").textContent = last - offset === r.n ? "All " + r.n.toLocaleString("en") + " values are listed."
    : "Printed here: rows " + (offset + 1) + "–" + last + " of " + r.n.toLocaleString("en")
      + ", the rows on screen when this was printed; the page shows the others " + PAGE_ROWS + " at a time.";
  $("prev-page").disabled = offset === 0;
  $("next-page").disabled = last >= r.n;
}

async function showTies() {
  const r = shown;
  const entries = await listPage(r, "ties", 0);
  if (r !== shown) return;
  const rows = entries.map((t) => row([String(t.value), t.count]));
  if (r.ties_total === 0) rows.push(row(["none", ""]));
  if (r.ties_total > entries.length) rows.push(row(["… " + (r.ties_total - entries.length) + " more", ""]));
  $("tie-rows").replaceChildren(...rows);
}

export function renderRanks(state, changed) {
  if (!changed.has("result") || !state.result) return;
  $("ranks-box").hidden = Boolean(state.result.shared); // results shared without their values have no ranks
  if (state.result.shared) return;
  shown = state.result;
  measure = state.drill;
  offset = 0;
  showTies();
  showRanks();
}

// wireRanks connects the paging; asking is the bridge's ask.
export function wireRanks(asking) {
  ask = asking;
  $("rank-order").addEventListener("change", () => { offset = 0; showRanks(); });
  $("prev-page").addEventListener("click", () => { offset = Math.max(0, offset - PAGE_ROWS); showRanks(); });
  $("next-page").addEventListener("click", () => { offset += PAGE_ROWS; showRanks(); });
}
