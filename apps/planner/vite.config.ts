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
    // Route modules are split by hand with React Router's `lazy` (src/app/router.tsx).
    // Large libraries that only some routes need get their own chunks so the sign-in
    // route and the shell stay small.
    rollupOptions: {
      output: {
        manualChunks(id: string) {
          if (!id.includes('node_modules')) return undefined;
          if (/node_modules\/(react|react-dom|scheduler|react-router|react-router-dom|@tanstack\/(react-query|query-core))\//.test(id)) return 'react';
          if (/node_modules\/zod\//.test(id)) return 'zod';
          if (/node_modules\/(recharts|d3-|victory-vendor|decimal\.js-light|es-toolkit)/.test(id)) return 'charts';
          if (/node_modules\/@tanstack\/(react-table|table-core|react-virtual|virtual-core)/.test(id)) return 'table';
          if (/node_modules\/(react-hook-form|@hookform)/.test(id)) return 'forms';
          return undefined;
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
