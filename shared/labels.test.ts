import { describe, expect, it } from 'vitest';
import { FAILURE_MODES } from './engine';
import { REFERENCE_KINDS, VALUE_BASES } from './schemas/catalogue';
import { FAILURE_MODE_LABELS, REFERENCE_KIND_LABELS, VALUE_BASIS_LABELS, formatMargin } from './labels';

describe('formatMargin', () => {
  it('signs a margin above the target with + and rounds to a whole percent', () => {
    expect(formatMargin(0.154)).toBe('+15 %');
    expect(formatMargin(2)).toBe('+200 %');
  });

  it('marks a margin exactly on the target as +0 %', () => {
    expect(formatMargin(0)).toBe('+0 %');
  });

  it('keeps the minus of a margin below the target', () => {
    expect(formatMargin(-0.2)).toBe('-20 %');
    expect(formatMargin(-1)).toBe('-100 %');
  });
});

describe('labels', () => {
  it('name every failure mode, value basis and reference kind, each differently', () => {
    for (const [values, labels] of [
      [FAILURE_MODES, FAILURE_MODE_LABELS],
      [VALUE_BASES, VALUE_BASIS_LABELS],
      [REFERENCE_KINDS, REFERENCE_KIND_LABELS],
    ] as [readonly string[], Record<string, string>][]) {
      expect(Object.keys(labels).sort()).toEqual([...values].sort());
      expect(new Set(Object.values(labels)).size).toBe(values.length);
    }
  });
});
