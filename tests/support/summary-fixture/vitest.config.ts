import { defineConfig } from 'vitest/config';

// A tiny suite with known outcomes, run by print-test-summary.test.ts through Vitest's own json
// reporter. Its files end in .fixture.ts so no real test project picks them up.
export default defineConfig({
  test: { root: import.meta.dirname, include: ['*.fixture.ts'], environment: 'node' },
});
