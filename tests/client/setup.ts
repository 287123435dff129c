import { cleanup, configure } from '@testing-library/react';
import { afterEach, vi } from 'vitest';
import { resetCsrfToken } from '../../src/lib/api.ts';

// Lazy screens are transformed on first import; on a slow machine that can take over a second.
configure({ asyncUtilTimeout: 5000 });

// jsdom has no layout or scrolling; React Router's scroll restoration calls this.
window.scrollTo = () => undefined;

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  window.localStorage.clear();
  resetCsrfToken();
});
