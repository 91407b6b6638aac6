import { describe, expect, it } from 'vitest';
import { zodResolver } from '@hookform/resolvers/zod';
import type { ResolverOptions } from 'react-hook-form';
import { checkedFormSchema } from './form-schema';

type Form = { depth: string };
const OPTIONS = { fields: {}, shouldUseNativeValidation: false } as ResolverOptions<Form>;
// A form model in small: depth typed in feet, checked, sent in metres.
const schema = checkedFormSchema((form: Form) => {
  const feet = Number(form.depth);
  if (form.depth.trim() === '' || !Number.isFinite(feet)) return { ok: false, errors: { depth: 'Enter a number' } };
  if (feet > 40_000) return { ok: false, errors: { root: 'Deeper than any ocean', 'points.1.factor': 'Must be greater than zero' } };
  return { ok: true, value: { depthM: feet * 0.3048 } };
});

describe('checkedFormSchema', () => {
  it('hands react-hook-form the built input when the check passes', async () => {
    const result = await zodResolver(schema)({ depth: '1000' }, undefined, OPTIONS);
    expect(result.errors).toEqual({});
    // 1 ft = 0.3048 m exactly (NIST SP 811, appendix B).
    expect(result.values).toEqual({ depthM: 304.8 });
  });

  it('reports each problem at its form path, nested as react-hook-form reads it', async () => {
    expect((await zodResolver(schema)({ depth: 'deep' }, undefined, OPTIONS)).errors).toEqual({ depth: { type: 'custom', message: 'Enter a number' } });
    const nested = (await zodResolver(schema)({ depth: '50000' }, undefined, OPTIONS)).errors as Record<string, unknown>;
    expect(nested.root).toEqual({ type: 'custom', message: 'Deeper than any ocean' });
    expect((nested.points as { factor: { message: string } }[])[1].factor.message).toBe('Must be greater than zero');
  });
});
