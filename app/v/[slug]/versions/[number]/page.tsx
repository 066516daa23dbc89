import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { VerdictArticle } from '@/components/verdict-page/VerdictArticle';
import { verdictMetadata } from '@/components/verdict-page/metadata';
import { readVerdict } from '@/lib/publishing/page-data';

type Props = { params: Promise<{ slug: string; number: string }> };

async function load(params: Props['params']) {
  const { slug, number } = await params;
  return /^\d{1,6}$/.test(number) ? readVerdict(slug, Number(number)) : null;
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const page = await load(params);
  return page
    ? { ...verdictMetadata(page, page.version.number), robots: { index: false } }
    : { title: 'Version not found' };
}

// /v/[slug]/versions/[number] — one earlier (or the current) version, exactly as it was published.
export default async function VersionPage({ params }: Props) {
  const page = await load(params);
  if (!page) notFound();
  return <VerdictArticle page={page} latest={page.version.number === page.latestNumber} />;
}
