import type { ClientRequest } from 'node:http';
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const fromRoot = (p: string) => fileURLToPath(new URL(p, import.meta.url));

const alias = {
  '@shared': fromRoot('./shared'),
  '@server': fromRoot('./server'),
  '@console': fromRoot('./console'),
};

// The API the dev server forwards to; the session cookie's Origin check expects the API's own origin.
const apiOrigin = `http://127.0.0.1:${process.env.SWEEPLINE_PORT ?? 4620}`;
const devProxyTo = (target: string) => ({
  target,
  changeOrigin: true,
  configure: (proxy: { on: (event: 'proxyReq', listener: (request: ClientRequest) => void) => void }) =>
    proxy.on('proxyReq', (request) => {
      if (request.getHeader('origin')) request.setHeader('origin', target);
    }),
});

// One config for the console build (root: console/) and for every test suite.
export default defineConfig({
  root: fromRoot('./console'),
  publicDir: false,
  plugins: [react(), tailwindcss()],
  resolve: { alias },
  build: {
    outDir: fromRoot('./dist/console'),
    emptyOutDir: true,
    sourcemap: false,
  },
  // `npm run dev:console`: hot-reloading console on 127.0.0.1:5173 in front of a running `npm start`.
  server: {
    host: '127.0.0.1',
    port: 5173,
    strictPort: true,
    proxy: Object.fromEntries(['/v1', '/docs'].map((prefix) => [prefix, devProxyTo(apiOrigin)])),
  },
  test: {
    root: fromRoot('.'),
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          root: fromRoot('.'),
          include: ['shared/**/*.test.ts', 'server/**/*.test.ts', 'console/**/*.test.{ts,tsx}'],
          environment: 'node',
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'api',
          root: fromRoot('.'),
          // Only projects that need it start the test MariaDB (tests/support/global-setup.ts).
          globalSetup: [fromRoot('./tests/support/global-setup.ts')],
          include: ['tests/api/**/*.test.ts', 'tests/contract/**/*.test.ts'],
          environment: 'node',
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'browser',
          root: fromRoot('.'),
          globalSetup: [fromRoot('./tests/support/global-setup.ts')],
          include: ['tests/browser/**/*.test.ts'],
          environment: 'node',
          testTimeout: 90_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
