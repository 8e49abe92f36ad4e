import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

/** Where the API listens in development (`vite` proxies /api to it). */
const apiTarget = process.env.MILLRACE_API_URL ?? 'http://127.0.0.1:8080';

export default defineConfig({
  plugins: [react(), tailwindcss()],
  resolve: {
    alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) },
  },
  server: {
    host: '127.0.0.1',
    proxy: { '/api': { target: apiTarget, changeOrigin: false } },
  },
  preview: {
    host: '127.0.0.1',
    proxy: { '/api': { target: apiTarget, changeOrigin: false } },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    sourcemap: false,
    // dist/.vite/manifest.json lets scripts/print-bundle-sizes.mjs follow each route's imports.
    manifest: true,
    // Route modules are split by hand with React Router's `lazy` (src/app/router.tsx). Libraries
    // get chunks of their own so the sign-in route and the shell load only what they use. A group
    // also takes the dependencies its modules pull in that no group of higher priority has taken,
    // so React is claimed first (else it would land in whichever library chunk reached it first).
    rolldownOptions: {
      output: {
        codeSplitting: {
          groups: [
            { name: 'react', priority: 50, test: /node_modules[\\/](react|react-dom|scheduler|react-router|react-router-dom|@tanstack[\\/](react-query|query-core))[\\/]/ },
            { name: 'zod', priority: 40, test: /node_modules[\\/]zod[\\/]/ },
            { name: 'forms', priority: 30, test: /node_modules[\\/](react-hook-form|@hookform)[\\/]/ },
            { name: 'table', priority: 30, test: /node_modules[\\/]@tanstack[\\/](react-table|table-core|react-virtual|virtual-core)[\\/]/ },
            { name: 'charts', priority: 20, test: /node_modules[\\/](recharts|d3-[^\\/]+|victory-vendor|decimal\.js-light|es-toolkit|@reduxjs|redux|reselect|immer|react-redux|use-sync-external-store|eventemitter3|clsx|tiny-invariant|react-is)[\\/]/ },
          ],
        },
      },
    },
  },
  test: {
    name: 'planner',
    environment: 'jsdom',
    setupFiles: ['./src/testing/setup-tests.ts'],
    include: ['src/**/*.test.tsx'],
    css: false,
    testTimeout: 20_000,
  },
});
