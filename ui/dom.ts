/** A small element builder: `h('input', { type: 'text', 'data-path': p })`. No framework; the DOM is the state. */
export type Attrs = Readonly<Record<string, string | number | boolean | undefined>>;
export type Child = Node | string | undefined | false | null;

export function h<K extends keyof HTMLElementTagNameMap>(tag: K, attrs: Attrs = {}, ...children: Child[]): HTMLElementTagNameMap[K] {
  const e = document.createElement(tag);
  setAttrs(e, attrs);
  append(e, ...children);
  return e;
}

const SVG_NS = 'http://www.w3.org/2000/svg';

export function svg<K extends keyof SVGElementTagNameMap>(tag: K, attrs: Attrs = {}, ...children: Child[]): SVGElementTagNameMap[K] {
  const e = document.createElementNS(SVG_NS, tag);
  setAttrs(e, attrs);
  append(e, ...children);
  return e;
}

function setAttrs(e: Element, attrs: Attrs): void {
  for (const [k, v] of Object.entries(attrs)) {
    if (v === undefined || v === false) continue;
    e.setAttribute(k, v === true ? '' : String(v));
  }
}

export function append(e: Element, ...children: Child[]): void {
  for (const c of children) {
    if (c === undefined || c === false || c === null) continue;
    e.append(c);
  }
}

/** The element with this id; a missing one is a mistake in index.html, so it throws. */
export function byId<T extends HTMLElement = HTMLElement>(id: string): T {
  const e = document.getElementById(id);
  if (!e) throw new Error(`index.html has no #${id}`);
  return e as T;
}

export function button(text: string, title: string, onClick: () => void, attrs: Attrs = {}): HTMLButtonElement {
  const b = h('button', { type: 'button', title, 'aria-label': title, ...attrs }, text);
  b.addEventListener('click', onClick);
  return b;
}
