import { describe, expect, it } from 'vitest';
import { checkReferenceForm, emptyReferenceForm, referenceFormFrom } from './reference-form';

describe('reference form', () => {
  it('builds the reference input, leaving blank optional fields out', () => {
    const check = checkReferenceForm({ ...emptyReferenceForm(), kind: 'test-report', title: ' Harrow Sound hull coupon tests ', year: '2025', identifier: 'HSMW-TR-021' });
    expect(check).toEqual({
      ok: true,
      input: { kind: 'test-report', title: 'Harrow Sound hull coupon tests', year: 2025, identifier: 'HSMW-TR-021', authors: undefined, location: undefined, note: undefined },
    });
  });

  it('names the missing kind and title and a year that is not a whole number in range', () => {
    const check = checkReferenceForm({ ...emptyReferenceForm(), year: '1700' });
    expect(check.ok).toBe(false);
    if (check.ok) return;
    expect(check.errors.kind).toBe('Choose one of the options');
    expect(check.errors.title).toBe('Required');
    expect(check.errors.year).toBe('Must be at least 1800');
    const typed = checkReferenceForm({ ...emptyReferenceForm(), kind: 'paper', title: 'x', year: 'twenty' });
    expect(typed.ok || typed.errors.year).toBe('Enter a year, e.g. 2024');
  });

  it('round-trips a stored reference', () => {
    const form = referenceFormFrom({ id: 2, kind: 'handbook', title: 'Window design notes', authors: null, year: null, identifier: null, location: 'ch. 4', note: null });
    expect(form).toEqual({ kind: 'handbook', title: 'Window design notes', authors: '', year: '', identifier: '', location: 'ch. 4', note: '' });
    expect(checkReferenceForm(form).ok).toBe(true);
  });
});
