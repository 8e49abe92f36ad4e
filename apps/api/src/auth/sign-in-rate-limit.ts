import { LessThan, MoreThan, type EntityManager } from 'typeorm';
import { SignInAttemptEntity } from '../db/entities/sign-in-attempt.entity';

/**
 * Failed sign-ins are stored in MariaDB (table sign_in_attempt), so the limit holds across
 * several API processes. Within `windowMs`, at most `maxFailuresPerEmailAndIp` failures for one
 * e-mail from one address and `maxFailuresPerIp` from one address over all e-mails; beyond
 * that, sign-in answers 429 with Retry-After until the oldest counted failure leaves the window.
 * (Thresholds: common practice, no source.)
 */
export const signInLimits = {
  windowMs: 15 * 60 * 1000,
  maxFailuresPerEmailAndIp: 5,
  maxFailuresPerIp: 100,
} as const;

export type SignInAllowance = { outcome: 'allowed' } | { outcome: 'limited'; retryAfterSeconds: number };

export async function checkSignInAllowance(db: EntityManager, email: string, ip: string, now = new Date()): Promise<SignInAllowance> {
  const repo = db.getRepository(SignInAttemptEntity);
  const since = new Date(now.getTime() - signInLimits.windowMs);
  const checks: Array<{ where: object; max: number }> = [
    { where: { email, ip, attemptedAt: MoreThan(since) }, max: signInLimits.maxFailuresPerEmailAndIp },
    { where: { ip, attemptedAt: MoreThan(since) }, max: signInLimits.maxFailuresPerIp },
  ];
  let retryAfterMs = 0;
  for (const { where, max } of checks) {
    const recent = await repo.find({ where, order: { attemptedAt: 'DESC' }, take: max, select: { attemptedAt: true } });
    if (recent.length >= max) {
      // The oldest of the last `max` failures must leave the window before one more is allowed.
      const oldest = recent[recent.length - 1].attemptedAt.getTime();
      retryAfterMs = Math.max(retryAfterMs, oldest + signInLimits.windowMs - now.getTime());
    }
  }
  return retryAfterMs > 0 ? { outcome: 'limited', retryAfterSeconds: Math.max(1, Math.ceil(retryAfterMs / 1000)) } : { outcome: 'allowed' };
}

export async function recordSignInFailure(db: EntityManager, email: string, ip: string, now = new Date()): Promise<void> {
  const repo = db.getRepository(SignInAttemptEntity);
  await repo.insert({ email, ip, attemptedAt: now });
  // Keep the table small: forget failures that left the window.
  await repo.delete({ attemptedAt: LessThan(new Date(now.getTime() - signInLimits.windowMs)) });
}

export async function clearSignInFailures(db: EntityManager, email: string, ip: string): Promise<void> {
  await db.getRepository(SignInAttemptEntity).delete({ email, ip });
}
