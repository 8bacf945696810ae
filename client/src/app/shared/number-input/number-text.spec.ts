import { FormControl } from '@angular/forms';

import { numberText, readNumber } from './number-text';

const value = (typed: string) => {
  const reading = readNumber(typed);
  if (!reading.ok) throw new Error(`refused ${typed}: ${reading.message}`);
  return reading.value;
};
const refusal = (typed: string) => {
  const reading = readNumber(typed);
  return reading.ok ? null : reading.message;
};

describe('readNumber', () => {
  it.each([
    ['-283', -283],
    ['\u2212283', -283], // minus sign, as pasted from a typeset table
    ['\u2013283', -283], // en dash, as word processors turn a typed hyphen
    ['\u2212 283.5'.replace(' ', ''), -283.5],
    ['+206.1', 206.1],
    ['.5', 0.5],
    ['1.5e3', 1500],
    ['2.1e\u22123', 0.0021],
    ['  -44.0 ', -44],
  ])('reads %s as %d', (typed, expected) => {
    expect(value(typed)).toBeCloseTo(expected, 12);
  });

  it('never drops the sign of a typographic minus', () => {
    expect(value('\u2212283')).toBeLessThan(0);
    expect(value('\u2013283.0')).toBeLessThan(0);
  });

  it('reads a decimal comma when it is the only separator', () => {
    expect(value('-283,5')).toBe(-283.5);
    expect(value('0,500')).toBe(0.5);
    expect(value('\u2212241,82')).toBe(-241.82);
  });

  it('refuses thousands separators instead of changing the magnitude', () => {
    expect(refusal('1,234')).toMatch(/ambiguous: write 1\.234 or 1234/);
    expect(refusal('-802,300')).toMatch(/ambiguous/);
    expect(refusal('1,234.5')).toMatch(/without thousands separators/);
    expect(refusal('1.234,5')).toMatch(/without thousands separators/);
    expect(refusal('1,234,567')).toMatch(/without thousands separators/);
    expect(refusal('1 234')).toMatch(/without thousands separators/);
    expect(refusal("1'234.5")).toMatch(/without thousands separators/);
  });

  it('refuses text that is not a number, and numbers too large to hold', () => {
    expect(refusal('abc')).toMatch(/Enter a number/);
    expect(refusal('--5')).toMatch(/Enter a number/);
    expect(refusal('1e309')).toMatch(/too large/);
    expect(refusal('')).toMatch(/Enter a number/);
  });

  it('counts the decimals as typed, so -283.0 keeps its zero', () => {
    expect(readNumber('-283.0')).toEqual({ ok: true, value: -283, decimals: 1 });
    expect(readNumber('-241,82')).toMatchObject({ decimals: 2 });
    expect(readNumber('12')).toMatchObject({ decimals: 0 });
  });
});

describe('numberText validator', () => {
  it('carries the message of a refusal', () => {
    const control = new FormControl('1,234', { nonNullable: true, validators: numberText() });
    expect(control.errors).toEqual({ number: { message: expect.stringMatching(/ambiguous/) } });
  });

  it('lets an optional field stay empty and asks for a required one', () => {
    expect(new FormControl('', { validators: numberText() }).errors).toBeNull();
    expect(new FormControl('', { validators: numberText({ required: true }) }).errors).toEqual({
      number: { message: 'Enter a number.' },
    });
  });

  it('applies a lower bound with its own words', () => {
    const control = new FormControl('\u22120.4', {
      validators: numberText({ min: 0, minMessage: 'Must not be negative.' }),
    });
    expect(control.errors).toEqual({ number: { message: 'Must not be negative.' } });
  });
});
