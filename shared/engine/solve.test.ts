import { describe, expect, it } from 'vitest';
import { brent, thicknessForTarget } from './solve';

describe('brent', () => {
  it.each([
    ['cos x − x', (x: number) => Math.cos(x) - x, 0, 1, 0.7390851332151607], // Dottie number
    ['x³ − 2x − 5', (x: number) => x ** 3 - 2 * x - 5, 2, 3, 2.0945514815423265], // Wallis's example
    ['e^x − 10', (x: number) => Math.exp(x) - 10, 0, 5, Math.log(10)],
  ])('%s', (_name, f, a, b, root) => {
    const x = brent((v: number, _: null) => f(v), null, a, b, f(a), f(b), 1e-14);
    expect(Math.abs(x - root)).toBeLessThan(1e-12);
    expect(f(x)).toBeGreaterThanOrEqual(0); // the side where f ≥ 0
  });

  it('lands on the meeting side of a jump', () => {
    const step = (x: number) => (x < 0.3 ? -1 : 1);
    const x = brent((v: number, _: null) => step(v), null, 0, 1, -1, 1, 1e-12);
    expect(x).toBeGreaterThanOrEqual(0.3);
    expect(x - 0.3).toBeLessThan(1e-9);
  });

  it('refuses an unbracketed root', () => {
    expect(() => brent((x: number, _: null) => x * x + 1, null, -1, 1, 2, 2)).toThrow(RangeError);
  });
});

describe('thicknessForTarget', () => {
  it.each([
    [2, 1e-3],
    [2.5, 0.2],
    [3, 5],
  ])('power law t^%d from a guess far off', (k, guess) => {
    const sf = (t: number, c: { k: number }) => 1000 * t ** c.k;
    const t = thicknessForTarget(sf, { k }, 4, guess, 1e-9, 1e4, 2)!;
    expect(Math.abs(sf(t, { k }) / 4 - 1)).toBeLessThan(1e-8);
    expect(sf(t, { k })).toBeGreaterThanOrEqual(4 * (1 - 1e-12));
  });

  it('null when even the largest thickness falls short; tMin when the smallest already suffices', () => {
    const saturating = (t: number, _: null) => (3 * t) / (1 + t); // never reaches 3
    expect(thicknessForTarget(saturating, null, 3, 1, 1e-6, 1e6)).toBeNull();
    expect(thicknessForTarget((t: number, _: null) => 10 + t, null, 4, 1, 1e-6, 1e6)).toBe(1e-6);
  });
});
