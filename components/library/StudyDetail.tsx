'use client';

import Link from 'next/link';
import { notFound, useRouter } from 'next/navigation';
import { useId, useMemo, useRef, useState } from 'react';
import { useSWRConfig } from 'swr';
import { Badge } from '@/components/ui/Badge';
import { Button, buttonClasses } from '@/components/ui/Button';
import { Card, CardBody, CardHeader } from '@/components/ui/Card';
import { Skeleton } from '@/components/ui/Skeleton';
import { Spinner } from '@/components/ui/Spinner';
import { Dialog } from '@/components/ui/Dialog';
import {
  CERTAINTY_LABEL,
  DESIGN_LABEL,
  DIRECTION_LABEL,
  percent,
  TRAINING_STATUS_LABEL,
} from '@/components/review/labels';
import { decide } from '@/lib/auth/policy';
import type { ViewerProps } from '@/components/review/viewer';
import type { StudyDetailDTO, StudyDTO, StudyInUseDTO } from '@/lib/reviews/types';
import { ApiError, apiFetch, errorMessage } from '@/lib/swr/fetcher';
import { isStudiesKey, keys } from '@/lib/swr/keys';
import { useCitation } from '@/lib/swr/use-citation';
import { useStudy } from '@/lib/swr/use-study';
import { MAX_PDF_MB, uploadErrorMessage, uploadPdf } from './pdf-upload';
import { NoticeBanner } from './NoticeBadge';
import { SafeHtml } from './SafeHtml';
import { StudyMetaForm } from './StudyMetaForm';

const EXPORTS = [
  { format: 'bibtex', label: 'BibTeX' },
  { format: 'ris', label: 'RIS' },
  { format: 'csl', label: 'CSL-JSON' },
] as const;

function describeEffect(study: StudyDTO): string {
  const e = study.effect;
  if (!e) return 'None recorded';
  switch (e.kind) {
    case 'means':
      return `Means ${e.m1} (SD ${e.sd1}, n ${e.n1}) vs ${e.m2} (SD ${e.sd2}, n ${e.n2})`;
    case 't':
      return `t = ${e.t}, n ${e.n1} and ${e.n2}`;
    case 'two-by-two':
      return `2×2 table a ${e.a}, b ${e.b}, c ${e.c}, d ${e.d} (${e.measure === 'risk-ratio' ? 'risk ratio' : 'odds ratio'})`;
    case 'ready':
      return `${e.measure} ${e.effectSize}, variance ${e.variance}`;
  }
}

