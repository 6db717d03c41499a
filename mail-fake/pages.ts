import type { StoredMessage } from './store.js';

// The sink's read-only inbox pages in Fluxtrail's look: graphite header, off-white paper, copper accent.

export const PAGE_CSP = "default-src 'none'; style-src 'unsafe-inline'; base-uri 'none'; form-action 'self'; frame-ancestors 'none'";
/** Mail HTML is shown as a sandboxed document: no scripts, no forms, no outside requests. */
export const MAIL_HTML_CSP = "sandbox; default-src 'none'; style-src 'unsafe-inline'; img-src data:";

export function escapeHtml(value: string): string {
  return value
    .replaceAll('&', '&amp;')
    .replaceAll('<', '&lt;')
    .replaceAll('>', '&gt;')
    .replaceAll('"', '&quot;')
    .replaceAll("'", '&#39;');
}

const STYLE = `
* { box-sizing: border-box; }
body { margin: 0; background: #f6f4ef; color: #23272b; font: 16px/1.45 "IBM Plex Sans", system-ui, -apple-system, "Segoe UI", Roboto, sans-serif; }
header { background: #23272b; color: #f6f4ef; padding: 0.8rem 1.5rem; display: flex; align-items: center; gap: 1rem; border-bottom: 4px solid #b8733a; }
header h1 { font-size: 1.15rem; margin: 0; flex: 1; }
header a { color: #f6f4ef; }
main { padding: 1.2rem 1.5rem; max-width: 70rem; }
table { width: 100%; border-collapse: collapse; background: #fff; }
th, td { text-align: left; padding: 0.55rem 0.7rem; border-bottom: 1px solid #ddd8cc; vertical-align: top; }
th { font-size: 0.8rem; text-transform: uppercase; letter-spacing: 0.05em; color: #5a6067; }
td.time, .mono { font-family: "IBM Plex Mono", ui-monospace, monospace; font-variant-numeric: tabular-nums; white-space: nowrap; }
a { color: #955a29; }
button { font: inherit; font-weight: 600; padding: 0.45rem 0.9rem; border: 0; border-radius: 4px; background: #b8733a; color: #fff; cursor: pointer; }
dl { display: grid; grid-template-columns: max-content 1fr; gap: 0.3rem 1rem; margin: 0 0 1rem; }
dt { font-weight: 600; color: #5a6067; }
dd { margin: 0; }
pre { white-space: pre-wrap; word-break: break-word; background: #fff; border-left: 4px solid #b8733a; padding: 1rem; font: 0.95rem/1.5 "IBM Plex Mono", ui-monospace, monospace; }
.empty { color: #5a6067; }
`;

function layout(title: string, body: string, headExtra = ''): string {
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
${headExtra}
<style>${STYLE}</style>
</head>
<body>
<header><h1>Fluxtrail mail sink</h1><a href="/">Inbox</a>
<form method="post" action="/clear"><button type="submit">Empty inbox</button></form></header>
<main>${body}</main>
</body>
</html>`;
}

export function inboxPage(messages: StoredMessage[]): string {
  const rows = messages
    .map((message) => `<tr>
<td class="time">${escapeHtml(message.receivedAt.replace('T', ' ').slice(0, 19))}</td>
<td>${escapeHtml(message.to.join(', '))}</td>
<td><a href="/messages/${message.id}">${escapeHtml(message.subject || '(no subject)')}</a></td>
</tr>`)
    .join('\n');
  const body = messages.length === 0
    ? '<p class="empty">No mail yet. Messages sent to this sink appear here (the page refreshes every 5 seconds).</p>'
    : `<table><thead><tr><th>Received (UTC)</th><th>To</th><th>Subject</th></tr></thead><tbody>${rows}</tbody></table>`;
  return layout('Mail sink inbox', body, '<meta http-equiv="refresh" content="5">');
}

export function messagePage(message: StoredMessage): string {
  const htmlLink = message.html ? `<dt>HTML part</dt><dd><a href="/messages/${message.id}/html">open</a></dd>` : '';
  return layout(message.subject || 'Message', `
<dl>
<dt>Subject</dt><dd>${escapeHtml(message.subject || '(no subject)')}</dd>
<dt>From</dt><dd>${escapeHtml(message.from)}</dd>
<dt>To</dt><dd>${escapeHtml(message.to.join(', '))}</dd>
<dt>Received</dt><dd class="mono">${escapeHtml(message.receivedAt)}</dd>
${htmlLink}
</dl>
<pre>${escapeHtml(message.text)}</pre>`);
}

export function notFoundPage(): string {
  return layout('Not found', '<p class="empty">No such message — it may have been cleared.</p>');
}
