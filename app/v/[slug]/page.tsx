import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { VerdictArticle } from '@/components/verdict-page/VerdictArticle';
import { verdictMetadata } from '@/components/verdict-page/metadata';
import { readVerdict } from '@/lib/publishing/page-data';

type Props = { params: Promise<{ slug: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const page = await readVerdict((await params).slug);
  return page ? verdictMetadata(page) : { title: 'Verdict not found', robots: { index: false } };
}

// /v/[slug] — the latest version of a published verdict; team-only ones for members only (404 to anyone else).
export default async function VerdictPage({ params }: Props) {
  const page = await readVerdict((await params).slug);
  if (!page) notFound();
  return <VerdictArticle page={page} latest />;
}
