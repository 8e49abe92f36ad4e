import { it } from 'vitest';

// Throws while the file loads, so no test inside it runs: the summary must still count a failure.
throw new Error('fixture: this file fails to load');
it('never runs', () => {});
