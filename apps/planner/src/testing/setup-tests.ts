import '@testing-library/jest-dom/vitest';
import { cleanup, configure } from '@testing-library/react';
import { afterEach } from 'vitest';

/**
 * jsdom lays nothing out, so every element measures 0 × 0 and virtualised lists would draw no
 * rows. Give elements the size of a small browser window instead (1024 × 600).
 */
Object.defineProperty(HTMLElement.prototype, 'clientHeight', { configurable: true, get: () => 600 });
Object.defineProperty(HTMLElement.prototype, 'clientWidth', { configurable: true, get: () => 1024 });

/**
 * The first render of a route compiles its lazily loaded module; on a busy 2-core machine that
 * can take longer than Testing Library's default 1 s wait.
 */
configure({ asyncUtilTimeout: 5000 });

afterEach(() => cleanup());
