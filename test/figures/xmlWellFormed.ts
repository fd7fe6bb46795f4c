/**
 * A small well-formedness check for the SVG we write (XML 1.0 §2.1, restricted to what we emit:
 * one XML declaration, elements, attributes in double quotes, text, character entities; no DTD,
 * comments or CDATA). Returns the problems found; an empty list means well-formed. The browser's
 * DOMParser checks the same documents in the e2e test.
 */
const NAME = /^[A-Za-z_][\w.:-]*$/;
const ENTITY = /&(?:amp|lt|gt|quot|apos|#\d+|#x[0-9a-fA-F]+);/g;

export function xmlProblems(text: string): string[] {
  const problems: string[] = [], open: string[] = [];
  let body = text;
  if (body.startsWith('<?xml')) body = body.slice(body.indexOf('?>') + 2);
  const token = /<([^>]*)>|([^<]+)/g;
  let m: RegExpExecArray | null, roots = 0;
  while ((m = token.exec(body))) {
    if (m[2] !== undefined) {
      if (m[2].replace(ENTITY, '').includes('&')) problems.push(`bare & in text near "${m[2].slice(0, 30)}"`);
      if (open.length === 0 && m[2].trim()) problems.push('text outside the root element');
      continue;
    }
    const tag = m[1];
    if (tag.startsWith('/')) {
      const name = tag.slice(1).trim();
      if (open.pop() !== name) problems.push(`closing </${name}> does not match`);
      continue;
    }
    const selfClosing = tag.endsWith('/');
    const inner = selfClosing ? tag.slice(0, -1) : tag;
    const name = inner.split(/\s/)[0];
    if (!NAME.test(name)) problems.push(`bad element name "${name}"`);
    problems.push(...attributeProblems(inner.slice(name.length), name));
    if (open.length === 0) roots++;
    if (!selfClosing) open.push(name);
  }
  if (open.length) problems.push(`unclosed: ${open.join(', ')}`);
  if (roots !== 1) problems.push(`expected one root element, found ${roots}`);
  return problems;
}

function attributeProblems(rest: string, element: string): string[] {
  const problems: string[] = [], seen = new Set<string>();
  const attr = /\s+([^\s=]+)="([^"]*)"/g;
  let consumed = '', m: RegExpExecArray | null;
  while ((m = attr.exec(rest))) {
    consumed += m[0];
    if (!NAME.test(m[1])) problems.push(`<${element}>: bad attribute name "${m[1]}"`);
    if (seen.has(m[1])) problems.push(`<${element}>: attribute ${m[1]} twice`);
    seen.add(m[1]);
    if (m[2].includes('<') || m[2].replace(ENTITY, '').includes('&')) problems.push(`<${element}>: raw < or & in ${m[1]}`);
  }
  if (consumed.trim() !== rest.trim()) problems.push(`<${element}>: attributes not all of the form name="value"`);
  return problems;
}
