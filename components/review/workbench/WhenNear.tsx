'use client';

import { useEffect, useRef, useState, type ReactNode } from 'react';
import { Skeleton } from '@/components/ui/Skeleton';

/**
 * Draws `children` once this spot comes within about a screen of the viewport; until then a
 * placeholder of about their height (`room`, Tailwind height classes; null: nothing) holds their
 * place. For the workbench's panels below the mechanisms: nobody sees them while the page loads,
 * so their code, their requests and their rendering wait until the reader scrolls or tabs
 * towards them (the browser scrolls focus into view, which brings the next panel within the
 * margin before the next Tab). docs/architecture.md, "The workbench's weight".
 */
export function WhenNear({ room, children }: { room: string | null; children: ReactNode }) {
  const ref = useRef<HTMLDivElement>(null);
  const [near, setNear] = useState(false);
  useEffect(() => {
    const spot = ref.current;
    if (near || !spot) return;
    const observer = new IntersectionObserver((entries) => entries.some((e) => e.isIntersecting) && setNear(true), {
      rootMargin: '100% 0px',
    });
    observer.observe(spot);
    return () => observer.disconnect();
  }, [near]);
  if (near) return children;
  return <div ref={ref}>{room && <Skeleton className={`${room} w-full`} />}</div>;
}
