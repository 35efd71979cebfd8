import nodemailer from 'nodemailer';
import type { Env } from '../env.ts';

/** An e-mail; `fromName` sends it in another name (a studio's) from our own address. */
export type OutgoingMail = { to: string; subject: string; text: string; html?: string; replyTo?: string; fromName?: string };

/** E-mail over SMTP: the local catcher by default, any relay or provider by SMTP_URL. */
export function createMailer(env: Pick<Env, 'SMTP_URL' | 'MAIL_FROM'>) {
  const transport = nodemailer.createTransport(env.SMTP_URL, { from: env.MAIL_FROM });
  return {
    async send(mail: OutgoingMail): Promise<{ messageId: string }> {
      const { fromName, ...rest } = mail;
      // Our address always (the studio's own domain would fail SPF and DMARC); its name shown.
      const address = /<([^>]+)>/.exec(env.MAIL_FROM)?.[1] ?? env.MAIL_FROM;
      const info = await transport.sendMail({ ...rest, from: fromName ? { name: fromName, address } : env.MAIL_FROM });
      return { messageId: info.messageId };
    },
    close: () => transport.close(),
  };
}

export type Mailer = ReturnType<typeof createMailer>;
