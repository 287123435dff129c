// Lazy route module: any unknown address.
export { NotFound as Component } from '../not-found.tsx';
