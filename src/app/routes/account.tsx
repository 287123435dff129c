// Lazy route module: `/account`.
export { AccountPage as Component } from '../../features/account/components/account-page.tsx';
