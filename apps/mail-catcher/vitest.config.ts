import { defineProject } from 'vitest/config';

export default defineProject({
  test: {
    name: 'mail-catcher',
    include: ['test/**/*.test.ts'],
    environment: 'node',
    testTimeout: 30_000,
    hookTimeout: 30_000,
  },
});
