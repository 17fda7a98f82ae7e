// The state store: one workspace object (the quote being edited, see
// scenario.js), changed through set()/replace()/mutate(); listeners hear what
// changed ({reason, path}) so views can repaint only their part.
//   reason 'value'     a field's value (no new fields appear)
//          'structure' fields appear or go (added option, other method, other fuel)
//          'load'      a whole new workspace

/** Splits "/fuels/0/price/amount" into ["fuels", 0, "price", "amount"]. */
export function splitPath(path) {
  return path.split('/').slice(1).map((part) => (/^\d+$/.test(part) ? Number(part) : part.replaceAll('~1', '/').replaceAll('~0', '~')));
}

/** Reads the value at a path, or undefined. */
export function getAt(root, path) {
  let node = root;
  for (const key of splitPath(path)) {
    if (node === null || typeof node !== 'object') return undefined;
    node = node[key];
  }
  return node;
}

/** Writes a value at a path, creating objects on the way; undefined deletes the key. */
export function setAt(root, path, value) {
  const keys = splitPath(path);
  let node = root;
  keys.slice(0, -1).forEach((key, i) => {
    if (node[key] === null || typeof node[key] !== 'object') node[key] = typeof keys[i + 1] === 'number' ? [] : {};
    node = node[key];
  });
  const last = keys.at(-1);
  if (value === undefined) {
    if (Array.isArray(node) && typeof last === 'number') node.splice(last, 1);
    else delete node[last];
  } else {
    node[last] = value;
  }
}

export class Store {
  #state;
  #listeners = new Set();

  constructor(state) {
    this.#state = state;
  }

  get state() { return this.#state; }

  get(path) { return getAt(this.#state, path); }

  /** Sets one value; `structural` when fields must appear or go because of it. */
  set(path, value, { structural = false } = {}) {
    setAt(this.#state, path, value);
    this.#emit({ reason: structural ? 'structure' : 'value', path });
  }

  /** Runs `fn(state)` to change several things at once. */
  mutate(fn, { reason = 'structure', path = '' } = {}) {
    fn(this.#state);
    this.#emit({ reason, path });
  }

  replace(state) {
    this.#state = state;
    this.#emit({ reason: 'load', path: '' });
  }

  subscribe(fn) {
    this.#listeners.add(fn);
    return () => this.#listeners.delete(fn);
  }

  #emit(change) {
    for (const fn of this.#listeners) fn(change, this.#state);
  }
}
