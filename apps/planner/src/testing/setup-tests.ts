import '@testing-library/jest-dom/vitest';
import { cleanup } from '@testing-library/react';
import { afterEach } from 'vitest';

/**
 * jsdom lays nothing out, so every element measures 0 × 0 and virtualised lists would draw no
 * rows. Give elements the size of a small browser window instead (1024 × 600).
 */
Object.defineProperty(HTMLElement.prototype, 'clientHeight', { configurable: true, get: () => 600 });
Object.defineProperty(HTMLElement.prototype, 'clientWidth', { configurable: true, get: () => 1024 });

afterEach(() => cleanup());
