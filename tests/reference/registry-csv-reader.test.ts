/**
 * The reader of the registry's dataset format (imports/registry-csv/): row-level errors,
 * exact unit conversion, models built for the engine. The starter data: starter-data.test.ts.
 */
import {
  canonicalDecimal,
  parseDataset,
  parseFormationCsv,
  parseHeatCapacityCsv,
  parseSourcesJson,
  parseSpeciesCsv,
  parseTransitionsCsv,
  toJoulesPerMoleText,
} from '../../imports/registry-csv';

const SPECIES_HEAD = 'key,name,formula,charge,synonyms,cas_rn,inchi,inchikey,smiles,notes';
const FORMATION_HEAD =
  'species,phase,modification,value,unit,uncertainty,uncertainty_basis,method,standard_pressure_pa,source,from_memory,notes';
const HC_HEAD =
  'species,phase,modification,model,t_min_k,t_max_k,c1,c2,c3,c4,c5,c6,c7,c8,source,from_memory,notes';
const TRANSITION_HEAD =
  'species,from_phase,from_modification,to_phase,to_modification,temperature_k,value,unit,uncertainty,uncertainty_basis,method,standard_pressure_pa,source,from_memory,notes';

const WATER =
  'water,Water,H2O,0,oxidane|dihydrogen monoxide,7732-18-5,InChI=1S/H2O/h1H2,XLYOFNOQVPJJNP-UHFFFAOYSA-N,O,';
const SOURCES = JSON.stringify([
  { id: 'kestrel-2026', type: 'report', title: 'Kestrel data sheet' },
]);

