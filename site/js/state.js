// The page's state in one object, changed only through update, which then
// lets every view that asked for it render from the new state.

export const state = {
  defaults: {}, // the module's default settings, by request key
  limits: {}, // the module's bounds: text (bytes of a text read), link (characters of a link)
  menus: {}, // the methods the module offers, by setting
  result: null, // the last analysis (the module's JSON), null when none is shown
  tables: null, // its tables of results as the core shows them
  shared: null, // its results as shared (package findings) while small groups are protected, else null
  sharedTables: null, // their tables
  readOnly: false, // the results on screen came in a results-only link: there is no data behind them
  readOnlyLink: "", // that link's fragment, to pass the results on
  preview: null, // how the text was read, with its groups as written
  edits: { order: [], exclude: [], rename: {} }, // group edits beside the text
  undoable: [], // earlier edits, newest last
  pairsSorted: false, // the pairs sorted by adjusted p
  battery: null, // the last analysis when it was of several measures (the module's JSON), else null
  batteryTables: null, // its tables: {overview, measures: [tables of each measure, or null]}
  batteryShared: null, // its results as shared while small groups are protected: {overview, measures: [results as shared, or null]}
  batterySort: null, // the overview's order: null (the columns'), "p" or "effect"
  drill: null, // the index of the battery's measure shown in full in the results, null for the overview
};

const views = [];

// onUpdate registers a view: render(state, changed) is called after every
// update with the names of the parts changed.
export function onUpdate(render) {
  views.push(render);
}

// update changes parts of the state and renders the views.
export function update(changes) {
  Object.assign(state, changes);
  const changed = new Set(Object.keys(changes));
  for (const render of views) render(state, changed);
}
