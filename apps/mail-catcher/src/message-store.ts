import { randomBytes } from 'node:crypto';
import { mkdir, readdir, readFile, rm, writeFile, rename } from 'node:fs/promises';
import path from 'node:path';
import { summarize, type CaughtMessage, type CaughtMessageSummary, type CaughtMessageWithRaw } from './caught-message';
import { parseMessage, type Envelope } from './parse-message';

const ID_PATTERN = /^[0-9]{13}-[0-9]{6}-[0-9a-f]{8}$/;

/**
 * Keeps every message on disk: `<id>.eml` (the raw message as received) and `<id>.json` (the parsed
 * message). An in-memory index of summaries is rebuilt from the JSON files at start, so a restarted
 * catcher still lists the mail it caught before.
 */
export class MessageStore {
  private readonly index = new Map<string, CaughtMessageSummary>();
  private sequence = 0;

  private constructor(readonly dir: string) {}

  static async open(dir: string): Promise<MessageStore> {
    await mkdir(dir, { recursive: true, mode: 0o700 });
    const store = new MessageStore(dir);
    const names = (await readdir(dir)).filter((name) => name.endsWith('.json')).sort();
    for (const name of names) {
      try {
        const message = JSON.parse(await readFile(path.join(dir, name), 'utf8')) as CaughtMessage;
        if (ID_PATTERN.test(message.id)) store.index.set(message.id, summarize(message));
      } catch {
        // A half-written file from a crash: the .eml may still be read by hand; skip it in the index.
      }
    }
    return store;
  }

  private nextId(): string {
    this.sequence = (this.sequence + 1) % 1_000_000;
    return `${Date.now()}-${String(this.sequence).padStart(6, '0')}-${randomBytes(4).toString('hex')}`;
  }

  async add(raw: Buffer, envelope: Envelope): Promise<CaughtMessageSummary> {
    const id = this.nextId();
    const message = await parseMessage(id, raw, envelope, new Date());
    await writeFile(path.join(this.dir, `${id}.eml`), raw);
    const jsonPath = path.join(this.dir, `${id}.json`);
    await writeFile(`${jsonPath}.tmp`, JSON.stringify(message, null, 2));
    await rename(`${jsonPath}.tmp`, jsonPath);
    const summary = summarize(message);
    this.index.set(id, summary);
    return summary;
  }

  /** Oldest first. `to` (optional) keeps messages whose To header or envelope names that address. */
  list(to?: string): CaughtMessageSummary[] {
    const all = [...this.index.values()].sort((a, b) => a.id.localeCompare(b.id));
    if (!to) return all;
    const wanted = to.toLowerCase();
    return all.filter((m) => [...m.to, ...m.envelopeTo].some((address) => address.toLowerCase() === wanted));
  }

  async get(id: string): Promise<CaughtMessageWithRaw | undefined> {
    if (!ID_PATTERN.test(id) || !this.index.has(id)) return undefined;
    const message = JSON.parse(await readFile(path.join(this.dir, `${id}.json`), 'utf8')) as CaughtMessage;
    const raw = await readFile(path.join(this.dir, `${id}.eml`), 'utf8');
    return { ...message, raw };
  }

  async clear(): Promise<number> {
    const count = this.index.size;
    this.index.clear();
    const names = await readdir(this.dir);
    await Promise.all(
      names
        .filter((name) => /\.(eml|json|json\.tmp)$/.test(name))
        .map((name) => rm(path.join(this.dir, name), { force: true })),
    );
    return count;
  }
}
