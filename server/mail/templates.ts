/**
 * Every e-mail Scrubline sends, built from one layout: a plain-text part and a simple
 * HTML part carrying the same words. Values are escaped for HTML; nothing from users
 * is ever inserted unescaped.
 */
export interface MailContent {
  subject: string;
  /** Paragraphs, in order. */
  paragraphs: string[];
  /** The one thing to do, as a button in HTML and a bare link in text. */
  action?: { label: string; url: string };
  /** Notification e-mails carry the link that turns them off. */
  unsubscribeUrl?: string;
  /** A closing line, such as why they got this e-mail. */
  footer?: string;
}

export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

export function renderMail(content: MailContent): { subject: string; text: string; html: string } {
  const text = [
    ...content.paragraphs,
    ...(content.action ? [`${content.action.label}: ${content.action.url}`] : []),
    ...(content.footer ? ['--', content.footer] : []),
    ...(content.unsubscribeUrl ? [`Stop these e-mails: ${content.unsubscribeUrl}`] : []),
  ].join('\n\n');
  const p = (s: string) => `<p style="margin:0 0 16px">${escapeHtml(s).replace(/\n/g, '<br>')}</p>`;
  const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(content.subject)}</title></head>
<body style="margin:0;padding:24px;background:#f4f4f0;font-family:sans-serif;color:#1d1d1b;font-size:16px;line-height:1.5">
<div style="max-width:560px;margin:0 auto;background:#ffffff;padding:24px;border-radius:8px">
<p style="margin:0 0 16px;font-weight:700">Scrubline</p>
${content.paragraphs.map(p).join('\n')}
${content.action ? `<p style="margin:24px 0"><a href="${escapeHtml(content.action.url)}" style="background:#1d1d1b;color:#ffffff;padding:12px 20px;border-radius:6px;text-decoration:none;font-weight:700">${escapeHtml(content.action.label)}</a></p><p style="margin:0 0 16px;font-size:13px;color:#555">Or open this link: ${escapeHtml(content.action.url)}</p>` : ''}
${content.footer ? `<p style="margin:24px 0 0;font-size:13px;color:#555">${escapeHtml(content.footer)}</p>` : ''}
${content.unsubscribeUrl ? `<p style="margin:8px 0 0;font-size:13px;color:#555"><a href="${escapeHtml(content.unsubscribeUrl)}">Stop these e-mails</a></p>` : ''}
</div></body></html>`;
  return { subject: content.subject, text, html };
}
