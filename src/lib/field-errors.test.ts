import { describe, expect, it } from 'vitest';
import { ApiError } from './api-client';
import { fieldSentence, mapServerErrors, setServerErrors } from './field-errors';

describe('fieldSentence', () => {
  it('puts the field label before a fragment so it reads as a sentence', () => {
    expect(fieldSentence('Current password', 'is not right')).toBe('Current password is not right.');
  });

  it('keeps a message that is already a sentence', () => {
    expect(fieldSentence('New password', 'Use at least 12 characters')).toBe('Use at least 12 characters.');
    expect(fieldSentence('E-mail', 'Enter a valid e-mail address.')).toBe('Enter a valid e-mail address.');
  });
});

describe('mapServerErrors', () => {
  it('places known fields and drops the generic message when every field found a place', () => {
    const err = new ApiError(400, 'invalid_input', 'The request has invalid fields.', { currentPassword: 'is not right' });
    expect(mapServerErrors(err, { currentPassword: 'Current password', newPassword: 'New password' })).toEqual({
      fields: { currentPassword: 'Current password is not right.' },
      root: null,
    });
  });

  it('keeps the message and unknown fields for the form-level error', () => {
    const err = new ApiError(400, 'invalid_input', 'The invitation has invalid fields.', { token: 'invalid, used or expired' });
    const mapped = mapServerErrors(err, { name: 'Name', password: 'Password' });
    expect(mapped.fields).toEqual({});
    expect(mapped.root).toBe('The invitation has invalid fields. token invalid, used or expired.');
  });

  it('shows a conflict without fields as the form-level error', () => {
    const err = new ApiError(409, 'has_account', 'That address already has an account; change its role instead.');
    expect(mapServerErrors(err, { email: 'E-mail' })).toEqual({ fields: {}, root: 'That address already has an account; change its role instead.' });
  });

  it('explains a network failure', () => {
    expect(mapServerErrors(new TypeError('failed'), { email: 'E-mail' }).root).toMatch(/did not answer/);
  });
});

describe('setServerErrors', () => {
  it('puts each placed message on its form field through setError and the rest on the form root', () => {
    const calls: [string, string | undefined][] = [];
    const setError = (name: string, error: { message?: string }) => void calls.push([name, error.message]);
    // A PUT names the draft's fields under "draft."; the form's own paths have no prefix.
    const err = new ApiError(400, 'invalid_input', 'The draft has invalid fields.', { 'draft.condition': 'is too long', 'draft.colour': 'is not a recognised field' });
    setServerErrors(setError, err, (field) => (field === 'condition' ? 'Condition' : undefined), (path) => path.replace(/^draft\./, ''));
    expect(calls).toEqual([
      ['condition', 'Condition is too long.'],
      ['root', 'The draft has invalid fields. draft.colour is not a recognised field.'],
    ]);
  });

  it('sets only the root for an error that names no field', () => {
    const calls: string[] = [];
    setServerErrors((name: string) => void calls.push(name), new ApiError(409, 'frozen', 'The load case is used by a checked shortlist.'), { name: 'Name' });
    expect(calls).toEqual(['root']);
  });
});
