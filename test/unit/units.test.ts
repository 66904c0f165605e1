import { describe, expect, it } from 'vitest';
import { parseQuantity, formatQuantity, InputError, OZ_COPPER_M } from '../../core/index.ts';

// Unit factors: international inch 25.4 mm (exact, 1959 agreement); 1 mil = 0.001 in; 1 oz copper = 35 µm
// (common practice, value from memory: 1 oz/ft² is 34.79 µm, rounded on data sheets); IACS 100 % = 58 MS/m.
describe('parseQuantity', () => {
  const cases: [string, Parameters<typeof parseQuantity>[1], number][] = [
    ['1.6mm', 'length', 1.6e-3], ['1.6 mm', 'length', 1.6e-3], ['62mil', 'length', 62 * 25.4e-6],
    ['0.062in', 'length', 0.062 * 25.4e-3], ['35um', 'length', 35e-6], ['35µm', 'length', 35e-6], ['35μm', 'length', 35e-6],
    ['1oz', 'length', OZ_COPPER_M], ['0.5oz', 'length', 17.5e-6], ['2 m', 'length', 2],
    ['5.8GHz', 'frequency', 5.8e9], ['5.8 ghz', 'frequency', 5.8e9], ['433MHz', 'frequency', 433e6], ['433mhz', 'frequency', 433e6],
    ['2.4e9 Hz', 'frequency', 2.4e9], ['10kHz', 'frequency', 1e4],
    ['50', 'impedance', 50], ['50ohm', 'impedance', 50], ['50 Ω', 'impedance', 50], ['1kΩ', 'resistance', 1000], ['2mΩ', 'resistance', 2e-3],
    ['90', 'angle', Math.PI / 2], ['90deg', 'angle', Math.PI / 2], ['90°', 'angle', Math.PI / 2], ['1rad', 'angle', 1],
    ['3dB', 'db', 3], ['-0.5 dB', 'db', -0.5],
    ['58MS/m', 'conductivity', 5.8e7], ['100%IACS', 'conductivity', 5.8e7], ['5.8e7', 'conductivity', 5.8e7],
    ['0.02', 'ratio', 0.02], ['2%', 'ratio', 0.02],
    ['1.5pF', 'capacitance', 1.5e-12], ['10 fF', 'capacitance', 1e-14], ['2.2nH', 'inductance', 2.2e-9], ['1uH', 'inductance', 1e-6],
    ['0', 'length', 0],
  ];
  for (const [text, kind, want] of cases) {
    it(`${JSON.stringify(text)} as ${kind} → ${want}`, () => {
      expect(parseQuantity(text, kind)).toBeCloseTo(want, 15 - Math.ceil(Math.log10(Math.abs(want) || 1)));
      expect(Math.abs(parseQuantity(text, kind) - want)).toBeLessThanOrEqual(Math.abs(want) * 1e-12);
    });
  }
  it('refuses a bare length, naming the units to use', () => {
    try { parseQuantity('1.6', 'length', 'h'); expect.unreachable(); } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      const err = e as InputError;
      expect(err.code).toBe('bad-unit');
      expect(err.field).toBe('h');
      expect(err.expected).toMatch(/mm/);
      expect(err.hint).toMatch(/add a unit/);
    }
  });
  it('refuses a bare frequency, suggesting the unit it was most likely meant in (issue 14, fault 12)', () => {
    expect(() => parseQuantity('2.45', 'frequency', 'f')).toThrow(/did you mean 2\.45 GHz\?/);
    expect(() => parseQuantity('433', 'frequency', 'f')).toThrow(/did you mean 433 MHz\?/);
    expect(() => parseQuantity('2.4e9', 'frequency', 'f')).toThrow(/did you mean 2\.4e9 Hz\?/);
    expect(parseQuantity('0', 'frequency')).toBe(0);
  });
  it('refuses a unit of another kind, a comma decimal, text and an overflowing value', () => {
    for (const [t, k] of [['5GHz', 'length'], ['1,6mm', 'length'], ['abc', 'frequency'], ['1e400', 'frequency'], ['', 'ratio'], ['12 furlongs', 'length']] as const) {
      expect(() => parseQuantity(t, k)).toThrow(InputError);
    }
    expect(() => parseQuantity('1,6mm', 'length')).toThrow(/decimal separator/);
  });
  it('keeps milli and mega apart for resistance (case matters there)', () => {
    expect(parseQuantity('1MΩ', 'resistance')).toBe(1e6);
    expect(parseQuantity('1mΩ', 'resistance')).toBe(1e-3);
  });
});

describe('formatQuantity', () => {
  it('picks a readable unit and significant digits', () => {
    expect(formatQuantity(0.0015123, 'length')).toBe('1.512 mm');
    expect(formatQuantity(35e-6, 'length')).toBe('35 µm');
    expect(formatQuantity(5.8e9, 'frequency')).toBe('5.8 GHz');
    expect(formatQuantity(50.0012, 'impedance', { digits: 5 })).toBe('50.001 Ω');
    expect(formatQuantity(Math.PI / 2, 'angle')).toBe('90°');
    expect(formatQuantity(0.0016, 'length', { unit: 'mil' })).toBe('62.99 mil');
    expect(formatQuantity(0, 'frequency')).toBe('0 Hz');
  });
  it('round-trips through parseQuantity', () => {
    for (const v of [1.234e-3, 5.678e9, 47.3]) {
      const kind = v < 1 ? 'length' : v > 1e6 ? 'frequency' : 'impedance';
      expect(parseQuantity(formatQuantity(v, kind, { digits: 12 }), kind)).toBeCloseTo(v, 9);
    }
  });
  it('refuses a non-finite value and an unknown unit', () => {
    expect(() => formatQuantity(Number.NaN, 'length')).toThrow(InputError);
    expect(() => formatQuantity(1, 'length', { unit: 'furlong' })).toThrow(InputError);
  });
});
