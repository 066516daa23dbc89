import { FilterXSS } from 'xss';

/**
 * The allow-list every stored HTML fragment passes before a verdict page shows it (the rendered
 * body, APA references). Anything not listed — script, style, iframe, img, event handlers,
 * style attributes, javascript: and data: URLs — is dropped, so no script from stored content
 * ever runs. The package is js-xss (npm `xss`), which runs on Node 20 without a DOM.
 */
const ALLOWED: Record<string, string[]> = {
  p: [],
  h2: ['id'],
  h3: ['id'],
  h4: [],
  strong: [],
  b: [],
  em: [],
  i: [],
  u: [],
  s: [],
  code: [],
  pre: [],
  blockquote: [],
  ul: [],
  ol: ['start'],
  li: [],
  br: [],
  hr: [],
  a: ['href', 'class'],
  span: ['class'],
  div: ['class'],
  aside: ['class', 'aria-label'],
};

const filter = new FilterXSS({
  whiteList: ALLOWED,
  stripIgnoreTag: true,
  stripIgnoreTagBody: ['script', 'style', 'iframe', 'object', 'embed', 'template', 'noscript'],
  allowCommentTag: false,
  onTagAttr(tag, name, value) {
    // Only in-page anchors and web links; js-xss already drops javascript:, we also drop data:, mailto: etc.
    if (tag === 'a' && name === 'href') {
      const v = value.trim();
      if (v.startsWith('#') || /^https?:\/\//i.test(v)) return `href="${v.replace(/"/g, '&quot;')}"`;
      return '';
    }
    if (name === 'class' && !/^[a-z0-9 _-]*$/i.test(value)) return '';
    return undefined;
  },
});

export function sanitizeHtml(html: string): string {
  return filter.process(html);
}
