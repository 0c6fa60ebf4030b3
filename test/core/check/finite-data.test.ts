import { describe, expect, it } from 'vitest';
import { requireFiniteData } from '../../../src/core/check/finite-data.ts';
import { InputError } from '../../../src/core/errors.ts';

describe('requireFiniteData', () => {
  it('returns plain finite data unchanged (the same object)', () => {
    const data = { a: 1, b: [0, -2.5, { c: 'x', d: null, e: true }], f: { g: [] } };
    expect(requireFiniteData(data)).toBe(data);
  });
  it('names the path of a NaN or an infinity deep inside', () => {
    expect(() => requireFiniteData({ a: { b: [1, { c: Number.NaN }] } })).toThrow(/result\.a\.b\[1\]\.c/);
    expect(() => requireFiniteData({ x: [Infinity] })).toThrow(/result\.x\[0\]/);
    try {
      requireFiniteData({ x: -Infinity });
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe('result.x');
    }
  });
  it('refuses what is not plain data: undefined, a class instance, a function', () => {
    expect(() => requireFiniteData({ a: undefined })).toThrow(/result\.a: not plain data/);
    expect(() => requireFiniteData({ when: new Date(0) })).toThrow(/result\.when: not plain data/);
    expect(() => requireFiniteData({ f: () => 1 })).toThrow(/result\.f: not plain data/);
  });
});
