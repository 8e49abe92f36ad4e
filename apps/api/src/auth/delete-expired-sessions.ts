import type { DataSource } from 'typeorm';
import { LessThanOrEqual } from 'typeorm';
import { SessionEntity } from '../db/entities/session.entity';
import { SignInAttemptEntity } from '../db/entities/sign-in-attempt.entity';
import { signInLimits } from './sign-in-rate-limit';

/** How often each API process sweeps expired sessions and old failed sign-ins (ms). */
export const sweepIntervalMs = 60 * 60 * 1000;

/**
 * Removes sessions past their expiry and failed sign-ins older than the rate-limit window.
 * Idempotent, so several API processes may run it. Returns how many rows went.
 */
export async function deleteExpiredSessions(dataSource: DataSource, now = new Date()): Promise<number> {
  const sessions = await dataSource.getRepository(SessionEntity).delete({ expiresAt: LessThanOrEqual(now) });
  const attempts = await dataSource
    .getRepository(SignInAttemptEntity)
    .delete({ attemptedAt: LessThanOrEqual(new Date(now.getTime() - signInLimits.windowMs)) });
  return (sessions.affected ?? 0) + (attempts.affected ?? 0);
}
