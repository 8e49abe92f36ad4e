import { expect, it } from 'vitest';

// Known outcomes for the summary check: 2 passed, 1 failed, 1 skipped, 1 todo.
it('passes (1)', () => expect(1 + 1).toBe(2));
it('passes (2)', () => expect('a').toBe('a'));
it('fails on purpose', () => expect(1).toBe(2));
it.skip('is skipped', () => {});
it.todo('is a todo');
