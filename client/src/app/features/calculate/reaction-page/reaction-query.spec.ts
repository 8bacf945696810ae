import { apiUrl, curlCommand, paramsFromQuery, queryFromParams, sameQuery } from './reaction-query';

describe('reaction query in the URL', () => {
  const query = {
    equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)',
    release: '2026.1',
    temperatureK: 800,
    unit: 'kcal/mol' as const,
  };

  it('round-trips every input through the query parameters', () => {
    expect(queryFromParams(paramsFromQuery(query))).toEqual(query);
  });

  it('is absent without an equation, and fills the API defaults for missing or bad values', () => {
    expect(queryFromParams({})).toBeNull();
    expect(queryFromParams({ equation: '   ' })).toBeNull();
    expect(
      queryFromParams({ equation: ' H2(g) -> H2(g) ', temperatureK: 'hot', unit: 'BTU' }),
    ).toEqual({
      equation: 'H2(g) -> H2(g)',
      release: 'latest',
      temperatureK: 298.15,
      unit: 'kJ/mol',
    });
    expect(queryFromParams({ equation: 'H2(g) -> H2(g)', temperatureK: '-5' })?.temperatureK).toBe(
      298.15,
    );
  });

  it('tells exactly equal inputs from any difference', () => {
    expect(sameQuery(query, { ...query })).toBe(true);
    expect(sameQuery(query, { ...query, temperatureK: 800.01 })).toBe(false);
    expect(sameQuery(query, { ...query, release: 'latest' })).toBe(false);
    expect(sameQuery(query, null)).toBe(false);
    expect(sameQuery(null, null)).toBe(true);
  });

  it('writes the API address with the same parameters, encoded', () => {
    const url = new URL(apiUrl('http://127.0.0.1:3000', query));
    expect(url.pathname).toBe('/api/v1/reaction-enthalpy');
    expect(Object.fromEntries(url.searchParams)).toEqual({
      equation: query.equation,
      release: '2026.1',
      temperatureK: '800',
      unit: 'kcal/mol',
    });
  });

  it('quotes the curl command so a shell passes it through unchanged', () => {
    const command = curlCommand('http://h', { ...query, equation: "[it's](g) -> [it's](l)" });
    expect(command.startsWith("curl -sS -H 'Accept: application/json' 'http://h/api/")).toBe(true);
    // The input's quote is percent-encoded: only the header's and the address's quotes remain.
    expect(command.match(/'/g)).toHaveLength(4);
    expect(command.endsWith("'")).toBe(true);
  });
});
