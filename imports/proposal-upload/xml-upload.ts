import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { LAYOUT_NAMES, LAYOUTS, type Layout } from './layouts';
import {
  MAX_UPLOAD_ROWS,
  type FileError,
  type RawUpload,
  type RowProblem,
  type UploadRow,
} from './upload-rows';
import { FileProblem } from './upload-text';

/** The root element of an XML upload (imports/README.md, "Proposal upload"). */
export const XML_ROOT = 'proposal-upload';

// Entities are never expanded: a DOCTYPE is refused before parsing, and the parser is told not
// to process entities, so no internal or external entity (nor a "billion laughs") can grow.
const parser = new XMLParser({
  preserveOrder: true,
  captureMetaData: true,
  processEntities: false,
  htmlEntities: false,
  ignoreAttributes: false,
  attributeNamePrefix: '',
  parseAttributeValue: false,
  parseTagValue: false,
  trimValues: true,
  ignoreDeclaration: true,
  ignorePiTags: true,
});
const META = XMLParser.getMetaDataSymbol() as unknown as symbol;

type Node = Record<string, unknown> & { ':@'?: Record<string, string> };

const PREDEFINED: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'" };

/**
 * The five predefined references and character references are read; any other `&name;` was
 * declared by a DOCTYPE we refuse, so it is reported instead of expanded.
 */
function decodeReferences(text: string, report: (name: string) => void): string {
  return text.replace(/&(#x[0-9a-fA-F]+|#[0-9]+|[A-Za-z_][\w.-]*);/g, (whole, ref: string) => {
    if (ref.startsWith('#x')) return codePoint(parseInt(ref.slice(2), 16), whole);
    if (ref.startsWith('#')) return codePoint(parseInt(ref.slice(1), 10), whole);
    const known = PREDEFINED[ref];
    if (known !== undefined) return known;
    report(ref);
    return whole;
  });
}

function codePoint(cp: number, fallback: string): string {
  return cp > 0 && cp <= 0x10ffff ? String.fromCodePoint(cp) : fallback;
}

function lineIndex(text: string): (offset: number) => number {
  const starts = [0];
  for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === 10) starts.push(i + 1);
  return (offset) => {
    let lo = 0;
    let hi = starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (starts[mid]! <= offset) lo = mid;
      else hi = mid - 1;
    }
    return lo + 1;
  };
}

const nameOf = (node: Node) => Object.keys(node).find((k) => k !== ':@');

function textOf(node: Node, name: string): string {
  const children = (node[name] as Node[] | undefined) ?? [];
  return children.map((c) => (typeof c['#text'] === 'string' ? c['#text'] : '')).join('');
}

const ELEMENT_LAYOUT = new Map<string, Layout>(LAYOUT_NAMES.map((l) => [LAYOUTS[l].element, l]));

/** An XML upload: `<proposal-upload>` with an optional `<rationale>` and one element per row. */
export function readXmlUpload(text: string): RawUpload {
  const doctype = /<!DOCTYPE|<!ENTITY/i.exec(text);
  if (doctype !== null)
    throw new FileProblem(
      'xml_doctype',
      'XML with a DOCTYPE or entity declarations is not accepted: entities are never expanded. Remove the <!DOCTYPE …> and use plain text (the five predefined references such as &amp; are fine).',
      lineIndex(text)(doctype.index),
    );
  const valid = XMLValidator.validate(text);
  if (valid !== true)
    throw new FileProblem(
      'xml_syntax',
      `XML syntax, line ${valid.err.line}: ${valid.err.msg}`,
      valid.err.line,
    );
  const line = lineIndex(text);
  const doc = parser.parse(text) as Node[];
  const roots = doc.filter((n) => nameOf(n) !== '#text');
  const root = roots[0];
  if (roots.length !== 1 || root === undefined || nameOf(root) !== XML_ROOT)
    throw new FileProblem(
      'unknown_layout',
      `An XML upload has one root element <${XML_ROOT}>; found ${roots.map((r) => `<${nameOf(r)}>`).join(', ') || 'none'}.`,
      1,
    );
  const fileErrors: FileError[] = [];
  const rows: UploadRow[] = [];
  let rationale: string | null = null;
  for (const node of (root[XML_ROOT] as Node[]) ?? []) {
    const name = nameOf(node);
    const at = line(
      ((node as Record<symbol, unknown>)[META] as { startIndex?: number } | undefined)
        ?.startIndex ?? 0,
    );
    if (name === undefined) continue;
    if (name === '#text') {
      fileErrors.push({
        line: at,
        message: `text outside any element: ${String(node['#text']).slice(0, 60)}`,
      });
      continue;
    }
    if (name === 'rationale') {
      rationale = decodeReferences(textOf(node, name), (ref) =>
        fileErrors.push({
          line: at,
          message: `&${ref}; is not expanded: entities are not supported`,
        }),
      );
      continue;
    }
    const layout = ELEMENT_LAYOUT.get(name);
    if (layout === undefined) {
      fileErrors.push({
        line: at,
        message: `unknown element <${name}>; a row is one of ${LAYOUT_NAMES.map((l) => `<${LAYOUTS[l].element}>`).join(', ')}`,
      });
      continue;
    }
    if (rows.length >= MAX_UPLOAD_ROWS)
      throw new FileProblem(
        'too_many_rows',
        `The file has more than ${MAX_UPLOAD_ROWS} rows; an upload takes at most ${MAX_UPLOAD_ROWS}. Split it into several files.`,
      );
    rows.push(xmlRow(node, layout, rows.length + 1, at));
  }
  return { format: 'xml', rationale: rationale?.trim() || null, rows, fileErrors };
}

function xmlRow(node: Node, layout: Layout, n: number, line: number): UploadRow {
  const columns: readonly string[] = LAYOUTS[layout].columns;
  const errors: RowProblem[] = [];
  const cells: Record<string, string | null> = Object.fromEntries(columns.map((c) => [c, null]));
  for (const [attr, raw] of Object.entries(node[':@'] ?? {})) {
    if (!columns.includes(attr)) {
      errors.push({ code: 'unknown_column', column: attr, message: `unknown attribute ${attr}` });
      continue;
    }
    // Attribute-value normalisation: line breaks read as spaces, as XML prescribes.
    const value = decodeReferences(String(raw).replace(/\r?\n|\r|\t/g, ' '), (ref) =>
      errors.push({
        code: 'entity',
        column: attr,
        message: `&${ref}; is not expanded: entities are not supported`,
      }),
    ).trim();
    cells[attr] = value === '' ? null : value;
  }
  const element = LAYOUTS[layout].element;
  if ((node[element] as Node[] | undefined)?.some((c) => nameOf(c) !== undefined))
    errors.push({
      code: 'invalid_value',
      message: `<${element}> takes attributes only, no content`,
    });
  return { n, line, layout, cells, errors };
}
