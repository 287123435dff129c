import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { fileURLToPath } from 'node:url';

const apiPort = process.env.PORT ?? '3000';

// One config for the client build, the dev server and the test runner.
export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: {
    alias: { '@domain': fileURLToPath(new URL('./src/domain', import.meta.url)) },
  },
  build: {
    outDir: 'dist/client',
    emptyOutDir: true,
    chunkSizeWarningLimit: 1500,
  },
  server: {
    port: 5173,
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
  test: {
    projects: [
      {
        extends: true,
        test: { name: 'domain', include: ['tests/domain/**/*.test.ts'], environment: 'node' },
      },
      {
        extends: true,
        test: {
          name: 'server',
          include: ['tests/server/**/*.test.ts'],
          environment: 'node',
          // One real PostgreSQL per run; files share it, so they run one at a time.
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
          globalSetup: ['tests/server/global-setup.ts'],
        },
      },
      {
        extends: true,
        test: {
          name: 'client',
          include: ['tests/client/**/*.test.tsx'],
          environment: 'jsdom',
          setupFiles: ['tests/client/setup.ts'],
          // jsdom renders of whole screens can take seconds on a busy 2-core machine.
          testTimeout: 20_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 120_000,
          globalSetup: ['tests/e2e/global-setup.ts'],
        },
      },
    ],
  },
});
