import { LessThan, MoreThan, type EntityManager, type EntitySchema } from 'typeorm';

/** One counted attempt (a failed sign-in, a reset-link request): who, from where, when. */
export interface AttemptRow {
  id: number;
  email: string;
  ip: string;
  attemptedAt: Date;
}

/**
 * A limit on attempts per e-mail + IP and per IP, counted in a MariaDB table so it holds across
 * several API processes. Within `windowMs`, at most `maxPerEmailAndIp` attempts for one e-mail
 * from one address and `maxPerIp` from one address over all e-mails.
 */
export interface AttemptLimits {
  windowMs: number;
  maxPerEmailAndIp: number;
  maxPerIp: number;
}

export type AttemptAllowance = { outcome: 'allowed' } | { outcome: 'limited'; retryAfterSeconds: number };

export async function checkAttemptAllowance(
  db: EntityManager,
  table: EntitySchema<AttemptRow>,
  limits: AttemptLimits,
  email: string,
  ip: string,
  now = new Date(),
): Promise<AttemptAllowance> {
  const repo = db.getRepository(table);
  const since = new Date(now.getTime() - limits.windowMs);
  const checks: Array<{ where: object; max: number }> = [
    { where: { email, ip, attemptedAt: MoreThan(since) }, max: limits.maxPerEmailAndIp },
    { where: { ip, attemptedAt: MoreThan(since) }, max: limits.maxPerIp },
  ];
  let retryAfterMs = 0;
  for (const { where, max } of checks) {
    const recent = await repo.find({ where, order: { attemptedAt: 'DESC' }, take: max, select: { attemptedAt: true } });
    if (recent.length >= max) {
      // The oldest of the last `max` attempts must leave the window before one more is allowed.
      const oldest = recent[recent.length - 1].attemptedAt.getTime();
      retryAfterMs = Math.max(retryAfterMs, oldest + limits.windowMs - now.getTime());
    }
  }
  return retryAfterMs > 0 ? { outcome: 'limited', retryAfterSeconds: Math.max(1, Math.ceil(retryAfterMs / 1000)) } : { outcome: 'allowed' };
}

export async function recordAttempt(
  db: EntityManager,
  table: EntitySchema<AttemptRow>,
  limits: AttemptLimits,
  email: string,
  ip: string,
  now = new Date(),
): Promise<void> {
  const repo = db.getRepository(table);
  await repo.insert({ email, ip, attemptedAt: now });
  // Keep the table small: forget attempts that left the window.
  await repo.delete({ attemptedAt: LessThan(new Date(now.getTime() - limits.windowMs)) });
}

