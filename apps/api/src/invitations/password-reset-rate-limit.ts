import type { EntityManager } from 'typeorm';
import { checkAttemptAllowance, recordAttempt, type AttemptAllowance, type AttemptLimits } from '../auth/attempt-rate-limit';
import { PasswordResetRequestEntity } from '../db/entities/password-reset-request.entity';

/**
 * Reset links asked for, counted in MariaDB (table password_reset_request) like failed sign-ins:
 * every request counts, known address or not, so the limit itself reveals nobody. Within an hour
 * at most 3 requests for one e-mail from one address (a lost mail, a retry, one more) and 30 from
 * one address in all (an office behind one router). Thresholds: common practice, no source.
 */
export const passwordResetLimits: AttemptLimits = {
  windowMs: 60 * 60 * 1000,
  maxPerEmailAndIp: 3,
  maxPerIp: 30,
};

export function checkPasswordResetAllowance(db: EntityManager, email: string, ip: string, now = new Date()): Promise<AttemptAllowance> {
  return checkAttemptAllowance(db, PasswordResetRequestEntity, passwordResetLimits, email, ip, now);
}

export function recordPasswordResetRequest(db: EntityManager, email: string, ip: string, now = new Date()): Promise<void> {
  return recordAttempt(db, PasswordResetRequestEntity, passwordResetLimits, email, ip, now);
}
