import { stringify } from 'csv-stringify/sync';
import { guardCsvText } from '../../lib/csv-text';
import { EXPORT_SECTIONS, type ExportRow, type ExportSection } from './release-exports-repository';

/**
 * Pure builders of the three export formats from rows in export order (README: "Release
 * exports"). A writer is fed batch by batch and returns text to send; the same rows always give
 * the same bytes (fixed key order, fixed layout, no clock).
 */
export const EXPORT_FORMATS = ['csv', 'json', 'xml'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

export const EXPORT_CONTENT_TYPES: Record<ExportFormat, string> = {
  csv: 'text/csv; charset=utf-8',
  json: 'application/json; charset=utf-8',
  xml: 'application/xml; charset=utf-8',
};

export const EXPORT_FORMAT_ID = 'thalpos-release-export';
export const EXPORT_FORMAT_VERSION = 1;

export interface ExportHeader {
  version: string;
  publishedAt: string;
  notes: string;
}

export interface ExportWriter {
  begin(): string;
  rows(batch: readonly ExportRow[]): string;
  end(): string;
}

/** Section names in the JSON and XML documents, with the element name of one item in XML. */
export const SECTION_KEYS: Record<ExportSection, { list: string; item: string }> = {
  formation_enthalpy: { list: 'formationEnthalpies', item: 'formationEnthalpy' },
  heat_capacity: { list: 'heatCapacitySets', item: 'heatCapacitySet' },
  transition: { list: 'transitions', item: 'transition' },
};

const COEFFICIENTS = 8;

/** CSV columns: one flat table, one row per value and per heat-capacity range. */
export const CSV_COLUMNS = [
  ['section', (r: ExportRow) => r.section],
  ['species_key', (r: ExportRow) => r.speciesKey],
  ['species_name', (r: ExportRow) => r.speciesName],
  ['formula', (r: ExportRow) => r.formula],
  ['phase', (r: ExportRow) => r.phase],
  ['modification', (r: ExportRow) => r.modification],
  ['quantity', (r: ExportRow) => r.quantity],
  ['value_j_per_mol', (r: ExportRow) => r.value],
  ['uncertainty_j_per_mol', (r: ExportRow) => r.uncertainty],
  ['uncertainty_basis', (r: ExportRow) => r.uncertaintyBasis],
  ['method', (r: ExportRow) => r.method],
  ['standard_pressure', (r: ExportRow) => r.standardPressure],
  ['temperature_k', (r: ExportRow) => r.temperature],
  ['to_phase', (r: ExportRow) => r.toPhase],
  ['to_modification', (r: ExportRow) => r.toModification],
  ['heat_capacity_form', (r: ExportRow) => r.heatCapacityForm],
  ['range_index', (r: ExportRow) => (r.rangeIndex == null ? null : String(r.rangeIndex))],
  ['t_min_k', (r: ExportRow) => r.tMin],
  ['t_max_k', (r: ExportRow) => r.tMax],
  ...Array.from(
    { length: COEFFICIENTS },
    (_, i) => [`c${i + 1}`, (r: ExportRow) => r.coefficients?.[i] ?? null] as const,
  ),
  ['revision_id', (r: ExportRow) => String(r.revisionId)],
  ['source_citation', (r: ExportRow) => r.sourceCitation],
  ['source_doi', (r: ExportRow) => r.sourceDoi],
] as const;

/** Columns of numbers, whose leading '-' is a sign; every other column is text, guarded. */
const CSV_NUMBER_COLUMNS: ReadonlySet<string> = new Set([
  'value_j_per_mol',
  'uncertainty_j_per_mol',
  'temperature_k',
  'range_index',
  't_min_k',
  't_max_k',
  ...Array.from({ length: COEFFICIENTS }, (_, i) => `c${i + 1}`),
  'revision_id',
]);

const CSV_CELLS = CSV_COLUMNS.map(([name, get]) =>
  CSV_NUMBER_COLUMNS.has(name) ? get : (r: ExportRow) => guardCsvText(get(r)),
);

function csvWriter(): ExportWriter {
  const options = { record_delimiter: '\n' } as const;
  return {
    begin: () => stringify([CSV_COLUMNS.map(([name]) => name)], options),
    rows: (batch) =>
      batch.length === 0
        ? ''
        : stringify(
            batch.map((r) => CSV_CELLS.map((get) => get(r) ?? '')),
            options,
          ),
    end: () => '',
  };
}

/** One item of a JSON/XML section; key order here is the order in the document. */
export type ExportRecord = Record<string, unknown>;

function baseRecord(r: ExportRow): ExportRecord {
  return {
    speciesKey: r.speciesKey,
    speciesName: r.speciesName,
    formula: r.formula,
    phase: r.phase,
    modification: r.modification,
  };
}

const tail = (r: ExportRow): ExportRecord => ({
  method: r.method,
  standardPressure: r.standardPressure,
  revisionId: r.revisionId,
  source: { citation: r.sourceCitation, doi: r.sourceDoi },
});

const range = (r: ExportRow) => ({ tMin: r.tMin, tMax: r.tMax, coefficients: r.coefficients });

/**
 * Turns rows into section items: a heat-capacity set spans one row per range, so it is held
 * until a row of another set arrives. `emit` receives each finished item with its section.
 */
function recordBuilder(emit: (section: ExportSection, record: ExportRecord) => void) {
  let open: { revisionId: number; record: ExportRecord & { ranges: unknown[] } } | null = null;
  const flush = () => {
    if (open) emit('heat_capacity', open.record);
    open = null;
  };
  return {
    row(r: ExportRow) {
      if (r.section === 'heat_capacity') {
        if (open?.revisionId === r.revisionId) {
          if (r.rangeIndex != null) open.record.ranges.push(range(r));
          return;
        }
        flush();
        const record = {
          ...baseRecord(r),
          form: r.heatCapacityForm,
          ranges: r.rangeIndex != null ? [range(r)] : [],
          ...tail(r),
        };
        open = { revisionId: r.revisionId, record };
        return;
      }
      flush();
      const values = {
        value: r.value,
        uncertainty: r.uncertainty,
        uncertaintyBasis: r.uncertaintyBasis,
      };
      emit(
        r.section,
        r.section === 'transition'
          ? {
              ...baseRecord(r),
              toPhase: r.toPhase,
              toModification: r.toModification,
              temperature: r.temperature,
              ...values,
              ...tail(r),
            }
          : { ...baseRecord(r), ...values, ...tail(r) },
      );
    },
    flush,
  };
}

/** Opens and closes the sections in their fixed order around the items, empty ones included. */
function sectionedWriter(parts: {
  begin: string;
  open: (section: ExportSection) => string;
  item: (section: ExportSection, record: ExportRecord, first: boolean) => string;
  close: (section: ExportSection) => string;
  end: string;
}): ExportWriter {
  let at = -1; // index of the open section
  let count = 0;
  let out = '';
  const moveTo = (index: number) => {
    while (at < index) {
      if (at >= 0) out += parts.close(EXPORT_SECTIONS[at]!);
      at++;
      count = 0;
      out += parts.open(EXPORT_SECTIONS[at]!);
    }
  };
  const builder = recordBuilder((section, record) => {
    moveTo(EXPORT_SECTIONS.indexOf(section));
    out += parts.item(section, record, count++ === 0);
  });
  const take = () => {
    const text = out;
    out = '';
    return text;
  };
  return {
    begin: () => parts.begin,
    rows(batch) {
      for (const r of batch) builder.row(r);
      return take();
    },
    end() {
      builder.flush();
      moveTo(EXPORT_SECTIONS.length - 1);
      out += parts.close(EXPORT_SECTIONS[at]!) + parts.end;
      return take();
    },
  };
}

function jsonWriter(header: ExportHeader): ExportWriter {
  const head = JSON.stringify({
    format: EXPORT_FORMAT_ID,
    formatVersion: EXPORT_FORMAT_VERSION,
    release: header,
  }).slice(0, -1);
  return sectionedWriter({
    begin: head,
    open: (s) => `,\n${JSON.stringify(SECTION_KEYS[s].list)}:[`,
    item: (_s, record, first) => `${first ? '\n' : ',\n'}${JSON.stringify(record)}`,
    close: () => ']',
    end: '}\n',
  });
}

// XML 1.0 allows tab, newline, carriage return and these ranges; anything else (other control
// characters, lone surrogates) cannot be written at all, escaped or not.
const NOT_XML_CHAR = /[^\t\n\r\u0020-\uD7FF\uE000-\uFFFD\u{10000}-\u{10FFFF}]/gu;
// eslint-disable-next-line no-control-regex -- control characters are exactly what it looks for
const NEEDS_ESCAPE = /[&<>"'\r\u0000-\u0008\u000B\u000C\u000E-\u001F\uD800-\uDFFF\uFFFE\uFFFF]/;
const XML_ESCAPES: Record<string, string> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&apos;',
  '\r': '&#13;',
};

/** Escapes text for element content or a quoted attribute; unwritable characters become U+FFFD. */
export function escapeXml(text: string): string {
  // Most values (numbers, keys, formulas) need nothing: one quick test spares two replaces.
  if (!NEEDS_ESCAPE.test(text)) return text;
  return text.replace(NOT_XML_CHAR, '\uFFFD').replace(/[&<>"'\r]/g, (c) => XML_ESCAPES[c]!);
}

function xmlElement(name: string, value: unknown): string {
  if (value === null || value === undefined) return '';
  if (Array.isArray(value)) {
    const item = name === 'ranges' ? 'range' : 'c';
    // A missing coefficient keeps its place as an empty element; a missing list is left out.
    const inner = value.map((v) => (v === null ? `<${item}/>` : xmlElement(item, v))).join('');
    return `<${name}>${inner}</${name}>`;
  }
  if (typeof value === 'object') {
    const inner = Object.entries(value as ExportRecord)
      .map(([k, v]) => xmlElement(k, v))
      .join('');
    return `<${name}>${inner}</${name}>`;
  }
  return `<${name}>${escapeXml(String(value))}</${name}>`;
}

function xmlWriter(header: ExportHeader): ExportWriter {
  const attrs =
    `format="${EXPORT_FORMAT_ID}" formatVersion="${EXPORT_FORMAT_VERSION}" ` +
    `version="${escapeXml(header.version)}" publishedAt="${escapeXml(header.publishedAt)}"`;
  return sectionedWriter({
    begin:
      `<?xml version="1.0" encoding="UTF-8"?>\n<releaseExport ${attrs}>\n` +
      `${xmlElement('notes', header.notes)}\n`,
    open: (s) => `<${SECTION_KEYS[s].list}>\n`,
    item: (s, record) => `${xmlElement(SECTION_KEYS[s].item, record)}\n`,
    close: (s) => `</${SECTION_KEYS[s].list}>\n`,
    end: '</releaseExport>\n',
  });
}

export function createExportWriter(format: ExportFormat, header: ExportHeader): ExportWriter {
  switch (format) {
    case 'csv':
      return csvWriter();
    case 'json':
      return jsonWriter(header);
    case 'xml':
      return xmlWriter(header);
  }
}
