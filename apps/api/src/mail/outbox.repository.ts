import type { DataSource, EntityManager } from 'typeorm';
import type { OutboxMessage, OutboxState } from '@millrace/contracts';

/** One e-mail to put in the outbox (one row per recipient). */
export interface OutgoingMail {
  to: string[];
  subject: string;
  text: string;
  html: string;
  /** what caused it, e.g. "plan.submitted" */
  event: string;
  planId: number | null;
}

/** A due row leased to this sender. */
export interface LeasedMail {
  id: number;
  to: string;
  subject: string;
  text: string;
  html: string;
  attempts: number;
}

/**
 * Writes the mail into the outbox with the caller's transaction manager, so the event and its
 * e-mails are committed together (or not at all).
 */
export async function enqueueMail(db: EntityManager, mail: OutgoingMail): Promise<void> {
  const now = new Date();
  for (const to of new Set(mail.to)) {
    await db.query(
      `INSERT INTO outbox_message (to_address, subject, text_body, html_body, event, plan_id, state, attempts, next_attempt_at, created_at)
       VALUES (?, ?, ?, ?, ?, ?, 'pending', 0, ?, ?)`,
      [to, mail.subject, mail.text, mail.html, mail.event, mail.planId, now, now],
    );
  }
}

/**
 * Leases up to `limit` due messages for `leaseMs` (SELECT … FOR UPDATE SKIP LOCKED, so several
 * API processes can send without sending a message twice).
 */
export async function leaseDueMail(ds: DataSource, limit: number, leaseMs: number): Promise<LeasedMail[]> {
  return ds.transaction(async (db) => {
    const now = new Date();
    const rows: { id: number | string; to_address: string; subject: string; text_body: string; html_body: string; attempts: number }[] = await db.query(
      `SELECT id, to_address, subject, text_body, html_body, attempts FROM outbox_message
        WHERE state = 'pending' AND (next_attempt_at IS NULL OR next_attempt_at <= ?) AND (leased_until IS NULL OR leased_until <= ?)
        ORDER BY id LIMIT ? FOR UPDATE SKIP LOCKED`,
      [now, now, limit],
    );
    if (rows.length === 0) return [];
    await db.query(`UPDATE outbox_message SET leased_until = ? WHERE id IN (${rows.map(() => '?').join(',')})`, [
      new Date(now.getTime() + leaseMs),
      ...rows.map((r) => r.id),
    ]);
    return rows.map((r) => ({ id: Number(r.id), to: r.to_address, subject: r.subject, text: r.text_body, html: r.html_body, attempts: r.attempts }));
  });
}

export async function markMailSent(ds: DataSource, id: number): Promise<void> {
  await ds.query(
    `UPDATE outbox_message SET state = 'sent', attempts = attempts + 1, sent_at = ?, leased_until = NULL, next_attempt_at = NULL WHERE id = ?`,
    [new Date(), id],
  );
}

/** Records a failed attempt: retried at `nextAttemptAt`, or given up (`failed`) when it is null. */
export async function markMailAttemptFailed(ds: DataSource, id: number, error: string, nextAttemptAt: Date | null): Promise<void> {
  await ds.query(
    `UPDATE outbox_message SET state = ?, attempts = attempts + 1, last_error = ?, next_attempt_at = ?, leased_until = NULL WHERE id = ?`,
    [nextAttemptAt ? 'pending' : 'failed', error.slice(0, 2000), nextAttemptAt, id],
  );
}

export async function listOutbox(db: EntityManager, states: OutboxState[]): Promise<OutboxMessage[]> {
  const rows: {
    id: number | string;
    to_address: string;
    subject: string;
    state: OutboxState;
    attempts: number;
    next_attempt_at: Date | null;
    last_error: string | null;
    plan_id: number | null;
    created_at: Date;
    sent_at: Date | null;
  }[] = await db.query(
    `SELECT id, to_address, subject, state, attempts, next_attempt_at, last_error, plan_id, created_at, sent_at
       FROM outbox_message WHERE state IN (${states.map(() => '?').join(',')}) ORDER BY id DESC LIMIT 500`,
    states,
  );
  return rows.map((r) => ({
    id: Number(r.id),
    to: r.to_address,
    subject: r.subject,
    state: r.state,
    attempts: r.attempts,
    nextAttemptAt: r.next_attempt_at ? r.next_attempt_at.toISOString() : null,
    lastError: r.last_error,
    planId: r.plan_id,
    createdAt: r.created_at.toISOString(),
    sentAt: r.sent_at ? r.sent_at.toISOString() : null,
  }));
}
