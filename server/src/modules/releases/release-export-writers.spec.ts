import {
  createExportWriter,
  escapeXml,
  type ExportFormat,
  type ExportHeader,
} from './release-export-writers';
import type { ExportRow } from './release-exports-repository';

const header: ExportHeader = {
  version: '2026.1',
  publishedAt: '2026-01-05T10:00:00.000Z',
  notes: 'Demo <notes> & more',
};

const base: ExportRow = {
  section: 'formation_enthalpy',
  speciesKey: 'water',
  speciesName: 'Water',
  formula: 'H2O',
  phase: 'l',
  modification: null,
  quantity: 'formation_enthalpy',
  value: '-285830',
  uncertainty: '40',
  uncertaintyBasis: 'standard',
  method: 'evaluated',
  standardPressure: '1 bar',
  temperature: null,
  toPhase: null,
  toModification: null,
  heatCapacityForm: null,
  rangeIndex: null,
  tMin: null,
  tMax: null,
  coefficients: null,
  revisionId: 1,
  sourceCitation: 'Demo source, "quoted", with a comma',
  sourceDoi: null,
};

const heat = (rangeIndex: number, tMin: string, tMax: string): ExportRow => ({
  ...base,
  section: 'heat_capacity',
  speciesKey: 'water',
  phase: 'g',
  quantity: 'heat_capacity',
  value: null,
  uncertainty: null,
  uncertaintyBasis: null,
  heatCapacityForm: 'shomate',
  rangeIndex,
  tMin,
  tMax,
  coefficients: ['30.09', '6.83', '6.79', '-2.53', '0.08', null, null, null],
  revisionId: 2,
});

function run(format: ExportFormat, batches: ExportRow[][]): string {
  const w = createExportWriter(format, header);
  return w.begin() + batches.map((b) => w.rows(b)).join('') + w.end();
}

describe('export writers', () => {
  it('escapes XML text and replaces characters XML cannot hold', () => {
    expect(escapeXml(`a<b>&"c'\r\n\t`)).toBe('a&lt;b&gt;&amp;&quot;c&apos;&#13;\n\t');
    expect(escapeXml('bell\u0007 and \uD800 lone')).toBe('bell\uFFFD and \uFFFD lone');
    expect(escapeXml('ΔfH° 😀')).toBe('ΔfH° 😀');
  });

  it('groups the ranges of one heat-capacity set, across batch boundaries', () => {
    const rows = [base, heat(1, '298', '1000'), heat(2, '1000', '6000')];
    const doc = JSON.parse(run('json', [[rows[0]!, rows[1]!], [rows[2]!]]));
    expect(doc.heatCapacitySets).toHaveLength(1);
    expect(doc.heatCapacitySets[0]).toMatchObject({
      form: 'shomate',
      ranges: [
        {
          tMin: '298',
          tMax: '1000',
          coefficients: ['30.09', '6.83', '6.79', '-2.53', '0.08', null, null, null],
        },
        { tMin: '1000', tMax: '6000' },
      ],
    });
    expect(doc.transitions).toEqual([]);
    expect(Object.keys(doc)).toEqual([
      'format',
      'formatVersion',
      'release',
      'formationEnthalpies',
      'heatCapacitySets',
      'transitions',
    ]);
  });

  it.each(['csv', 'json', 'xml'] as const)(
    '%s: the same bytes however the rows are batched, and well-formed when empty',
    (format) => {
      const rows = [base, heat(1, '298', '1000'), heat(2, '1000', '6000')];
      expect(run(format, [rows])).toBe(run(format, [[rows[0]!], [], [rows[1]!, rows[2]!]]));
      const empty = run(format, []);
      if (format === 'json') expect(JSON.parse(empty).formationEnthalpies).toEqual([]);
      if (format === 'csv') expect(empty.split('\n')).toHaveLength(2);
      if (format === 'xml')
        expect(empty).toContain('<transitions>\n</transitions>\n</releaseExport>\n');
    },
  );

  it('writes CSV with quoting only where needed and empty cells for absent values', () => {
    const [head, line] = run('csv', [[base]]).split('\n');
    expect(head!.startsWith('section,species_key,species_name,formula,phase,modification')).toBe(
      true,
    );
    expect(line).toBe(
      'formation_enthalpy,water,Water,H2O,l,,formation_enthalpy,-285830,40,standard,evaluated,1 bar,,,,,,,,,,,,,,,,1,"Demo source, ""quoted"", with a comma",',
    );
  });

  it('guards CSV text cells that a spreadsheet would run as formulas, never numbers, JSON or XML', () => {
    const row: ExportRow = {
      ...base,
      speciesName: '=HYPERLINK("https://example.invalid")',
      method: '@evaluated',
      sourceCitation: '+1 demo source',
      sourceDoi: '-10.1000/demo',
    };
    const [, line] = run('csv', [[row]]).split('\n');
    expect(line).toBe(
      `formation_enthalpy,water,"'=HYPERLINK(""https://example.invalid"")",H2O,l,,formation_enthalpy,-285830,40,standard,'@evaluated,1 bar,,,,,,,,,,,,,,,,1,'+1 demo source,'-10.1000/demo`,
    );
    const [, heatLine] = run('csv', [[{ ...heat(1, '298', '1000'), speciesName: '-demo' }]]).split(
      '\n',
    );
    expect(heatLine).toContain(`,'-demo,`);
    expect(heatLine).toContain(',30.09,6.83,6.79,-2.53,0.08,,,,');

    const doc = JSON.parse(run('json', [[row]]));
    expect(doc.formationEnthalpies[0]).toMatchObject({
      speciesName: row.speciesName,
      method: '@evaluated',
      source: { citation: '+1 demo source', doi: '-10.1000/demo' },
    });
    const xml = run('xml', [[row]]);
    expect(xml).toContain(
      '<speciesName>=HYPERLINK(&quot;https://example.invalid&quot;)</speciesName>',
    );
    expect(xml).toContain('<method>@evaluated</method>');
    expect(xml).not.toContain("'");
  });
});
