/**
 * A LandXML document as a small tree of elements with their attributes, text and line
 * numbers, parsed by `fast-xml-parser`: the part of XML the LandXML readers need. Internal.
 *
 * @module io
 */
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { QuadspreadError } from '../index.js';
import { show } from '../errors.js';

/** An element: its name, attributes, text (trimmed), children in document order, and line. @internal */
export interface XmlElement {
  readonly name: string;
  readonly attrs: Readonly<Record<string, string>>;
  readonly text: string;
  readonly children: readonly XmlElement[];
  /** The line of its start tag (1-based). */
  readonly line: number;
}

/** `INVALID_FILE` naming the element and its line. @internal */
export const badElement = (where: string, e: XmlElement, what: string): QuadspreadError =>
  new QuadspreadError('INVALID_FILE', `${where}: <${e.name}> at line ${e.line}`, what);

type Raw = Record<string | symbol, unknown>;

// Deepest nesting taken (LandXML's deepest paths are some ten elements).
const MAX_DEPTH = 64;

/**
 * Parses the text of an XML document into its root element. Refuses text that is not
 * well-formed XML (naming the line), a document type declaration (entities are not expanded),
 * and nesting deeper than 64 elements.
 * @internal
 */
export function parseXml(text: string, where: string): XmlElement {
  if (typeof text !== 'string')
    throw new QuadspreadError('INVALID_ARGUMENT', `${where}(text)`, `${show(text)} is not text`);
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (/<!DOCTYPE/i.test(body))
    throw new QuadspreadError(
      'INVALID_FILE',
      `${where}: line ${lineAt(body, body.search(/<!DOCTYPE/i))}`,
      'a document type declaration (<!DOCTYPE …>) is not read: LandXML does not use one, and its entities are not expanded',
    );
  const valid = XMLValidator.validate(body, { allowBooleanAttributes: false });
  if (valid !== true)
    throw new QuadspreadError(
      'INVALID_FILE',
      `${where}: line ${valid.err.line}, column ${valid.err.col}`,
      `not well-formed XML: ${valid.err.msg}`,
    );
  const parser = new XMLParser({
    ignoreAttributes: false,
    attributeNamePrefix: '',
    attributesGroupName: '@',
    alwaysCreateTextNode: true,
    textNodeName: '#text',
    parseTagValue: false,
    parseAttributeValue: false,
    trimValues: true,
    captureMetaData: true,
    ignoreDeclaration: true,
    ignorePiTags: true,
    processEntities: false,
    htmlEntities: false,
    removeNSPrefix: true,
    maxNestedTags: MAX_DEPTH,
    isArray: (_name: string, _path: unknown, _leaf: boolean, isAttribute: boolean) => !isAttribute,
  });
  let raw: Raw;
  try {
    raw = parser.parse(body) as Raw;
  } catch (e) {
    throw new QuadspreadError('INVALID_FILE', where, `not readable XML: ${(e as Error).message}`);
  }
  const meta = XMLParser.getMetaDataSymbol() as unknown as symbol;
  const starts = lineStarts(body);
  const build = (name: string, node: Raw, depth: number): XmlElement => {
    if (depth > MAX_DEPTH)
      throw new QuadspreadError('INVALID_FILE', where, `elements nested deeper than ${MAX_DEPTH}`);
    const at = (node[meta] as { startIndex?: number } | undefined)?.startIndex ?? 0;
    const kids: { at: number; e: XmlElement }[] = [];
    for (const k of Object.keys(node)) {
      const v = node[k];
      if (k === '@' || k === '#text') continue;
      for (const child of v as Raw[]) {
        const e = build(k, typeof child === 'object' && child !== null ? child : {}, depth + 1);
        kids.push({ at: (child[meta] as { startIndex?: number } | undefined)?.startIndex ?? 0, e });
      }
    }
    kids.sort((a, b) => a.at - b.at);
    const t = node['#text'];
    const line = lineOf(starts, at);
    const attrs: Record<string, string> = {};
    for (const [k, v] of Object.entries((node['@'] as Record<string, string> | undefined) ?? {}))
      attrs[k] = decode(String(v), where, name, line);
    return {
      name,
      attrs,
      text: decode(
        typeof t === 'string' ? t.trim() : t === undefined ? '' : String(t),
        where,
        name,
        line,
      ),
      children: kids.map((k) => k.e),
      line,
    };
  };
  const roots = Object.entries(raw).filter(([k]) => k !== '#text' && k !== '@');
  if (roots.length !== 1 || (roots[0]![1] as Raw[]).length !== 1)
    throw new QuadspreadError('INVALID_FILE', where, 'the document has no single root element');
  const [name, list] = roots[0]! as [string, Raw[]];
  return build(name, list[0]!, 1);
}

const NAMED: Record<string, string> = { lt: '<', gt: '>', amp: '&', quot: '"', apos: "'" };

/** Replaces XML's five named entities and character references, in one pass. */
function decode(s: string, where: string, element: string, line: number): string {
  if (!s.includes('&')) return s;
  return s.replace(/&([^;&\s]{0,10});?/g, (all, ref: string) => {
    if (all.endsWith(';')) {
      if (Object.hasOwn(NAMED, ref)) return NAMED[ref]!;
      const m = /^#(?:x([0-9a-fA-F]{1,6})|([0-9]{1,7}))$/.exec(ref);
      const code = m ? parseInt(m[1] ?? m[2]!, m[1] !== undefined ? 16 : 10) : -1;
      if (code >= 0 && code <= 0x10ffff) return String.fromCodePoint(code);
    }
    throw new QuadspreadError(
      'INVALID_FILE',
      `${where}: <${element}> at line ${line}`,
      `${JSON.stringify(all)} is not an XML entity or character reference`,
    );
  });
}

function lineStarts(text: string): number[] {
  const out = [0];
  for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) out.push(i + 1);
  return out;
}

function lineOf(starts: readonly number[], index: number): number {
  let lo = 0;
  let hi = starts.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (starts[mid]! <= index) lo = mid;
    else hi = mid - 1;
  }
  return lo + 1;
}

const lineAt = (text: string, index: number): number => lineOf(lineStarts(text), index);
