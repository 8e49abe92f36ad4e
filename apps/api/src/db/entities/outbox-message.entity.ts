import { EntitySchema } from 'typeorm';
import type { OutboxState } from '@millrace/contracts';

/**
 * One e-mail to one recipient, written in the same transaction as the event that causes it.
 * Table `outbox_message`. The sender loop leases due rows (`leased_until`), sends them over SMTP
 * and records success, or the error and the next attempt (exponential back-off).
 */
export interface OutboxMessageRow {
  id: number;
  toAddress: string;
  subject: string;
  textBody: string;
  htmlBody: string;
  event: string;
  planId: number | null;
  state: OutboxState;
  attempts: number;
  nextAttemptAt: Date | null;
  leasedUntil: Date | null;
  lastError: string | null;
  createdAt: Date;
  sentAt: Date | null;
}

export const OutboxMessageEntity = new EntitySchema<OutboxMessageRow>({
  name: 'OutboxMessage',
  tableName: 'outbox_message',
  columns: {
    id: { type: 'bigint', primary: true, generated: 'increment' },
    toAddress: { name: 'to_address', type: 'varchar', length: 254 },
    subject: { type: 'varchar', length: 255 },
    textBody: { name: 'text_body', type: 'mediumtext' },
    htmlBody: { name: 'html_body', type: 'mediumtext' },
    event: { type: 'varchar', length: 40 },
    planId: { name: 'plan_id', type: 'int', nullable: true },
    state: { type: 'varchar', length: 20 },
    attempts: { type: 'int', default: 0 },
    nextAttemptAt: { name: 'next_attempt_at', type: 'datetime', precision: 3, nullable: true },
    leasedUntil: { name: 'leased_until', type: 'datetime', precision: 3, nullable: true },
    lastError: { name: 'last_error', type: 'text', nullable: true },
    createdAt: { name: 'created_at', type: 'datetime', precision: 3 },
    sentAt: { name: 'sent_at', type: 'datetime', precision: 3, nullable: true },
  },
});
