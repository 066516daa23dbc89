/** Escapes text for the HTML part of a mail. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/**
 * Wraps paragraphs and one call-to-action link into the text and HTML parts every mail carries,
 * so each template writes its words once.
 */
export function composeMail(opts: { paragraphs: string[]; action: { label: string; url: string }; footer?: string }) {
  const footer = opts.footer ?? 'Loadbearing: evidence reviews for coaches and physiotherapists.';
  const text = [...opts.paragraphs, `${opts.action.label}: ${opts.action.url}`, '', '--', footer].join('\n\n');
  const html = `<!doctype html><html><body style="font-family:system-ui,sans-serif;color:#1d2521;line-height:1.5">
${opts.paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`).join('\n')}
<p><a href="${escapeHtml(opts.action.url)}" style="display:inline-block;background:#2f5d50;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(opts.action.label)}</a></p>
<p style="color:#5b655f;font-size:13px">${escapeHtml(footer)}</p>
</body></html>`;
  return { text, html };
}
