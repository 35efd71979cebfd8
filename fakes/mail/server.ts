import { createServer } from 'node:http';
import express from 'express';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import { close, listen } from '../support/listen.ts';
import { requestLogMiddleware, silentLogger, type RequestLogger } from '../support/request-log.ts';
import { extractLinks, Mailbox } from './mailbox.ts';
import { inboxPage, messagePage } from './inbox-page.ts';

/**
 * A local mail catcher: an SMTP server on loopback that keeps every message on disk, an inbox
 * page for people and a JSON API for tests. Nothing is relayed anywhere.
 */
export type MailFakeOptions = {
  smtpPort?: number;
  httpPort?: number;
  host?: string;
  dataDir: string;
  maxMessageBytes?: number;
  log?: RequestLogger;
};

export type MailFake = { smtpPort: number; httpPort: number; url: string; smtpUrl: string; stop(): Promise<void> };

const addresses = (value: AddressObject | AddressObject[] | undefined): string[] =>
  (Array.isArray(value) ? value : value ? [value] : []).flatMap((a) => a.value.map((v) => v.address ?? '').filter(Boolean));

export async function startMailFake(options: MailFakeOptions): Promise<MailFake> {
  const host = options.host ?? '127.0.0.1';
  const mailbox = new Mailbox(options.dataDir);
  const log = options.log ?? silentLogger;
  const maxMessageBytes = options.maxMessageBytes ?? 25 * 1024 * 1024;

  const smtp = new SMTPServer({
    // Loopback only, no credentials: the app's mailer connects in plain SMTP.
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    size: maxMessageBytes,
    banner: 'local mail catcher',
    logger: false,
    onData(stream, session, callback) {
      const startedAt = Date.now();
      simpleParser(stream)
        .then((parsed) => {
          if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) {
            return callback(Object.assign(new Error(`Message exceeds the ${maxMessageBytes} bytes allowed`), { responseCode: 552 }));
          }
          const html = typeof parsed.html === 'string' ? parsed.html : null;
          const text = parsed.text ?? '';
          const stored = mailbox.add({
            from: parsed.from?.text ?? (session.envelope.mailFrom ? session.envelope.mailFrom.address : ''),
            to: addresses(parsed.to),
            envelopeTo: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            text,
            html,
            links: extractLinks(html, text),
            size: Buffer.byteLength(text) + Buffer.byteLength(html ?? ''),
          });
          log(`SMTP message ${stored.id} to ${stored.envelopeTo.join(', ')} "${stored.subject}" (${Date.now() - startedAt} ms)`);
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });

  const app = express();
  app.disable('x-powered-by');
  app.use(requestLogMiddleware(log));
  // JSON API for tests
  app.get('/api/messages', (req, res) => res.json({ messages: mailbox.list(req.query.to as string | undefined) }));
  app.get('/api/messages/latest', (req, res) => {
    const latest = mailbox.list(req.query.to as string | undefined)[0];
    if (!latest) return void res.status(404).json({ error: 'no message' });
    res.json(latest);
  });
  app.get('/api/messages/:id', (req, res) => {
    const message = mailbox.get(req.params.id);
    if (!message) return void res.status(404).json({ error: 'no such message' });
    res.json(message);
  });
  app.delete('/api/messages', (_req, res) => res.json({ deleted: mailbox.clear() }));
  // Pages for people
  app.get('/', (req, res) =>
    res.type('html').send(inboxPage(mailbox.list(req.query.to as string | undefined), req.query.to as string | undefined)),
  );
  app.get('/messages/:id', (req, res) => {
    const message = mailbox.get(req.params.id);
    if (!message) return void res.status(404).type('text/plain').send('No such message.');
    res.type('html').send(messagePage(message, req.query.view === 'text' ? 'text' : 'html'));
  });
  app.post('/clear', (_req, res) => {
    mailbox.clear();
    res.redirect(303, '/');
  });

  const http = createServer(app);
  const httpPort = await listen(http, options.httpPort ?? 0, host);
  const smtpPort = await new Promise<number>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(options.smtpPort ?? 0, host, () => {
      const address = smtp.server.address();
      resolve(typeof address === 'object' && address ? address.port : 0);
    });
  });
  return {
    smtpPort,
    httpPort,
    url: `http://${host}:${httpPort}`,
    smtpUrl: `smtp://${host}:${smtpPort}`,
    async stop() {
      await close(http);
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
    },
  };
}
