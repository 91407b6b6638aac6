import { describe, expect, it } from 'vitest';
import { ApiError } from './api-client';
import { fieldSentence, mapServerErrors } from './field-errors';

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
