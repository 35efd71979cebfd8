import { randomUUID } from 'node:crypto';
import { mkdirSync, readdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { readJsonFile, writeJsonFile } from '../support/json-file.ts';

/** A received message, parsed, as the inbox page and the JSON API show it. */
export type StoredMessage = {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  /** The SMTP envelope recipients (includes Bcc). */
  envelopeTo: string[];
  subject: string;
  text: string;
  html: string | null;
  links: string[];
  size: number;
};

/** Messages on disk, one JSON file each, named so that a listing sorts by arrival. */
export class Mailbox {
  constructor(private readonly dir: string) {
    mkdirSync(dir, { recursive: true });
  }

  add(message: Omit<StoredMessage, 'id' | 'receivedAt'>): StoredMessage {
    const receivedAt = new Date().toISOString();
    const stored = { id: `${Date.now().toString(36).padStart(9, '0')}-${randomUUID().slice(0, 8)}`, receivedAt, ...message };
    writeJsonFile(join(this.dir, `${stored.id}.json`), stored);
    return stored;
  }

  /** Newest first; `to` matches any recipient, case-insensitively. */
  list(to?: string): StoredMessage[] {
    const wanted = to?.toLowerCase();
    return readdirSync(this.dir)
      .filter((name) => name.endsWith('.json'))
      .sort()
      .reverse()
      .map((name) => readJsonFile<StoredMessage | undefined>(join(this.dir, name), undefined))
      .filter((m): m is StoredMessage => Boolean(m))
      .filter((m) => !wanted || [...m.to, ...m.envelopeTo].some((r) => r.toLowerCase() === wanted));
  }

  get(id: string): StoredMessage | undefined {
    if (!/^[a-z0-9-]+$/.test(id)) return undefined;
    return readJsonFile<StoredMessage | undefined>(join(this.dir, `${id}.json`), undefined);
  }

  clear(): number {
    const names = readdirSync(this.dir).filter((name) => name.endsWith('.json'));
    for (const name of names) rmSync(join(this.dir, name), { force: true });
    return names.length;
  }
}

/** Every http(s) link of a message: hrefs of its HTML, then bare URLs of its text. */
export function extractLinks(html: string | null, text: string): string[] {
  const found = new Set<string>();
  for (const m of (html ?? '').matchAll(/href\s*=\s*["']([^"']+)["']/gi)) {
    const href = m[1]!.replace(/&amp;/g, '&');
    if (/^https?:\/\//i.test(href)) found.add(href);
  }
  for (const m of text.matchAll(/https?:\/\/[^\s<>"')\]]+/gi)) found.add(m[0]);
  return [...found];
}
