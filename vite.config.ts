import { defineConfig } from 'vitest/config';

/**
 * Root test configuration: every workspace's suite, run by the README's test command
 * (`./docker-free-start.sh test`), which first starts a throw-away MariaDB and the mail catcher.
 * Each project keeps its own vitest.config.ts next to its code.
 */
export default defineConfig({
  test: {
    projects: [
      'packages/contracts',
      'packages/lp-core',
      'packages/plan-model',
      'apps/api',
      'apps/planner',
      'apps/mail-catcher',
      'tests',
    ],
  },
});
