// Lazy route module: `/forgot-password`.
export { ForgotPasswordPage as Component } from '../../features/auth/components/forgot-password-page.tsx';
