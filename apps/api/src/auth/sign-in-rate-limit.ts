import type { EntityManager } from 'typeorm';
import { SignInAttemptEntity } from '../db/entities/sign-in-attempt.entity';
import { checkAttemptAllowance, recordAttempt, type AttemptAllowance, type AttemptLimits } from './attempt-rate-limit';

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

const limits: AttemptLimits = {
  windowMs: signInLimits.windowMs,
  maxPerEmailAndIp: signInLimits.maxFailuresPerEmailAndIp,
  maxPerIp: signInLimits.maxFailuresPerIp,
};

export type SignInAllowance = AttemptAllowance;

export function checkSignInAllowance(db: EntityManager, email: string, ip: string, now = new Date()): Promise<SignInAllowance> {
  return checkAttemptAllowance(db, SignInAttemptEntity, limits, email, ip, now);
}

export function recordSignInFailure(db: EntityManager, email: string, ip: string, now = new Date()): Promise<void> {
  return recordAttempt(db, SignInAttemptEntity, limits, email, ip, now);
}

export async function clearSignInFailures(db: EntityManager, email: string, ip: string): Promise<void> {
  await db.getRepository(SignInAttemptEntity).delete({ email, ip });
}
