// Small helpers to build the page without a framework.

/** Creates an element: h('p', { class: 'note' }, 'text', child). Attributes starting with "on" are listeners. */
export function h(tag, attributes = {}, ...children) {
  const element = document.createElement(tag);
  for (const [name, value] of Object.entries(attributes ?? {})) {
    if (value === null || value === undefined || value === false) {
      continue;
    }
    if (name.startsWith('on') && typeof value === 'function') {
      element.addEventListener(name.slice(2), value);
    } else if (value === true) {
      element.setAttribute(name, '');
    } else {
      element.setAttribute(name, value);
    }
  }
  append(element, children);
  return element;
}

function append(element, children) {
  for (const child of children.flat()) {
    if (child === null || child === undefined || child === false) {
      continue;
    }
    element.append(child instanceof Node ? child : String(child));
  }
}

/** Replaces everything inside an element. */
export function fill(element, ...children) {
  element.replaceChildren();
  append(element, children);
  return element;
}

/** A readable message box for an error (an ApiError or anything else). */
export function errorBox(error, lead) {
  const title = error?.title ?? 'Something went wrong';
  const detail = error?.detail ?? error?.message ?? String(error);
  return h('div', { class: 'message error', role: 'alert' },
    h('strong', {}, lead ? `${lead} — ${title}` : title),
    detail ? h('p', {}, detail) : null,
    error?.problems?.length ? h('ul', {}, error.problems.slice(0, 20).map(p => h('li', {}, p))) : null,
    error?.problems?.length > 20 ? h('p', {}, `… and ${error.problems.length - 20} more.`) : null);
}

export function note(text, kind = 'info') {
  return h('div', { class: `message ${kind}`, role: kind === 'info' ? 'status' : 'alert' }, text);
}

/** A section with a heading. */
export function panel(title, ...children) {
  return h('section', { class: 'panel' }, title ? h('h2', {}, title) : null, ...children);
}

// A number, maybe with grouped thousands and one unit after it ("1 240 m3", "0.049 EUR/m3"), or a dash for none.
const numericCell = /^(–|[−+-]?\d[\d\u202f\u00a0 ]*([.,]\d+)?( [^\s\d]\S*)?)$/;

/** A table from column headings and rows of cells; numeric cells are right-aligned. */
export function table(headings, rows, { caption, className } = {}) {
  return h('table', { class: className ?? 'grid' },
    caption ? h('caption', {}, caption) : null,
    h('thead', {}, h('tr', {}, headings.map(c => h('th', { scope: 'col' }, c)))),
    h('tbody', {}, rows.map(row => h('tr', {}, row.map(cell =>
      h('td', { class: typeof cell === 'number' || (typeof cell === 'string' && numericCell.test(cell)) ? 'num' : null }, cell))))));
}
