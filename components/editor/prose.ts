/**
 * Typography for review text (the editor and the kept copy). Written as Tailwind variants on the
 * container because the text is produced by ProseMirror, not by our JSX, and the app has no
 * typography plugin.
 */
export const PROSE = [
  'text-base leading-relaxed text-ink',
  '[&_p]:my-3',
  '[&_h2]:mt-6 [&_h2]:mb-2 [&_h2]:font-display [&_h2]:text-xl [&_h2]:font-semibold',
  '[&_h3]:mt-5 [&_h3]:mb-2 [&_h3]:font-display [&_h3]:text-lg [&_h3]:font-semibold',
  '[&_ul]:my-3 [&_ul]:list-disc [&_ul]:pl-6 [&_ol]:my-3 [&_ol]:list-decimal [&_ol]:pl-6 [&_li>p]:my-1',
  '[&_blockquote]:my-3 [&_blockquote]:border-l-4 [&_blockquote]:border-line-strong [&_blockquote]:pl-4 [&_blockquote]:text-ink-muted',
  '[&_code]:rounded-sm [&_code]:bg-paper-sunken [&_code]:px-1 [&_code]:font-mono [&_code]:text-sm',
  '[&_a]:text-brand [&_a]:underline',
  '[&_hr]:my-6 [&_hr]:border-line',
  // Static copies of the custom nodes (the kept copy renders plain HTML, not node views).
  '[&_div[data-type=mechanism-block]]:my-3 [&_div[data-type=mechanism-block]]:rounded-md [&_div[data-type=mechanism-block]]:border [&_div[data-type=mechanism-block]]:border-granite-200 [&_div[data-type=mechanism-block]]:bg-granite-50 [&_div[data-type=mechanism-block]]:px-3 [&_div[data-type=mechanism-block]]:py-2 [&_div[data-type=mechanism-block]]:font-semibold',
  '[&_span[data-type=citation]]:text-accent-text',
].join(' ');
