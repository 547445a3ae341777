import type { ReceivedMail } from './smtp-fake.ts';

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
const linkify = (s: string) => escape(s).replace(/(https?:\/\/[^\s<]+)/g, '<a href="$1">$1</a>');

/** HTML page listing what the local SMTP fake received, newest first (development only). */
export function renderDevMailbox(messages: readonly ReceivedMail[]): string {
  const items = [...messages]
    .reverse()
    .map(
      (m) => `<article data-mail-id="${m.id}">
  <h2>${escape(m.subject)}</h2>
  <p class="meta">To ${escape(m.to.join(', '))} · ${escape(m.receivedAt)}</p>
  <pre>${linkify(m.text)}</pre>
</article>`,
    )
    .join('\n');
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Holonaut · development mailbox</title>
<style>body{font-family:system-ui,sans-serif;margin:0;padding:16px;background:#0f1720;color:#e6edf3}
h1{font-size:20px}article{background:#16212d;border:1px solid #26384a;border-radius:10px;padding:12px 16px;margin:12px 0}
h2{font-size:16px;margin:0 0 4px}.meta{color:#8aa0b4;font-size:13px;margin:0 0 8px}pre{white-space:pre-wrap;font:14px/1.5 ui-monospace,monospace}a{color:#ffb454}</style>
</head><body><h1>Development mailbox</h1><p class="meta">Messages the local SMTP fake received since the server started. Not present in production.</p>
${items || '<p>No messages yet.</p>'}</body></html>`;
}
