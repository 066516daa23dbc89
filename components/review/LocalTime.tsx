'use client';

import { useSyncExternalStore } from 'react';
import { dateTime } from './labels';

const subscribe = () => () => {};

/**
 * A date in the reader's own locale and time zone. The server does not know either, so the
 * server render (and hydration) shows the plain ISO date, and the browser then re-renders it
 * locally — no hydration mismatch, no wrong time zone.
 */
export function LocalTime({ iso, dateOnly = false }: { iso: string; dateOnly?: boolean }) {
  const inBrowser = useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
  const text = !inBrowser ? iso.slice(0, 10) : dateOnly ? new Date(iso).toLocaleDateString() : dateTime(iso);
  return <time dateTime={iso}>{text}</time>;
}
