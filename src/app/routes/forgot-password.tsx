import { ForgotPasswordPage } from '@/features/account/components/forgot-password-page';

export const Component = ForgotPasswordPage;
