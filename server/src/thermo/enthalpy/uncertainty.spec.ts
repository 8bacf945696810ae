import { QuadratureSum } from './uncertainty';

describe('QuadratureSum', () => {
  it('adds independent uncertainties in quadrature', () => {
    const u = new QuadratureSum();
    u.add(3, 'standard');
    u.add(4, 'standard');
    expect(u.uncertainty).toBe(5);
    expect(u.combinedBasis).toBe('standard');
  });

  it('ignores exact inputs', () => {
    const u = new QuadratureSum();
    u.addExact();
    expect(u.uncertainty).toBe(0);
    expect(u.combinedBasis).toBeNull();
    u.add(2, 'expanded_k2');
    u.addExact();
    expect(u.uncertainty).toBe(2);
  });

  it('reports mixed bases and treats an unstated basis as as_stated', () => {
    const u = new QuadratureSum();
    u.add(1, 'standard');
    u.add(1, 'expanded_k2');
    expect(u.combinedBasis).toBe('mixed');
    const v = new QuadratureSum();
    v.add(1, undefined);
    expect(v.combinedBasis).toBe('as_stated');
  });

  it('becomes null as soon as one input has no uncertainty', () => {
    const u = new QuadratureSum();
    u.add(1, 'standard');
    u.add(null, null);
    u.add(2, 'standard');
    expect(u.uncertainty).toBeNull();
    expect(u.combinedBasis).toBeNull();
  });
});
