/**
 * A minimal stand-in for the browser's `document`, just enough for the web view's chart modules
 * (web/*.js) to draw into, so `forehalo demo` writes the very same charts as standalone SVG files.
 * Supports element creation, attributes, text nodes, append/replaceChildren and serialisation.
 * Event listeners are accepted and ignored (a file has no hover).
 */

type Child = ShimElement | ShimText;

const XML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' };
const escapeXml = (s: string) => s.replace(/[&<>"]/g, (c) => XML_ESCAPES[c]);

class ShimText {
  constructor(readonly text: string) {}
  serialize(): string {
    return escapeXml(this.text);
  }
}

export class ShimElement {
  readonly attributes = new Map<string, string>();
  children: Child[] = [];
  readonly dataset: Record<string, string> = {};
  readonly style: Record<string, string> = {};
  className = '';
  constructor(readonly tagName: string) {}
  setAttribute(name: string, value: string): void {
    this.attributes.set(name, String(value));
  }
  getAttribute(name: string): string | null {
    return this.attributes.get(name) ?? null;
  }
  removeAttribute(name: string): void {
    this.attributes.delete(name);
  }
  append(...nodes: (Child | string)[]): void {
    for (const n of nodes) this.children.push(typeof n === 'string' ? new ShimText(n) : n);
  }
  appendChild(node: Child): Child {
    this.children.push(node);
    return node;
  }
  replaceChildren(...nodes: (Child | string)[]): void {
    this.children = [];
    this.append(...nodes);
  }
  addEventListener(): void {}
  set textContent(text: string) {
    this.children = [new ShimText(text)];
  }
  get textContent(): string {
    return this.children.map((c) => (c instanceof ShimText ? c.text : c.textContent)).join('');
  }
  serialize(): string {
    const attrs = [...this.attributes].map(([k, v]) => ` ${k}="${escapeXml(v)}"`).join('');
    const cls =
      this.className && !this.attributes.has('class') ? ` class="${escapeXml(this.className)}"` : '';
    if (this.children.length === 0) return `<${this.tagName}${attrs}${cls}/>`;
    return `<${this.tagName}${attrs}${cls}>${this.children.map((c) => c.serialize()).join('')}</${this.tagName}>`;
  }
}

export const shimDocument = {
  createElementNS: (_ns: string, name: string) => new ShimElement(name),
  createElement: (name: string) => new ShimElement(name),
  createTextNode: (text: string) => new ShimText(text),
};

/** The first <svg> drawn into a container, as a standalone SVG file with the page's stylesheet inlined. */
export function standaloneSvg(container: ShimElement, css: string, title: string): string | null {
  const svg = findSvg(container);
  if (!svg) return null;
  svg.setAttribute('xmlns', 'http://www.w3.org/2000/svg');
  const body = svg.serialize();
  const open = body.indexOf('>') + 1;
  const head = `<title>${escapeXml(title)}</title><style>${css.replace(/]]>/g, '')}</style><rect width="100%" height="100%" fill="#ffffff"/>`;
  return `<?xml version="1.0" encoding="UTF-8"?>\n${body.slice(0, open)}${head}${body.slice(open)}\n`;
}

function findSvg(node: ShimElement): ShimElement | null {
  if (node.tagName === 'svg') return node;
  for (const c of node.children) {
    if (c instanceof ShimElement) {
      const found = findSvg(c);
      if (found) return found;
    }
  }
  return null;
}