/** One study of the library: its reference, what the appraisals need, its PDF and where it is used. */
export function StudyDetail({
  studyId,
  viewer,
  fallback,
}: {
  studyId: number;
  viewer: ViewerProps;
  fallback?: StudyDetailDTO;
}) {
  const router = useRouter();
  const { mutate: mutateAll } = useSWRConfig();
  const { data, error, mutate } = useStudy(studyId, fallback);
  const apa = useCitation(studyId, 'apa', Boolean(data));
  const [editing, setEditing] = useState(false);
  const [copied, setCopied] = useState<string | null>(null);
  const [upload, setUpload] = useState<{ fraction: number } | null>(null);
  const [uploadError, setUploadError] = useState<string | null>(null);
  const [uploadDone, setUploadDone] = useState(false);
  const [confirmDelete, setConfirmDelete] = useState(false);
  const [inUse, setInUse] = useState<StudyInUseDTO | null>(null);
  const [deleteError, setDeleteError] = useState<string | null>(null);
  const [deleting, setDeleting] = useState(false);
  const fileInput = useRef<HTMLInputElement>(null);
  const fileId = useId();

  const actor = useMemo(() => ({ userId: viewer.userId, roles: new Map(viewer.roles) }), [viewer]);

  if (error?.status === 404) notFound();
  if (error && !data) {
    return (
      <div role="alert" className="border-danger-100 bg-paper-raised shadow-card space-y-3 rounded-lg border px-6 py-8">
        <h1 className="text-2xl font-semibold">This study could not be loaded</h1>
        <p className="text-ink-muted">{error.message}</p>
        <Button onClick={() => void mutate()}>Try again</Button>
      </div>
    );
  }
  if (!data) {
    return (
      <div className="space-y-4" role="status" aria-label="Loading the study">
        <Skeleton className="h-6 w-40" />
        <Skeleton className="h-10 w-3/4" />
        <Skeleton className="h-32 w-full" />
        <Skeleton className="h-48 w-full" />
      </div>
    );
  }

  const { study, appraisals } = data;
  const canWrite = decide(actor, 'study.write', { teamId: study.teamId }) === 'allow';

  const copyApa = async () => {
    if (!apa.data) return;
    try {
      await navigator.clipboard.writeText(apa.data.text);
      setCopied('Copied the APA reference.');
    } catch {
      setCopied('The browser refused the clipboard; select the reference and copy it by hand.');
    }
  };

  const onFile = async (file: File | undefined) => {
    setUploadError(null);
    setUploadDone(false);
    if (!file) return;
    // Refuse early what the server would refuse anyway, and say why in the same words.
    if (file.size > MAX_PDF_MB * 1024 * 1024) {
      setUploadError(uploadErrorMessage(413, undefined));
      if (fileInput.current) fileInput.current.value = '';
      return;
    }
    setUpload({ fraction: 0 });
    try {
      await uploadPdf(study.id, file, (fraction) => setUpload({ fraction }));
      setUploadDone(true);
      await mutate();
      void mutateAll(isStudiesKey);
    } catch (e) {
      setUploadError(errorMessage(e));
    } finally {
      setUpload(null);
      if (fileInput.current) fileInput.current.value = '';
    }
  };

  const removePdf = async () => {
    setUploadError(null);
    try {
      await apiFetch(keys.studyFile(study.id), { method: 'DELETE' });
      await mutate();
    } catch (e) {
      setUploadError(errorMessage(e));
    }
  };

  const remove = async (force: boolean) => {
    setDeleting(true);
    setDeleteError(null);
    try {
      await apiFetch(`/api/studies/${study.id}${force ? '?force=1' : ''}`, { method: 'DELETE' });
      void mutateAll(isStudiesKey);
      router.push('/library');
    } catch (e) {
      if (e instanceof ApiError && e.status === 409 && typeof e.body.appraisalCount === 'number') {
        setInUse(e.body as unknown as StudyInUseDTO);
      } else {
        setDeleteError(errorMessage(e));
      }
      setDeleting(false);
    }
  };

  return (
    <div className="space-y-6">
      <header className="space-y-3">
        <p className="text-sm">
          <Link href="/library" className="prose-link">
            ← Library
          </Link>
        </p>
        <p className="text-accent-text text-sm font-semibold">{study.citation}</p>
        <h1 className="text-2xl font-semibold sm:text-3xl">{study.title}</h1>
        <NoticeBanner notice={study.notice} />
        <p className="text-ink-muted">
          {[study.journal, study.year].filter(Boolean).join(', ')}
          {study.doi && (
            <>
              {' · '}
              <a href={`https://doi.org/${study.doi}`} className="prose-link" target="_blank" rel="noreferrer noopener">
                doi:{study.doi}
              </a>
            </>
          )}
        </p>
        {study.tags.length > 0 && (
          <p className="flex flex-wrap gap-1.5">
            {study.tags.map((t) => (
              <Badge key={t}>{t}</Badge>
            ))}
          </p>
        )}
      </header>

      <Card aria-labelledby="reference-title">
        <CardHeader id="reference-title" title="Reference" description="APA 7th edition." />
        <CardBody className="space-y-4">
          <div className="pl-8 -indent-8 leading-relaxed" data-testid="apa-reference">
            {apa.data ? (
              <SafeHtml html={apa.data.html} fallback={apa.data.text} />
            ) : apa.error ? (
              <span className="text-danger-700">The reference could not be formatted: {apa.error.message}</span>
            ) : (
              <Skeleton className="h-5 w-full" />
            )}
          </div>
          <div className="flex flex-wrap items-center gap-2">
            <Button variant="secondary" size="sm" onClick={() => void copyApa()} disabled={!apa.data}>
              Copy reference
            </Button>
            {EXPORTS.map((e) => (
              <a
                key={e.format}
                href={`${keys.citation(study.id, e.format)}&download=1`}
                download
                className={buttonClasses('secondary', 'sm')}
              >
                Export {e.label}
              </a>
            ))}
            <span role="status" className="text-ink-muted text-sm">
              {copied}
            </span>
          </div>
        </CardBody>
      </Card>

      <Card aria-labelledby="details-title">
        <CardHeader
          id="details-title"
          title="What the appraisals use"
          description="Certainty starts from the design; applicability compares population and intensity with each review’s protocol."
          actions={
            canWrite && !editing ? (
              <Button variant="secondary" size="sm" onClick={() => setEditing(true)}>
                Edit details
              </Button>
            ) : undefined
          }
        />
        <CardBody>
          {editing ? (
            <StudyMetaForm
              study={study}
              onCancel={() => setEditing(false)}
              onSaved={async (saved) => {
                // Show what was saved at once, then confirm with the server.
                await mutate({ ...data, study: saved }, { revalidate: true });
                setEditing(false);
                // Certainty and applicability of its appraisals changed: refresh any open review.
                void mutateAll(
                  (key) =>
                    typeof key === 'string' && (key.startsWith('/api/studies') || key.startsWith('/api/reviews')),
                );
              }}
            />
          ) : (
            <dl className="grid gap-x-6 gap-y-3 text-sm sm:grid-cols-[auto_1fr]">
              <dt className="font-semibold">Design</dt>
              <dd>
                {study.design ? (
                  DESIGN_LABEL[study.design]
                ) : (
                  <span className="text-warning-800">Not recorded — appraisals cannot grade certainty without it</span>
                )}
              </dd>
              <dt className="font-semibold">Participants</dt>
              <dd>
                {[
                  study.population ? TRAINING_STATUS_LABEL[study.population] : 'training status not recorded',
                  study.injured ? 'injured' : 'healthy',
                  study.n ? `n = ${study.n}` : null,
                ]
                  .filter(Boolean)
                  .join(', ')}
              </dd>
              <dt className="font-semibold">Intensity</dt>
              <dd>{study.intensity != null ? `${percent(study.intensity)} of maximum` : 'Not recorded'}</dd>
              <dt className="font-semibold">Duration</dt>
              <dd>{study.durationWeeks != null ? `${study.durationWeeks} weeks` : 'Not recorded'}</dd>
              <dt className="font-semibold">Outcome</dt>
              <dd>{study.outcome ?? 'Not recorded'}</dd>
              <dt className="font-semibold">Effect data</dt>
              <dd>{describeEffect(study)}</dd>
            </dl>
          )}
        </CardBody>
      </Card>

      <Card aria-labelledby="pdf-title">
        <CardHeader
          id="pdf-title"
          title="PDF"
          description={`One PDF per study, up to ${MAX_PDF_MB} MB; only your team can download it.`}
        />
        <CardBody className="space-y-3">
          {study.hasPdf ? (
            <div className="flex flex-wrap items-center gap-2">
              <a href={keys.studyFile(study.id)} className={buttonClasses('primary', 'sm')} data-testid="pdf-download">
                Download PDF
              </a>
              {canWrite && (
                <Button variant="ghost" size="sm" onClick={() => void removePdf()}>
                  Remove PDF
                </Button>
              )}
            </div>
          ) : (
            <p className="text-ink-muted text-sm">No PDF uploaded yet.</p>
          )}
          {canWrite && (
            <div className="space-y-1.5">
              <label htmlFor={fileId} className="block text-sm font-semibold">
                {study.hasPdf ? 'Replace the PDF' : 'Upload a PDF'}
              </label>
              <input
                ref={fileInput}
                id={fileId}
                name="file"
                type="file"
                accept="application/pdf,.pdf"
                disabled={upload !== null}
                onChange={(e) => void onFile(e.target.files?.[0])}
                className="file:border-line-strong file:bg-paper-raised file:text-ink hover:file:bg-chalk-50 block w-full text-sm file:mr-3 file:min-h-10 file:rounded-md file:border file:px-3 file:font-semibold"
              />
            </div>
          )}
          {upload && (
            <div className="flex items-center gap-3 text-sm" role="status">
              <Spinner />
              <progress
                max={1}
                value={upload.fraction}
                className="accent-granite-700 h-2 flex-1"
                aria-label="Upload progress"
              />
              <span className="tabular-nums">{Math.round(upload.fraction * 100)} %</span>
            </div>
          )}
          {uploadError && (
            <p
              role="alert"
              className="border-danger-100 bg-danger-50 text-danger-800 rounded-md border px-3 py-2 text-sm"
              data-testid="upload-error"
            >
              {uploadError} Nothing was stored.
            </p>
          )}
          {uploadDone && (
            <p role="status" className="text-success-800 text-sm">
              The PDF is stored.
            </p>
          )}
        </CardBody>
      </Card>

      <Card aria-labelledby="appraisals-title">
        <CardHeader
          id="appraisals-title"
          title="Appraisals across reviews"
          description="Where the team has weighed this study."
        />
        <CardBody>
          {appraisals.length === 0 ? (
            <p className="text-ink-muted text-sm">
              No review appraises this study yet. Open a review and choose “Appraise a study”.
            </p>
          ) : (
            <div className="relative -mx-5 overflow-x-auto px-5">
              <table className="w-full min-w-[36rem] text-sm">
                <caption className="sr-only">Appraisals of this study</caption>
                <thead>
                  <tr className="border-line-strong text-ink-muted border-b text-left text-xs tracking-wide uppercase">
                    <th scope="col" className="py-2 pr-3">
                      Review
                    </th>
                    <th scope="col" className="py-2 pr-3">
                      Tests
                    </th>
                    <th scope="col" className="py-2 pr-3">
                      Direction
                    </th>
                    <th scope="col" className="py-2 pr-3">
                      Certainty
                    </th>
                    <th scope="col" className="py-2 text-right">
                      Applicability
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {appraisals.map((a) => (
                    <tr key={a.id} className="border-line border-b last:border-b-0">
                      <th scope="row" className="py-2.5 pr-3 text-left font-normal">
                        <Link href={`/reviews/${a.reviewId}`} className="text-brand font-semibold hover:underline">
                          {a.reviewTitle}
                        </Link>
                      </th>
                      <td className="py-2.5 pr-3">{a.mechanismName ?? 'The claimed outcome'}</td>
                      <td className="py-2.5 pr-3">{DIRECTION_LABEL[a.direction]}</td>
                      <td className="py-2.5 pr-3">{CERTAINTY_LABEL[a.certainty]}</td>
                      <td className="py-2.5 text-right tabular-nums">{percent(a.applicability)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
        </CardBody>
      </Card>

      {canWrite && (
        <div className="flex justify-end">
          <Button variant="danger" size="sm" onClick={() => setConfirmDelete(true)}>
            Delete study
          </Button>
        </div>
      )}

      <Dialog
        open={confirmDelete}
        onClose={() => {
          setConfirmDelete(false);
          setInUse(null);
          setDeleteError(null);
        }}
        title="Delete this study from the library?"
      >
        <div className="space-y-4">
          {inUse ? (
            <>
              <p className="text-danger-800">{inUse.error}</p>
              <ul className="list-disc pl-5 text-sm">
                {inUse.reviews.map((r) => (
                  <li key={r.id}>
                    <Link href={`/reviews/${r.id}`} className="prose-link">
                      {r.title}
                    </Link>
                  </li>
                ))}
              </ul>
            </>
          ) : (
            <p>
              “{study.title}” will be removed from the library{study.hasPdf ? ' with its PDF' : ''}.
            </p>
          )}
          {deleteError && (
            <p role="alert" className="bg-danger-50 text-danger-800 rounded-md px-3 py-2 text-sm">
              {deleteError}
            </p>
          )}
          <div className="flex flex-wrap gap-2">
            {inUse ? (
              <Button variant="danger" onClick={() => void remove(true)} disabled={deleting}>
                {deleting && <Spinner />}
                Delete it with its {inUse.appraisalCount} appraisal{inUse.appraisalCount === 1 ? '' : 's'}
              </Button>
            ) : (
              <Button variant="danger" onClick={() => void remove(false)} disabled={deleting}>
                {deleting && <Spinner />}
                Yes, delete the study
              </Button>
            )}
            <Button variant="secondary" onClick={() => setConfirmDelete(false)} disabled={deleting}>
              Keep it
            </Button>
          </div>
        </div>
      </Dialog>
    </div>
  );
}
