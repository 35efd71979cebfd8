/** The e-mail with a sign-in link. */
export function signInLinkMail(url: string, validMinutes: number): { subject: string; text: string; html: string } {
  const escaped = url.replace(/&/g, '&amp;').replace(/"/g, '&quot;');
  return {
    subject: 'Your Etchwell sign-in link',
    text: `Open this link to sign in to Etchwell:\n\n${url}\n\nIt works once and for ${validMinutes} minutes. If you did not ask for it, ignore this e-mail.`,
    html: `<p>Open this link to sign in to Etchwell:</p><p><a href="${escaped}">Sign in</a></p><p>It works once and for ${validMinutes} minutes. If you did not ask for it, ignore this e-mail.</p>`,
  };
}
