import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const sharedDir = fileURLToPath(new URL('./shared', import.meta.url));
const apiTarget = process.env.BUMPBOARD_API_URL ?? 'http://127.0.0.1:4600';

export default defineConfig({
  root: 'client',
  plugins: [react(), tailwindcss()],
  resolve: { alias: { '@shared': sharedDir } },
  build: { outDir: '../dist/client', emptyOutDir: true, sourcemap: true },
  server: {
    port: 5173,
    host: '127.0.0.1',
    proxy: { '/api': apiTarget, '/socket.io': { target: apiTarget, ws: true }, '/bid': apiTarget },
  },
  test: {
    root: '.',
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          root: '.',
          include: ['shared/**/*.test.ts', 'server/**/*.test.ts', 'mail-fake/**/*.test.ts', 'payments-fake/**/*.test.ts', 'tests/lint/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        extends: true,
        test: {
          name: 'client',
          root: '.',
          include: ['client/**/*.test.tsx', 'client/**/*.test.ts'],
          environment: 'jsdom',
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          root: '.',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
