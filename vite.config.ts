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
