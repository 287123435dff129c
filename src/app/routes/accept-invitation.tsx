// Lazy route module: `/invite/:token`.
export { AcceptInvitationPage as Component } from '../../features/auth/components/accept-invitation-page.tsx';
