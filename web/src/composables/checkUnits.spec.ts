import { describe, expect, it } from 'vitest';
import { formatForInput, formatNumber, fromBase, parseNumber, toBase } from './checkUnits';

describe('check units', () => {
  it('When 1 in. w.c. is shown in Pa, then it is 249.089 Pa (NIST SP 811, conventional inch of water)', () => {
    expect(fromBase('pressure', 1, 'pa')).toBeCloseTo(249.089, 3);
    expect(toBase('pressure', 249.08891, 'pa')).toBeCloseTo(1, 9);
  });

  it('When 3.5 in. w.c. is shown in mbar, then it is 8.718 mbar (1 mbar = 100 Pa)', () => {
    expect(fromBase('pressure', 3.5, 'mbar')).toBeCloseTo(8.718, 3);
  });

  it('When a temperature reading is converted, then the 32 °F offset applies; a rise has none', () => {
    expect(toBase('temperature', 100, 'c')).toBe(212);
    expect(fromBase('temperature', 32, 'c')).toBe(0);
    expect(toBase('temperatureDiff', 25, 'c')).toBe(45);
    expect(fromBase('temperatureDiff', 45, 'c')).toBe(25);
  });

  it('When power is given in kW, then 1 kW is 3412.14 Btu/h', () => {
    expect(toBase('power', 1, 'kw')).toBe(3412.14);
    expect(fromBase('power', 100000, 'kw')).toBeCloseTo(29.307, 3);
    expect(toBase('power', 100000, 'btuh')).toBe(100000);
  });

  it('When text is parsed, then blanks are undefined, commas are decimals and junk is NaN', () => {
    expect(parseNumber('  ')).toBeUndefined();
    expect(parseNumber('3,72')).toBe(3.72);
    expect(parseNumber('.5')).toBe(0.5);
    expect(parseNumber('-40')).toBe(-40);
    expect(parseNumber('3.7x')).toBeNaN();
    expect(parseNumber('1e3')).toBeNaN();
  });

  it('When numbers are formatted, then results are grouped and inputs are not', () => {
    expect(formatNumber(100000, 0)).toBe('100,000');
    expect(formatNumber(54.7996, 1)).toBe('54.8');
    expect(formatForInput(926.6027, 'pa')).toBe('926.6');
    expect(formatForInput(3.7200001, 'in_wc')).toBe('3.72');
  });
});
