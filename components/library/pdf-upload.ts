import type { StudyDTO } from '@/lib/reviews/types';
import { ApiError } from '@/lib/swr/fetcher';

export const MAX_PDF_MB = 20;

/** What a coach reads for each refusal of the upload route. */
export function uploadErrorMessage(status: number, serverMessage: string | undefined): string {
  if (status === 413)
    return `That file is larger than ${MAX_PDF_MB} MB. Compress the PDF or upload the article without supplements.`;
  if (status === 415)
    return 'That file is not a PDF. We check the file’s content, not its name; export or print it to PDF and try again.';
  if (status === 0) return 'The upload did not reach the server. Check your connection and try again.';
  return serverMessage ?? `The upload failed (${status}).`;
}

/**
 * POST /api/studies/:id/file through XMLHttpRequest rather than fetch: only XHR reports upload
 * progress, and a 20 MB PDF on a gym's wifi takes long enough to need a bar.
 */
export function uploadPdf(studyId: number, file: File, onProgress: (fraction: number) => void): Promise<StudyDTO> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/studies/${studyId}/file`);
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      let body: Record<string, unknown> = {};
      try {
        body = JSON.parse(xhr.responseText) as Record<string, unknown>;
      } catch {
        /* an HTML error page or nothing: the status decides */
      }
      if (xhr.status >= 200 && xhr.status < 300) resolve(body.study as StudyDTO);
      else reject(new ApiError(xhr.status, uploadErrorMessage(xhr.status, body.error as string | undefined), [], body));
    };
    xhr.onerror = () => reject(new ApiError(0, uploadErrorMessage(0, undefined)));
    const form = new FormData();
    form.set('file', file);
    xhr.send(form);
  });
}
