import { defineProject } from 'vitest/config';

export default defineProject({
  test: {
    name: 'e2e',
    include: ['**/*.test.ts'],
    exclude: ['node_modules/**'],
    environment: 'node',
    fileParallelism: false,
    testTimeout: 180_000,
    hookTimeout: 300_000,
  },
});
