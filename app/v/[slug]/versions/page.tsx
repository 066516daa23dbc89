import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { VersionList } from '@/components/verdict-page/VersionList';
import { readVerdict } from '@/lib/publishing/page-data';

type Props = { params: Promise<{ slug: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const page = await readVerdict((await params).slug);
  return { title: page ? `Versions: ${page.snapshot.claim}` : 'Verdict not found', robots: { index: false } };
}

// /v/[slug]/versions — every version with its date, publisher and "what changed" note, each one readable.
export default async function VersionsPage({ params }: Props) {
  const page = await readVerdict((await params).slug);
  if (!page) notFound();
  return <VersionList page={page} />;
}
