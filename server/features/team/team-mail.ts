import { escapeHtml } from '#server/lib/html.ts';

export function inviteMail(input: { studioName: string; inviterName: string; role: string; url: string; validDays: number }) {
  return {
    subject: `Join ${input.studioName} on Etchwell`,
    text: `${input.inviterName} invites you to join ${input.studioName} on Etchwell as ${input.role}.\n\nAccept the invitation:\n${input.url}\n\nThe link works once and for ${input.validDays} days.`,
    html: `<p>${escapeHtml(input.inviterName)} invites you to join <strong>${escapeHtml(input.studioName)}</strong> on Etchwell as ${escapeHtml(input.role)}.</p><p><a href="${escapeHtml(input.url)}">Accept the invitation</a></p><p>The link works once and for ${input.validDays} days.</p>`,
  };
}
