// Pressure units against NIST SP 811 and a general-purpose unit library.
import { describe, expect, it } from 'vitest';
import Qty from 'js-quantities';
import { convertPressure, PASCALS_PER_UNIT } from '../../shared/src/calc/index';

const convert = (value: number, from: keyof typeof PASCALS_PER_UNIT, to: keyof typeof PASCALS_PER_UNIT) =>
  convertPressure({ value, from, to }).value;

describe('pressure units', () => {
  it('When 1 in. w.c. is converted, then it is the conventional inch of water, 249.0889 Pa', () => {
    // NIST SP 811 (2008), appendix B.8: inch of water (conventional) = 2.490889 E+02 Pa.
    expect(convert(1, 'in_wc', 'pa')).toBeCloseTo(249.0889, 4);
  });

  it('When the inch of water is taken at 39.2 °F or 60 °F, then ours (conventional) sits between them as NIST lists', () => {
    // NIST SP 811 (2008), appendix B.8: inch of water (39.2 °F) = 249.082 Pa; (60 °F) = 248.84 Pa.
    const ours = convert(1, 'in_wc', 'pa');
    expect(Math.abs(ours - 249.082)).toBeLessThan(0.01);
    expect(ours - 248.84).toBeCloseTo(0.2489, 3);
  });

  it('When 1 psi is converted, then it is 6,894.757 Pa and 27.68 in. w.c.', () => {
    // NIST SP 811 (2008), appendix B.8: pound-force per square inch = 6.894757 E+03 Pa.
    expect(convert(1, 'psi', 'pa')).toBeCloseTo(6894.757, 3);
    // 6894.757 / 249.0889 = 27.68 in. w.c. per psi: common practice (no source) quotes 27.7.
    expect(convert(1, 'psi', 'in_wc')).toBeCloseTo(27.68, 2);
  });

  it('When checked against js-quantities, then in. w.c. agrees with its inH2O (the 39.2 °F inch) within 0.003 %', () => {
    // js-quantities defines inH2O as 249.082052 Pa (water at 39.2 °F); the conventional inch is 249.08891.
    const lib = Qty('1 inH2O').to('Pa').scalar;
    expect(Math.abs(convert(1, 'in_wc', 'pa') - lib) / lib).toBeLessThan(0.00003);
    expect(convert(7, 'in_wc', 'kpa')).toBeCloseTo(Qty('7 inH2O').to('kPa').scalar, 3);
    expect(convert(1, 'psi', 'kpa')).toBeCloseTo(Qty('1 psi').to('kPa').scalar, 3);
    expect(convert(35, 'mbar', 'pa')).toBeCloseTo(Qty('35 mbar').to('Pa').scalar, 6);
  });

  it('When converted through every unit and back, then the value returns unchanged', () => {
    for (const from of Object.keys(PASCALS_PER_UNIT) as (keyof typeof PASCALS_PER_UNIT)[]) {
      for (const to of Object.keys(PASCALS_PER_UNIT) as (keyof typeof PASCALS_PER_UNIT)[]) {
        expect(convert(convert(3.5, from, to), to, from)).toBeCloseTo(3.5, 9);
      }
    }
  });

  it('When ounces per square inch and mm of water are used, then 1 oz/in² = 1.73 in. w.c. and 25.4 mm w.c. = 1 in. w.c.', () => {
    // 1 oz/in² = 1/16 psi = 430.9 Pa = 1.730 in. w.c. (arithmetic from NIST SP 811's psi).
    expect(convert(1, 'oz_in2', 'in_wc')).toBeCloseTo(1.73, 2);
    // NIST SP 811: millimetre of water (conventional) = 9.80665 Pa; 25.4 of them make the conventional inch.
    expect(convert(25.4, 'mm_wc', 'in_wc')).toBeCloseTo(1, 9);
  });
});
