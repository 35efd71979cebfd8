import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const apiPort = process.env.API_PORT ?? '3001';

/**
 * Client build, dev server and the test runner in one file (vitest reads the `test` key).
 * Test projects: `unit` (pure code), `integration` (supertest on real PostgreSQL), `browser`
 * (headless Chromium against the built client). `npm test` starts what they need first.
 */
export default defineConfig({
  plugins: [react(), tailwindcss()],
  // Static files that keep their names (the favicon) live inside src/, beside the client.
  publicDir: 'src/public',
  // The HEIC converter (about 1.3 MB) is its own chunk, loaded only when a phone photo arrives.
  build: { outDir: 'dist', sourcemap: true, emptyOutDir: true, chunkSizeWarningLimit: 1500 },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': { target: `http://127.0.0.1:${apiPort}`, changeOrigin: false } },
  },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts'],
          environment: 'node',
          setupFiles: ['tests/support/fail-on-console-error.ts'],
        },
      },
      {
        extends: true,
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          environment: 'node',
          setupFiles: ['tests/support/fail-on-console-error.ts'],
          testTimeout: 20_000,
          hookTimeout: 30_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'browser',
          include: ['tests/browser/**/*.test.ts'],
          environment: 'node',
          testTimeout: 60_000,
          hookTimeout: 60_000,
          // One Chromium at a time: the machine has two cores.
          fileParallelism: false,
        },
      },
    ],
  },
});
