// Lazy route module: `/reset-password?token=…`.
export { ResetPasswordPage as Component } from '../../features/auth/components/reset-password-page.tsx';
