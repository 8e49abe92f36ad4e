import { afterEach, describe, expect, it, vi } from 'vitest';
import { PollingLoop, type RoundOutcome } from '../../src/background/polling-loop';

afterEach(() => {
  vi.useRealTimers();
  vi.restoreAllMocks();
});

/** A loop whose rounds answer from a script and are counted. */
function scripted(answers: Array<RoundOutcome | Error>) {
  let calls = 0;
  const round = vi.fn(async (): Promise<RoundOutcome> => {
    const a = answers[Math.min(calls++, answers.length - 1)];
    if (a instanceof Error) throw a;
    return a;
  });
  return { round, loop: new PollingLoop(round, 1_000, 'test loop: a round failed') };
}

describe('polling loop', () => {
  it('when a round was busy, then the next one runs at once; when idle, then only after pollMs', async () => {
    vi.useFakeTimers();
    const { round, loop } = scripted(['busy', 'busy', 'idle', 'idle']);
    loop.start();
    // Within 10 ms: busy, busy, then the first idle round (no pollMs wait after a busy round).
    await vi.advanceTimersByTimeAsync(10);
    expect(round).toHaveBeenCalledTimes(3);
    await vi.advanceTimersByTimeAsync(980);
    expect(round).toHaveBeenCalledTimes(3);
    await vi.advanceTimersByTimeAsync(20);
    expect(round).toHaveBeenCalledTimes(4);
    await loop.stop();
  });

  it('when woken while waiting, then the next round runs at once; when woken during a round, then again right after it; when stopped, then not', async () => {
    // a job queued in this process is claimed without waiting for the poll (common practice, no source)
    vi.useFakeTimers();
    let finish: () => void = () => undefined;
    const round = vi.fn(
      () =>
        new Promise<RoundOutcome>((resolve) => {
          finish = () => resolve('idle');
        }),
    );
    const loop = new PollingLoop(round, 1_000, 'test loop: a round failed');
    loop.start();
    await vi.advanceTimersByTimeAsync(10);
    expect(round).toHaveBeenCalledTimes(1);
    finish();
    await vi.advanceTimersByTimeAsync(10);
    // idle: waiting for pollMs; a wake runs the next round at once
    loop.wake();
    await vi.advanceTimersByTimeAsync(10);
    expect(round).toHaveBeenCalledTimes(2);
    // woken while that round runs: the next follows right after it, not after pollMs
    loop.wake();
    finish();
    await vi.advanceTimersByTimeAsync(10);
    expect(round).toHaveBeenCalledTimes(3);
    finish();
    await vi.advanceTimersByTimeAsync(980);
    expect(round).toHaveBeenCalledTimes(3);
    await loop.stop();
    loop.wake();
    await vi.advanceTimersByTimeAsync(2_000);
    expect(round).toHaveBeenCalledTimes(3);
  });

  it('when a round fails, then it is logged with the given words and the loop waits pollMs and goes on', async () => {
    vi.useFakeTimers();
    const log = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    const { round, loop } = scripted([new Error('database gone'), 'idle']);
    loop.start();
    await vi.advanceTimersByTimeAsync(0);
    expect(log).toHaveBeenCalledWith('test loop: a round failed:', 'database gone');
    expect(round).toHaveBeenCalledTimes(1);
    await vi.advanceTimersByTimeAsync(1_000);
    expect(round).toHaveBeenCalledTimes(2);
    await loop.stop();
  });

  it('when stopped, then no further round runs and stop waits for the round in progress; start twice runs one loop', async () => {
    vi.useFakeTimers();
    let finish: () => void = () => undefined;
    let finished = false;
    const round = vi.fn(
      () =>
        new Promise<RoundOutcome>((resolve) => {
          finish = () => {
            finished = true;
            resolve('busy');
          };
        }),
    );
    const loop = new PollingLoop(round, 1_000, 'test loop: a round failed');
    loop.start();
    loop.start();
    await vi.advanceTimersByTimeAsync(0);
    expect(round).toHaveBeenCalledTimes(1);
    const stopping = loop.stop();
    finish();
    await stopping;
    expect(finished).toBe(true);
    await vi.advanceTimersByTimeAsync(10_000);
    expect(round).toHaveBeenCalledTimes(1);
  });
});
