// DOM construction helpers. Text is always set with textContent and attributes
// with setAttribute, so text from the user or the core is never parsed as HTML.

const SVG_NS = 'http://www.w3.org/2000/svg';

function apply(node, props) {
  for (const [key, value] of Object.entries(props ?? {})) {
    if (value === undefined || value === null || value === false) continue;
    if (key === 'text') node.textContent = String(value);
    else if (key === 'class') node.setAttribute('class', value);
    else if (key === 'dataset') Object.assign(node.dataset, value);
    else if (key === 'on') for (const [type, fn] of Object.entries(value)) node.addEventListener(type, fn);
    else if (key === 'value' && 'value' in node && !(node instanceof SVGElement)) node.value = String(value);
    else if (key === 'checked' || key === 'selected' || key === 'disabled' || key === 'hidden') node[key] = Boolean(value);
    else node.setAttribute(key, value === true ? '' : String(value));
  }
}

function append(node, children) {
  for (const child of children.flat(Infinity)) {
    if (child === undefined || child === null || child === false) continue;
    node.append(child instanceof Node ? child : document.createTextNode(String(child)));
  }
}

/** Creates an HTML element: h('p', {class: 'x', text: 'y'}, child, ...). Strings become text nodes. */
export function h(tag, props, ...children) {
  const node = document.createElement(tag);
  apply(node, props);
  append(node, children);
  return node;
}

/** Creates an SVG element in the SVG namespace. */
export function s(tag, props, ...children) {
  const node = document.createElementNS(SVG_NS, tag);
  apply(node, props);
  append(node, children);
  return node;
}

/** A stable element id from a workspace path ("/fuels/0/price/amount" -> "f-fuels-0-price-amount"). */
export function idFor(path, suffix = '') {
  return `f${path.replace(/[^A-Za-z0-9]+/g, '-')}${suffix}`;
}

/** Offers `text` as a file called `name` of MIME type `type` to download. */
export function download(name, type, text) {
  const url = URL.createObjectURL(new Blob([text], { type }));
  const a = h('a', { href: url, download: name, hidden: true });
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

/**
 * A tap on a button with `data-action` inside any of `nodes` calls `actions[action](button.dataset)`; the
 * tap goes no further (the page's own action table does not see it). Buttons of other actions are left alone.
 */
export function onActions(nodes, actions) {
  for (const node of nodes) {
    node.addEventListener('click', (event) => {
      const button = event.target.closest('button[data-action]');
      const action = button && actions[button.dataset.action];
      if (!action) return;
      event.preventDefault();
      event.stopPropagation();
      action(button.dataset);
    });
  }
}
