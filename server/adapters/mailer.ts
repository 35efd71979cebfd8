import nodemailer from 'nodemailer';
import type { Env } from '../env.ts';

export type OutgoingMail = { to: string; subject: string; text: string; html?: string; replyTo?: string };

/** E-mail over SMTP: the local catcher by default, any relay or provider by SMTP_URL. */
export function createMailer(env: Pick<Env, 'SMTP_URL' | 'MAIL_FROM'>) {
  const transport = nodemailer.createTransport(env.SMTP_URL, { from: env.MAIL_FROM });
  return {
    async send(mail: OutgoingMail): Promise<{ messageId: string }> {
      const info = await transport.sendMail({ from: env.MAIL_FROM, ...mail });
      return { messageId: info.messageId };
    },
    close: () => transport.close(),
  };
}

export type Mailer = ReturnType<typeof createMailer>;