describe('registry-csv reader', () => {
  it('converts kJ and kcal to J/mol exactly, as decimal text', () => {
    expect(toJoulesPerMoleText('-285.830', 'kJ/mol')).toBe('-285830');
    expect(toJoulesPerMoleText('0.04', 'kJ/mol')).toBe('40');
    expect(toJoulesPerMoleText('-68.3174', 'kcal/mol')).toBe('-285840.0016');
    expect(toJoulesPerMoleText('0.1', 'kcal/mol')).toBe('418.4');
    expect(toJoulesPerMoleText('1.895', 'J/mol')).toBe('1.895');
    expect(toJoulesPerMoleText('-0.000', 'kJ/mol')).toBe('0');
    expect(canonicalDecimal('+052.400')).toBe('52.4');
  });

  it('reads species rows and reports bad ones by line and column without throwing', () => {
    const text = [
      SPECIES_HEAD,
      WATER,
      'Bad Key,X,H2O,0,,,,,,',
      'water,Water again,H2O,0,,,,,,',
      'sulfate,Sulfate,SO4^2-,-1,,14808-79-8,,,,',
      'oops,Oops,H2Q9,0,,,,,,',
      'caffeine,Caffeine,C8H10N4O2,0,,58-08-3,,,,',
    ].join('\n');
    const { rows, errors } = parseSpeciesCsv(text);
    expect(rows.map((r) => r.key)).toEqual(['water']);
    expect(rows[0]).toMatchObject({
      hill: 'H2O',
      charge: 0,
      synonyms: ['oxidane', 'dihydrogen monoxide'],
      casRn: '7732-18-5',
      inchiKey: 'XLYOFNOQVPJJNP-UHFFFAOYSA-N',
    });
    const at = (line: number) => errors.filter((e) => e.line === line);
    expect(at(3)[0]).toMatchObject({ file: 'species.csv', column: 'key' });
    expect(at(4)[0]?.message).toMatch(/already on line 2/);
    expect(at(5)[0]).toMatchObject({ column: 'charge' });
    expect(at(6)[0]).toMatchObject({ column: 'formula' });
    expect(at(7)[0]).toMatchObject({
      column: 'cas_rn',
      message: expect.stringMatching(/check digit/),
    });
  });

  it('reports missing columns and invalid UTF-8 as errors', () => {
    expect(parseSpeciesCsv('key,name\nwater,Water').errors[0]).toMatchObject({
      line: 1,
      column: 'formula',
    });
    const bytes = Buffer.concat([
      Buffer.from(`${SPECIES_HEAD}\n${WATER}\n`),
      Buffer.from([0x77, 0xff, 0x2c]),
    ]);
    expect(parseSpeciesCsv(bytes).errors).toEqual([
      { file: 'species.csv', line: 3, message: 'the file is not valid UTF-8' },
    ]);
  });

  it('checks formation rows against species, sources, phases and reference states', () => {
    const { rows: species } = parseSpeciesCsv(
      [SPECIES_HEAD, WATER, 'carbon,Carbon,C,0,,7440-44-0,,,,'].join('\n'),
    );
    const refs = {
      species: new Map(species.map((s) => [s.key, s])),
      sources: new Set(['kestrel-2026']),
    };
    const text = [
      FORMATION_HEAD,
      'water,l,,-285.830,kJ/mol,0.040,expanded_k2,evaluated,100000,kestrel-2026,no,',
      'water,g,,-57.7979,kcal/mol,,,evaluated,101325,kestrel-2026,yes,',
      'water,l,,-285.8,kJ/mol,,,evaluated,100000,kestrel-2026,no,',
      'water,aq,ice,-1,kJ/mol,,,evaluated,100000,kestrel-2026,no,',
      'steam,g,,-1,kJ/mol,,,evaluated,100000,nowhere,no,',
      'carbon,cr,graphite,0.1,kJ/mol,,,evaluated,100000,kestrel-2026,no,',
      'carbon,cr,diamond,1.895,kJ/mol,0.5,,evaluated,100000,kestrel-2026,no,',
      'water,l,,1e3,kJ/mol,,,evaluated,100000,kestrel-2026,maybe,',
    ].join('\n');
    const { rows, errors } = parseFormationCsv(text, refs);
    expect(rows).toHaveLength(2);
    expect(rows[0]).toMatchObject({
      valueJPerMol: '-285830',
      uncertaintyJPerMol: '40',
      uncertaintyBasis: 'expanded_k2',
      standardPressurePa: 100000,
      fromMemory: false,
    });
    expect(rows[1]).toMatchObject({ valueJPerMol: '-241826.4136', fromMemory: true });
    const columns = (line: number) => errors.filter((e) => e.line === line).map((e) => e.column);
    expect(columns(4)).toEqual(['species']);
    expect(columns(5)).toEqual(['modification']);
    expect(columns(6).sort()).toEqual(['source', 'species']);
    expect(columns(7)).toEqual(['value']);
    expect(columns(8)).toEqual(['uncertainty_basis']);
    expect(columns(9).sort()).toEqual(['from_memory', 'value']);
  });

  it('builds NASA and Shomate models and refuses a NASA set whose ranges do not meet', () => {
    const lo =
      '3.298677,1.4082404E-03,-3.963222E-06,5.641515E-09,-2.444854E-12,-1.0208999E+03,3.950372,';
    const hi =
      '2.926640,1.4879768E-03,-5.684760E-07,1.0097038E-10,-6.753351E-15,-9.227977E+02,5.980528,';
    const text = [
      HC_HEAD,
      `n2,g,,nasa7,300,1000,${lo},src,no,`,
      `n2,g,,nasa7,1000,5000,${hi},src,no,`,
      `o2,g,,nasa7,300,1000,${lo},src,no,`,
      `o2,g,,nasa7,1001,5000,${hi},src,no,`,
      'water,l,,shomate,273.15,373.15,189.7496,-989.1593,2815.304,-2631.562,0,-10,,-12,src,yes,',
    ].join('\n');
    const { rows, errors } = parseHeatCapacityCsv(text);
    expect(rows.map((r) => r.species)).toEqual(['n2', 'water']);
    expect(rows[0]?.model).toMatchObject({ kind: 'nasa7', tLow: 300, tMid: 1000, tHigh: 5000 });
    expect(rows[1]?.model).toMatchObject({
      kind: 'shomate',
      ranges: [{ tMin: 273.15, E: 0, F: -10, H: -12 }],
    });
    expect(errors).toEqual([expect.objectContaining({ line: 5, column: 't_min_k' })]);
  });

  it('cross-checks a whole dataset and lists every error', () => {
    const { dataset, errors } = parseDataset({
      sources: SOURCES,
      species: `${SPECIES_HEAD}\n${WATER}`,
      formation: `${FORMATION_HEAD}\nwater,l,,-285.83,kJ/mol,,,evaluated,100000,kestrel-2026,no,`,
      heatCapacity: `${HC_HEAD}\nice,cr,,shomate,200,273,1,0,0,0,0,,,,kestrel-2026,no,`,
      transitions: `${TRANSITION_HEAD}\nwater,l,,g,,373.15,40.65,kJ/mol,,,evaluated,100000,elsewhere,no,`,
    });
    expect(dataset.formation).toHaveLength(1);
    expect(errors.map((e) => [e.file, e.line, e.column])).toEqual([
      ['heat-capacity.csv', 2, 'species'],
      ['transitions.csv', 2, 'source'],
    ]);
  });

  it('reports CSV syntax and cell-count problems by line', () => {
    expect(parseSpeciesCsv(`${SPECIES_HEAD}\nwater,"Water,H2O,0,,,,,,`).errors).toEqual([
      expect.objectContaining({
        file: 'species.csv',
        message: expect.stringMatching(/^CSV syntax/),
      }),
    ]);
    const { rows, errors } = parseSpeciesCsv(`${SPECIES_HEAD}\nwater,Water,H2O\n${WATER}`);
    expect(rows).toHaveLength(1);
    expect(errors).toEqual([
      { file: 'species.csv', line: 2, message: 'expected 10 cells, found 3' },
    ]);
  });

  it('refuses transitions written against the heating direction or between one phase', () => {
    const row = (from: string, to: string, value: string) =>
      `water,${from},,${to},,373.15,${value},kJ/mol,,,evaluated,101325,src,no,`;
    const { rows, errors } = parseTransitionsCsv(
      [TRANSITION_HEAD, row('l', 'g', '40.656'), row('g', 'l', '-40.656'), row('l', 'l', '1')].join(
        '\n',
      ),
    );
    expect(rows).toMatchObject([{ fromPhase: 'l', toPhase: 'g', valueJPerMol: '40656' }]);
    expect(errors.map((e) => [e.line, e.column])).toEqual([
      [3, 'value'],
      [4, 'to_phase'],
    ]);
  });

  it('checks CSL-JSON sources: ids, bare DOIs, duplicates', () => {
    const { rows, errors } = parseSourcesJson(
      JSON.stringify(
        [
          { id: 'kestrel-2026', type: 'report', title: 'Kestrel data sheet', DOI: '10.5555/k.1' },
          { id: 'kestrel-2026', type: 'report', title: 'Again' },
          { id: 'other', type: 'report', title: 'Other', DOI: 'https://doi.org/10.5555/k.1' },
          { id: 'third', type: 'report', title: 'Third', DOI: '10.5555/K.1' },
          { id: 'untitled', type: 'report' },
        ],
        null,
        2,
      ),
    );
    expect(rows.map((r) => r.id)).toEqual(['kestrel-2026']);
    expect(errors.map((e) => [e.line, e.column])).toEqual([
      [8, 'id'],
      [13, 'DOI'],
      [19, 'DOI'],
      [25, 'title'],
    ]);
    expect(parseSourcesJson('{').errors[0]?.message).toMatch(/^JSON/);
  });
});
