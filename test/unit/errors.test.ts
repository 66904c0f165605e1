import { describe, expect, it } from 'vitest';
import { InputError, requireFinite, requireRange } from '../../core/index.ts';

describe('typed input errors', () => {
  it('names the field, what was expected and what was given', () => {
    const err = (() => { try { requireRange('substrate.h', -1, 0, 0.1, 'a thickness above 0 m', { minExclusive: true }); } catch (e) { return e; } })();
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).field).toBe('substrate.h');
    expect((err as InputError).message).toBe('substrate.h: expected a thickness above 0 m, got -1');
  });
  it('refuses NaN and Infinity', () => {
    expect(() => requireFinite('f', Number.NaN)).toThrow(/f: expected a finite number, got NaN/);
    expect(() => requireFinite('f', Infinity)).toThrow(InputError);
    expect(requireFinite('f', 2)).toBe(2);
  });
});
