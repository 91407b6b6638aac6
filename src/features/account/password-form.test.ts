import { describe, expect, it } from 'vitest';
import { checkNewPassword, checkPasswordChange, checkResetRequest, checkWelcome, plausibleToken } from './password-form';

const TOKEN = 'q8Zk1w3mB0a9YvXc7LrTn2PsEo5UdHfGiJjKlMn4Opq';

describe('account forms', () => {
  it('asks for the current password and at least 12 characters for the new one', () => {
    expect(checkPasswordChange({ currentPassword: '', newPassword: 'short', repeat: 'short' })).toEqual({
      currentPassword: 'Enter your current password',
      newPassword: 'Use at least 12 characters',
    });
  });

  it('refuses a repeated password that differs, and reusing the current one', () => {
    expect(checkPasswordChange({ currentPassword: 'harrow-old-pass-1', newPassword: 'harrow-new-pass-22', repeat: 'harrow-new-pass-2' }).repeat).toMatch(/differ/);
    expect(checkPasswordChange({ currentPassword: 'harrow-same-pass-1', newPassword: 'harrow-same-pass-1', repeat: 'harrow-same-pass-1' }).newPassword).toMatch(/different/);
    expect(checkPasswordChange({ currentPassword: 'harrow-old-pass-1', newPassword: 'harrow-new-pass-22', repeat: 'harrow-new-pass-22' })).toEqual({});
  });

  it('checks a new password typed twice', () => {
    expect(checkNewPassword('eleven-char', 'eleven-char')).toEqual({ password: 'Use at least 12 characters' });
    expect(checkNewPassword('twelve-chars', 'twelve-chars')).toEqual({});
  });

  it('needs a name on the welcome form', () => {
    expect(checkWelcome({ token: TOKEN, name: '  ', password: 'a-long-enough-one', repeat: 'a-long-enough-one' })).toEqual({ name: 'Enter your name' });
  });

  it('needs a valid e-mail address to send a reset link', () => {
    expect(checkResetRequest('not-an-address').email).toBe('Enter a valid e-mail address');
    expect(checkResetRequest(' Engineer@Harrow.example ')).toEqual({});
  });

  it('recognises link tokens only in the shape the server issues them', () => {
    expect(plausibleToken(TOKEN)).toBe(true);
    expect(plausibleToken(null)).toBe(false);
    expect(plausibleToken('short')).toBe(false);
    expect(plausibleToken('has spaces in it and more than twenty')).toBe(false);
  });
});
