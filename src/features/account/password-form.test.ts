import { describe, expect, it } from 'vitest';
import { passwordResetRequestSchema } from '@shared/schemas/projects';
import { formErrors } from '@/lib/form-test-support';
import { newPasswordFormSchema, passwordChangeFormSchema, plausibleToken, welcomeFormSchema } from './password-form';

const TOKEN = 'q8Zk1w3mB0a9YvXc7LrTn2PsEo5UdHfGiJjKlMn4Opq';

const checkPasswordChange = (v: { currentPassword: string; newPassword: string; repeat: string }) => formErrors(passwordChangeFormSchema, v);
const checkNewPassword = (password: string, repeat: string) => formErrors(newPasswordFormSchema, { password, repeat });
// The link token comes from the address, not the form (plausibleToken vets it before the form shows).
const checkWelcome = ({ token, ...v }: { token: string; name: string; password: string; repeat: string }) => formErrors(welcomeFormSchema, v);
const checkResetRequest = (email: string) => formErrors(passwordResetRequestSchema, { email });

describe('account forms', () => {
  it('asks for the current password and at least 12 characters for the new one', async () => {
    expect(await checkPasswordChange({ currentPassword: '', newPassword: 'short', repeat: 'short' })).toEqual({
      currentPassword: 'Enter your current password',
      newPassword: 'Use at least 12 characters',
    });
  });

  it('refuses a repeated password that differs, and reusing the current one', async () => {
    expect((await checkPasswordChange({ currentPassword: 'harrow-old-pass-1', newPassword: 'harrow-new-pass-22', repeat: 'harrow-new-pass-2' })).repeat).toMatch(/differ/);
    expect((await checkPasswordChange({ currentPassword: 'harrow-same-pass-1', newPassword: 'harrow-same-pass-1', repeat: 'harrow-same-pass-1' })).newPassword).toMatch(/different/);
    expect(await checkPasswordChange({ currentPassword: 'harrow-old-pass-1', newPassword: 'harrow-new-pass-22', repeat: 'harrow-new-pass-22' })).toEqual({});
  });

  it('checks a new password typed twice', async () => {
    expect(await checkNewPassword('eleven-char', 'eleven-char')).toEqual({ password: 'Use at least 12 characters' });
    expect(await checkNewPassword('twelve-chars', 'twelve-chars')).toEqual({});
  });

  it('needs a name on the welcome form', async () => {
    expect(await checkWelcome({ token: TOKEN, name: '  ', password: 'a-long-enough-one', repeat: 'a-long-enough-one' })).toEqual({ name: 'Enter your name' });
  });

  it('needs a valid e-mail address to send a reset link', async () => {
    expect((await checkResetRequest('not-an-address')).email).toBe('Enter a valid e-mail address');
    expect(await checkResetRequest(' Engineer@Harrow.example ')).toEqual({});
  });

  it('recognises link tokens only in the shape the server issues them', () => {
    expect(plausibleToken(TOKEN)).toBe(true);
    expect(plausibleToken(null)).toBe(false);
    expect(plausibleToken('short')).toBe(false);
    expect(plausibleToken('has spaces in it and more than twenty')).toBe(false);
  });
});
