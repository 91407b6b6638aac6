import { ResetPasswordPage } from '@/features/account/components/reset-password-page';

export const Component = ResetPasswordPage;
