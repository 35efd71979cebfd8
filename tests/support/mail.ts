import { afterAll } from 'vitest';
import { startMailFake, type MailFake } from '#fakes/mail/server.ts';
import type { StoredMessage } from '#fakes/mail/mailbox.ts';
import { eventually, temporaryDataDir } from './fakes.ts';

/**
 * For a test file that reads the app's e-mail: a mail stand-in on a free port with a temporary
 * inbox. Start it before the app (`await mail.start()`), pass `mail.smtpUrl` as SMTP_URL.
 */
export function useMailFake() {
  const data = temporaryDataDir('mail');
  let fake: MailFake | undefined;
  afterAll(async () => {
    await fake?.stop();
    data.remove();
  });
  return {
    async start(): Promise<MailFake> {
      fake = await startMailFake({ dataDir: data.dir });
      return fake;
    },
    get smtpUrl() {
      return fake!.smtpUrl;
    },
    get url() {
      return fake!.url;
    },
    /** The newest message to this address, waiting for the outbox to send it. */
    latestTo(email: string): Promise<StoredMessage> {
      return eventually(async () => {
        const res = await fetch(`${fake!.url}/api/messages/latest?to=${encodeURIComponent(email)}`);
        return res.ok ? ((await res.json()) as StoredMessage) : undefined;
      });
    },
  };
}
