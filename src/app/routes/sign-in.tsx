// Lazy route module: `/sign-in`.
export { SignInPage as Component } from '../../features/auth/components/sign-in-page.tsx';
