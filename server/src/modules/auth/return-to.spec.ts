import { safeReturnTo } from './return-to';

describe('safeReturnTo', () => {
  it.each([
    '/',
    '/calculate/hess',
    '/calculate/hess?target=CH4(g)%20-%3E%20C(graphite)&unit=kJ%2Fmol',
    '/species/water#history',
  ])('keeps the site path %s', (path) => {
    expect(safeReturnTo(path)).toBe(path);
  });

  it.each([
    undefined,
    '',
    'calculate',
    'https://evil.example/',
    '//evil.example/',
    '/\\evil.example',
    '\\\\evil.example',
    '/a//b',
    '/x?next=https://evil.example',
    'javascript:alert(1)',
    '/\tevil',
    '/ x',
  ])('refuses %p', (value) => {
    expect(safeReturnTo(value)).toBeNull();
  });

  it('refuses an overlong path', () => {
    expect(safeReturnTo(`/${'a'.repeat(2000)}`)).toBeNull();
  });
});
