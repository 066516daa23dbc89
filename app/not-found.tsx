import type { Metadata } from 'next';
import { LogoMark } from '@/components/layout/Logo';
import { NotFoundPanel } from '@/components/layout/NotFoundPanel';

export const metadata: Metadata = { title: 'Not found' };

export default function NotFound() {
  return (
    <div className="flex flex-1 flex-col justify-center">
      {/* An unknown address renders in the root layout only, which has no header to say where you are. */}
      <p className="max-w-measure px-gutter mx-auto w-full pt-10" aria-hidden="true">
        <LogoMark className="size-10" />
      </p>
      <NotFoundPanel title="Nothing is hanging on this hold">
        <p>
          The page you asked for does not exist, or it belongs to a team you are not in. Check the address, or start
          from a page you know.
        </p>
      </NotFoundPanel>
    </div>
  );
}
