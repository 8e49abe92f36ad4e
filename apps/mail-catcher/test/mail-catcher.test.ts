import { spawn } from 'node:child_process';
import { mkdtemp, readdir, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import nodemailer from 'nodemailer';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { startMailCatcher, type CaughtMessageSummary, type CaughtMessageWithRaw, type RunningMailCatcher } from '../src/index';

// The sender is nodemailer, an independent SMTP client (RFC 5321); header names and address
// fields follow RFC 5322 §3.6. Nothing below is produced by the catcher's own code.

const here = path.dirname(fileURLToPath(import.meta.url));

function sender(port: number) {
  return nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true, connectionTimeout: 3_000 });
}

async function getJson<T>(url: string): Promise<{ status: number; body: T }> {
  const res = await fetch(url);
  return { status: res.status, body: (await res.json()) as T };
}

describe('mail catcher', () => {
  let dir: string;
  let catcher: RunningMailCatcher | undefined;

  beforeAll(async () => {
    dir = await mkdtemp(path.join(tmpdir(), 'millrace-mail-test-'));
  });
  afterEach(async () => {
    await catcher?.stop();
    catcher = undefined;
  });
  afterAll(async () => {
    await rm(dir, { recursive: true, force: true });
  });

  it('when a message is sent over SMTP with nodemailer, then the read API lists it and returns text, html, headers and the raw message', async () => {
    catcher = await startMailCatcher({ smtpPort: 0, httpPort: 0, mailDir: path.join(dir, 'a') });
    const info = await sender(catcher.smtpPort).sendMail({
      from: '"Plan desk" <planner@millrace.test>',
      to: 'supervisor@millrace.test, Floor <floor@millrace.test>',
      bcc: 'audit@millrace.test',
      subject: 'Plan for week 2026-W10 — ready for sign-off',
      text: 'Please review the plan.\nLink: http://127.0.0.1:8080/plans/1',
      html: '<p>Please review the <a href="http://127.0.0.1:8080/plans/1">plan</a>.</p>',
    });
    expect(info.accepted).toEqual(['supervisor@millrace.test', 'floor@millrace.test', 'audit@millrace.test']);

    const list = await getJson<CaughtMessageSummary[]>(`${catcher.url}/messages`);
    expect(list.status).toBe(200);
    expect(list.body).toHaveLength(1);
    const summary = list.body[0];
    expect(summary.from).toBe('planner@millrace.test');
    expect(summary.to).toEqual(['supervisor@millrace.test', 'floor@millrace.test']);
    // Bcc never appears in the headers (RFC 5322 §3.6.3); only the SMTP envelope names it.
    expect(summary.envelopeTo).toEqual(['supervisor@millrace.test', 'floor@millrace.test', 'audit@millrace.test']);
    expect(summary.envelopeFrom).toBe('planner@millrace.test');
    expect(summary.subject).toBe('Plan for week 2026-W10 — ready for sign-off');
    expect(Number.isNaN(Date.parse(summary.date))).toBe(false);

    const detail = await getJson<CaughtMessageWithRaw>(`${catcher.url}/messages/${summary.id}`);
    expect(detail.status).toBe(200);
    expect(detail.body.text.trim()).toBe('Please review the plan.\nLink: http://127.0.0.1:8080/plans/1');
    expect(detail.body.html).toContain('<a href="http://127.0.0.1:8080/plans/1">plan</a>');
    expect(detail.body.headers['message-id']).toBe(info.messageId);
    expect(detail.body.headers['bcc']).toBeUndefined();
    expect(detail.body.raw).toContain(`Message-ID: ${info.messageId}`);

    // The raw message is kept on disk exactly as received, next to its parsed JSON.
    const files = (await readdir(path.join(dir, 'a'))).sort();
    expect(files).toEqual([`${summary.id}.eml`, `${summary.id}.json`]);
    expect(await readFile(path.join(dir, 'a', `${summary.id}.eml`), 'utf8')).toBe(detail.body.raw);
  });

  it('when messages go to different people, then ?to= keeps only theirs, an unknown id is 404 and DELETE clears everything', async () => {
    catcher = await startMailCatcher({ smtpPort: 0, httpPort: 0, mailDir: path.join(dir, 'b') });
    const transport = sender(catcher.smtpPort);
    await transport.sendMail({ from: 'admin@millrace.test', to: 'planner@millrace.test', subject: 'one', text: '1' });
    await transport.sendMail({ from: 'admin@millrace.test', to: 'floor@millrace.test', subject: 'two', text: '2' });

    const forFloor = await getJson<CaughtMessageSummary[]>(`${catcher.url}/messages?to=FLOOR@millrace.test`);
    expect(forFloor.body.map((m) => m.subject)).toEqual(['two']);
    const all = await getJson<CaughtMessageSummary[]>(`${catcher.url}/messages`);
    expect(all.body.map((m) => m.subject)).toEqual(['one', 'two']);

    const missing = await getJson<{ error: { code: string } }>(`${catcher.url}/messages/1700000000000-000001-deadbeef`);
    expect(missing.status).toBe(404);
    expect(missing.body.error.code).toBe('not_found');
    const wrongMethod = await fetch(`${catcher.url}/messages`, { method: 'POST' });
    expect(wrongMethod.status).toBe(405);

    const cleared = await fetch(`${catcher.url}/messages`, { method: 'DELETE' });
    expect(await cleared.json()).toEqual({ deleted: 2 });
    expect((await getJson<unknown[]>(`${catcher.url}/messages`)).body).toEqual([]);
    expect(await readdir(path.join(dir, 'b'))).toEqual([]);
  });

  it('when the catcher is stopped, then sending fails; when it is started again on the same ports, then old mail is kept and new mail arrives', async () => {
    const mailDir = path.join(dir, 'c');
    catcher = await startMailCatcher({ smtpPort: 0, httpPort: 0, mailDir });
    const { smtpPort, httpPort } = catcher;
    await sender(smtpPort).sendMail({ from: 'a@millrace.test', to: 'b@millrace.test', subject: 'before', text: 'x' });
    await catcher.stop();
    catcher = undefined;

    await expect(
      sender(smtpPort).sendMail({ from: 'a@millrace.test', to: 'b@millrace.test', subject: 'while down', text: 'x' }),
    ).rejects.toMatchObject({ code: 'ESOCKET' });

    catcher = await startMailCatcher({ smtpPort, httpPort, mailDir });
    expect([catcher.smtpPort, catcher.httpPort]).toEqual([smtpPort, httpPort]);
    await sender(smtpPort).sendMail({ from: 'a@millrace.test', to: 'b@millrace.test', subject: 'after', text: 'x' });
    const list = await getJson<CaughtMessageSummary[]>(`${catcher.url}/messages`);
    expect(list.body.map((m) => m.subject)).toEqual(['before', 'after']);
  });

  it('when SMTP is taken down over the read API, then sending fails while the API answers; after /smtp/up, mail arrives on the same port', async () => {
    catcher = await startMailCatcher({ smtpPort: 0, httpPort: 0, mailDir: path.join(dir, 'g') });
    const post = async (what: string) => (await fetch(`${catcher!.url}/smtp/${what}`, { method: 'POST' })).json();

    expect(await post('down')).toEqual({ smtp: 'down' });
    expect((await getJson<{ smtp: string }>(`${catcher.url}/health`)).body.smtp).toBe('down');
    await expect(
      sender(catcher.smtpPort).sendMail({ from: 'a@millrace.test', to: 'b@millrace.test', subject: 'lost', text: 'x' }),
    ).rejects.toMatchObject({ code: 'ESOCKET' });

    expect(await post('up')).toEqual({ smtp: 'up' });
    expect(await post('up')).toEqual({ smtp: 'up' });
    await sender(catcher.smtpPort).sendMail({ from: 'a@millrace.test', to: 'b@millrace.test', subject: 'later', text: 'x' });
    const list = await getJson<CaughtMessageSummary[]>(`${catcher.url}/messages`);
    expect(list.body.map((m) => m.subject)).toEqual(['later']);
    expect((await fetch(`${catcher.url}/smtp/down`)).status).toBe(405);
  });

  it('when a port is taken, then starting says which port is in use', async () => {
    catcher = await startMailCatcher({ smtpPort: 0, httpPort: 0, mailDir: path.join(dir, 'd') });
    await expect(startMailCatcher({ smtpPort: catcher.smtpPort, httpPort: 0, mailDir: path.join(dir, 'e') })).rejects.toThrow(
      `The mail catcher's SMTP port 127.0.0.1:${catcher.smtpPort} is already in use.`,
    );
  });

  it('when the catcher process gets SIGTERM, then it exits with code 0 and frees its ports', async () => {
    const child = spawn(process.execPath, ['--import', 'tsx', path.join(here, '../src/main.ts')], {
      env: { ...process.env, MAIL_CATCHER_SMTP_PORT: '0', MAIL_CATCHER_HTTP_PORT: '0', MAIL_CATCHER_DIR: path.join(dir, 'f') },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
    const ports = await new Promise<{ smtp: number; http: number }>((resolve, reject) => {
      child.stdout.on('data', (chunk: Buffer) => {
        output += chunk.toString();
        const match = /SMTP on 127\.0\.0\.1:(\d+), read API on http:\/\/127\.0\.0\.1:(\d+)/.exec(output);
        if (match) resolve({ smtp: Number(match[1]), http: Number(match[2]) });
      });
      child.once('exit', (code) => reject(new Error(`catcher exited early with ${code}: ${output}`)));
    });
    const health = await getJson<{ status: string }>(`http://127.0.0.1:${ports.http}/health`);
    expect(health.body.status).toBe('ok');

    const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
    child.kill('SIGTERM');
    expect(await exited).toBe(0);
    await expect(fetch(`http://127.0.0.1:${ports.http}/health`)).rejects.toThrow();
    // The same ports can be taken again at once.
    catcher = await startMailCatcher({ smtpPort: ports.smtp, httpPort: ports.http, mailDir: path.join(dir, 'f') });
    expect(catcher.smtpPort).toBe(ports.smtp);
  });
});
