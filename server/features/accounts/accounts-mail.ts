import { escapeHtml } from '#server/lib/html.ts';

export function verifyEmailMail(input: { name: string; studioName: string; url: string }) {
  return {
    subject: `Confirm your e-mail address for ${input.studioName}`,
    text: `Hello ${input.name},\n\nYour studio ${input.studioName} is open on Etchwell. Please confirm your e-mail address:\n\n${input.url}\n\nThe link works for 7 days.`,
    html: `<p>Hello ${escapeHtml(input.name)},</p><p>Your studio <strong>${escapeHtml(input.studioName)}</strong> is open on Etchwell. Please confirm your e-mail address:</p><p><a href="${escapeHtml(input.url)}">Confirm my e-mail address</a></p><p>The link works for 7 days.</p>`,
  };
}
