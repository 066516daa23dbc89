'use client';

import { Fragment, useMemo, useSyncExternalStore, type ReactNode } from 'react';

const ALLOWED = new Set(['I', 'EM', 'B', 'STRONG', 'SUP', 'SUB', 'SPAN', 'DIV']);

function convert(node: Node, key: number): ReactNode {
  if (node.nodeType === Node.TEXT_NODE) return node.textContent;
  if (node.nodeType !== Node.ELEMENT_NODE) return null;
  const element = node as Element;
  const children = Array.from(element.childNodes).map((child, i) => convert(child, i));
  switch (ALLOWED.has(element.tagName) ? element.tagName : 'SPAN') {
    case 'I':
    case 'EM':
      return <i key={key}>{children}</i>;
    case 'B':
    case 'STRONG':
      return <strong key={key}>{children}</strong>;
    case 'SUP':
      return <sup key={key}>{children}</sup>;
    case 'SUB':
      return <sub key={key}>{children}</sub>;
    default:
      return <Fragment key={key}>{children}</Fragment>;
  }
}

/**
 * A formatted reference's HTML (italics for journal and volume in APA) rebuilt as React nodes,
 * keeping only text and a handful of inline styles. The reference comes from imported BibTeX or
 * RIS text anyone could have written, so it is never injected as raw HTML.
 */
const subscribe = () => () => {};

export function SafeHtml({ html, fallback }: { html: string | undefined; fallback: string }) {
  // The server has no DOMParser: it and the hydrating browser both show the plain text first.
  const inBrowser = useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
  const nodes = useMemo(() => {
    if (!html || !inBrowser) return null;
    const doc = new DOMParser().parseFromString(html, 'text/html');
    return Array.from(doc.body.childNodes).map((child, i) => convert(child, i));
  }, [html, inBrowser]);
  return <>{nodes ?? fallback}</>;
}
