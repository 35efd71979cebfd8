import type { StoredMessage } from './mailbox.ts';

const escapeHtml = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

const STYLE = `
  *{box-sizing:border-box} body{margin:0;font:15px/1.5 system-ui,sans-serif;background:#f3f1ec;color:#23201d}
  header{background:#23201d;color:#f3f1ec;padding:14px 24px;display:flex;justify-content:space-between;align-items:center}
  header a{color:inherit} main{max-width:1000px;margin:24px auto;padding:0 16px}
  table{width:100%;border-collapse:collapse;background:#fff;border-radius:10px;overflow:hidden}
  th,td{padding:10px 14px;text-align:left;border-bottom:1px solid #e7e2d9;font-size:14px} th{background:#ebe6dc;font-size:12px;text-transform:uppercase;letter-spacing:.05em}
  tr:hover td{background:#faf8f4} a{color:#1d5fa8} .meta{background:#fff;border-radius:10px;padding:16px 20px;margin-bottom:14px}
  .meta dt{font-weight:700;font-size:12px;text-transform:uppercase;color:#6d655c} .meta dd{margin:0 0 8px}
  nav a{margin-right:14px} iframe{width:100%;height:70vh;border:0;background:#fff;border-radius:10px} pre{white-space:pre-wrap;background:#fff;border-radius:10px;padding:16px}
  .empty{background:#fff;border-radius:10px;padding:40px;text-align:center;color:#6d655c} form{display:inline}
  button{background:none;border:1px solid #f3f1ec;color:inherit;border-radius:6px;padding:4px 10px;cursor:pointer}`;

const frame = (title: string, body: string) =>
  `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${escapeHtml(title)}</title><link rel="icon" href="data:,"><style>${STYLE}</style></head>
<body><header><strong><a href="/">Local mail inbox</a></strong><form method="post" action="/clear"><button type="submit">Empty the inbox</button></form></header><main>${body}</main></body></html>`;

export function inboxPage(messages: StoredMessage[], to?: string): string {
  if (!messages.length)
    return frame(
      'Inbox',
      `<div class="empty">${to ? `No messages for ${escapeHtml(to)}.` : 'No messages yet. Mail sent to this server over SMTP shows up here.'}</div>`,
    );
  const rows = messages
    .map(
      (m) =>
        `<tr><td>${new Date(m.receivedAt).toLocaleString('en-GB')}</td><td>${escapeHtml(m.to.join(', '))}</td><td><a href="/messages/${m.id}">${escapeHtml(m.subject || '(no subject)')}</a></td><td>${escapeHtml(m.from)}</td></tr>`,
    )
    .join('');
  return frame(
    'Inbox',
    `<table><thead><tr><th>Received</th><th>To</th><th>Subject</th><th>From</th></tr></thead><tbody>${rows}</tbody></table>`,
  );
}

/** Links in the message open in the whole window, not inside the frame. */
function withTopTarget(html: string): string {
  const base = '<base target="_top">';
  return /<head[^>]*>/i.test(html) ? html.replace(/<head[^>]*>/i, (head) => head + base) : base + html;
}

export function messagePage(message: StoredMessage, view: 'html' | 'text'): string {
  const links = message.links.map((l) => `<li><a href="${escapeHtml(l)}">${escapeHtml(l)}</a></li>`).join('');
  const body =
    view === 'html' && message.html
      ? // The message's own HTML runs in a sandbox: links open in the top window, no scripts run.
        `<iframe title="Message" sandbox="allow-popups allow-top-navigation-by-user-activation" srcdoc="${escapeHtml(withTopTarget(message.html))}"></iframe>`
      : `<pre>${escapeHtml(message.text)}</pre>`;
  return frame(
    message.subject,
    `<div class="meta"><dl><dt>Subject</dt><dd>${escapeHtml(message.subject)}</dd><dt>From</dt><dd>${escapeHtml(message.from)}</dd><dt>To</dt><dd>${escapeHtml(message.to.join(', '))}</dd><dt>Received</dt><dd>${escapeHtml(message.receivedAt)}</dd></dl>
<nav><a href="/messages/${message.id}?view=html">HTML</a><a href="/messages/${message.id}?view=text">Text</a><a href="/">Back to the inbox</a></nav></div>
${body}${links ? `<div class="meta"><dt>Links</dt><ul>${links}</ul></div>` : ''}`,
  );
}
