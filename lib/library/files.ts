import { randomBytes } from 'node:crypto';
import { AppError, notFound } from '@/lib/api/errors';
import { recordEvent } from '@/lib/audit/record';
import { storage } from '@/lib/storage';
import type { StudyDTO } from '@/lib/reviews/types';
import { writeTransaction } from '@/lib/reviews/transaction';
import { Study } from '@/models';
import { toStudyDTO } from './dto';
import { appraisalCounts } from './studies';
import { tooLarge } from './upload';

/**
 * A study's PDF: checked by its content, not its name, and kept through lib/storage.
 *
 * A PDF file begins with the header "%PDF-" followed by the version (ISO 32000-1:2008, §7.5.2
 * "File header"), so the first five bytes decide; a file named .pdf that starts otherwise is
 * refused with 415 and nothing is stored.
 */

export const MAX_PDF_BYTES = 20 * 1024 * 1024;
const PDF_MAGIC = [0x25, 0x50, 0x44, 0x46, 0x2d]; // "%PDF-"

export function isPdf(bytes: Uint8Array): boolean {
  return bytes.length >= PDF_MAGIC.length && PDF_MAGIC.every((b, i) => bytes[i] === b);
}

/** Stores the PDF and points the study at it; the previous file, if any, is removed afterwards. */
export async function attachPdf(study: Study, userId: number, file: File): Promise<StudyDTO> {
  if (file.size > MAX_PDF_BYTES) throw tooLarge('The PDF is over 20 MB.');
  const bytes = new Uint8Array(await file.arrayBuffer());
  if (bytes.length > MAX_PDF_BYTES) throw tooLarge('The PDF is over 20 MB.');
  if (!isPdf(bytes))
    throw new AppError('unsupported_media_type', 'That file is not a PDF (it does not start with %PDF-).');
  const key = `studies/${study.teamId}/${study.id}-${randomBytes(8).toString('hex')}.pdf`;
  await storage().put(key, bytes);
  let previous: string | null;
  try {
    // The key replaced is the one stored now, read in the write transaction: of two uploads at
    // once, the second replaces (and deletes) the first's file instead of leaving it orphaned.
    previous = await writeTransaction(async (transaction) => {
      const current = await Study.findByPk(study.id, { attributes: ['id', 'pdfKey'], transaction });
      await Study.update({ pdfKey: key }, { where: { id: study.id }, transaction });
      await recordEvent(
        {
          teamId: study.teamId,
          actorId: userId,
          action: 'study.pdf_uploaded',
          subjectType: 'study',
          subjectId: study.id,
          data: { bytes: bytes.length },
        },
        transaction,
      );
      return current?.pdfKey ?? null;
    });
    study.pdfKey = key;
  } catch (error) {
    await storage().delete(key);
    throw error;
  }
  if (previous) await storage().delete(previous);
  const count = (await appraisalCounts([study.id])).get(study.id);
  return toStudyDTO(study, count);
}

/** The stored PDF as a download response. */
export async function pdfResponse(study: Study): Promise<Response> {
  const file = study.pdfKey ? await storage().get(study.pdfKey) : null;
  if (!file) throw notFound('The PDF of this study');
  const name = `${study.citation.replace(/[^A-Za-z0-9 ,.&-]+/g, '').trim() || `study-${study.id}`}.pdf`;
  return new Response(file.stream, {
    headers: {
      'content-type': 'application/pdf',
      'content-length': String(file.size),
      'content-disposition': `inline; filename="${name.replace(/"/g, '')}"`,
      // Team-only content: never kept by a shared cache.
      'cache-control': 'private, no-store',
      'x-content-type-options': 'nosniff',
    },
  });
}

export async function removePdf(study: Study, userId: number): Promise<StudyDTO> {
  if (!study.pdfKey) throw notFound('The PDF of this study');
  const key = study.pdfKey;
  await study.update({ pdfKey: null });
  await storage().delete(key);
  await recordEvent({
    teamId: study.teamId,
    actorId: userId,
    action: 'study.pdf_removed',
    subjectType: 'study',
    subjectId: study.id,
  });
  const count = (await appraisalCounts([study.id])).get(study.id);
  return toStudyDTO(study, count);
}
