import { LockMode } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Mailer, OutgoingMail } from '#server/adapters/mailer.ts';
import type { Logger } from '#server/logger.ts';
import type { Orm } from '#server/db/orm.ts';
import { OutboxEmail } from './outbox-email.entity.ts';

/** Puts an e-mail in the outbox; it is written with the caller's next flush or transaction. */
const row = (mail: OutgoingMail) => ({
  to: mail.to,
  subject: mail.subject,
  text: mail.text,
  html: mail.html ?? null,
  fromName: mail.fromName ?? null,
  replyTo: mail.replyTo ?? null,
});

export function queueEmail(em: EntityManager, mail: OutgoingMail): OutboxEmail {
  return em.create(OutboxEmail, row(mail));
}

/** A studio writing to its buyer: in its name, answers to its contact address. */
export const fromStudio = (studio: { name: string; contactEmail: string | null }) => ({
  fromName: studio.name,
  ...(studio.contactEmail ? { replyTo: studio.contactEmail } : {}),
});

/** An e-mail written now and sent only once `releaseHeldEmails` is called for its order. */
export function holdEmail(em: EntityManager, mail: OutgoingMail, orderId: string): OutboxEmail {
  return em.create(OutboxEmail, { ...row(mail), status: 'held', heldForOrder: orderId });
}

/** The order was paid: its held e-mails are due now. */
export async function releaseHeldEmails(em: EntityManager, orderId: string): Promise<void> {
  await em.nativeUpdate(
    OutboxEmail,
    { heldForOrder: orderId, status: 'held' },
    { status: 'pending', nextAttemptAt: new Date(), heldForOrder: null },
  );
}

/** The order will never be paid: its held e-mails go. */
export async function dropHeldEmails(em: EntityManager, orderId: string): Promise<void> {
  await em.nativeDelete(OutboxEmail, { heldForOrder: orderId, status: 'held' });
}

const MAX_ATTEMPTS = 12;
/** With the default 30 s: 30 s, 1 min, 2 min … capped at 1 h, about a day of retries in all. */
const backoffMs = (attempts: number, firstSeconds: number) => Math.min(firstSeconds * 1000 * 2 ** (attempts - 1), 3_600_000);

/**
 * Sends the e-mails that are due, a batch at a time. Rows are claimed with SKIP LOCKED, so any
 * number of processes may run this side by side without sending anything twice.
 */
export async function deliverDueEmails(
  orm: Orm,
  mailer: Mailer,
  logger: Logger,
  { batch = 20, retrySeconds = 30 }: { batch?: number; retrySeconds?: number } = {},
): Promise<number> {
  let sent = 0;
  await orm.em.fork().transactional(async (tx) => {
    const due = await tx.find(
      OutboxEmail,
      { status: 'pending', nextAttemptAt: { $lte: new Date() } },
      { orderBy: { nextAttemptAt: 'asc' }, limit: batch, lockMode: LockMode.PESSIMISTIC_PARTIAL_WRITE /* FOR UPDATE SKIP LOCKED */ },
    );
    for (const mail of due) {
      mail.attempts += 1;
      try {
        await mailer.send({
          to: mail.to,
          subject: mail.subject,
          text: mail.text,
          html: mail.html ?? undefined,
          fromName: mail.fromName ?? undefined,
          replyTo: mail.replyTo ?? undefined,
        });
        mail.status = 'sent';
        mail.sentAt = new Date();
        mail.lastError = null;
        sent++;
      } catch (error) {
        mail.lastError = (error as Error).message.slice(0, 500);
        if (mail.attempts >= MAX_ATTEMPTS) mail.status = 'failed';
        else mail.nextAttemptAt = new Date(Date.now() + backoffMs(mail.attempts, retrySeconds));
        logger.warn({ outboxId: mail.id, attempts: mail.attempts, err: error }, 'e-mail not sent yet; will retry');
      }
    }
  });
  return sent;
}

/** Runs the sender every `intervalMs` until stopped. */
export function startOutboxSender(
  orm: Orm,
  mailer: Mailer,
  logger: Logger,
  intervalMs = 1000,
  retrySeconds = 30,
): { stop(): Promise<void> } {
  let running: Promise<unknown> = Promise.resolve();
  let stopped = false;
  const timer = setInterval(() => {
    running = running.then(() =>
      stopped
        ? 0
        : deliverDueEmails(orm, mailer, logger, { retrySeconds }).catch((error) => logger.error({ err: error }, 'outbox sender failed')),
    );
  }, intervalMs);
  return {
    async stop() {
      stopped = true;
      clearInterval(timer);
      await running;
    },
  };
}
