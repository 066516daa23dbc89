import { AppError, badRequest } from '@/lib/api/errors';

/**
 * Reading a multipart upload without trusting the client about its size: the declared
 * Content-Length is checked first (so an oversized upload is refused before a byte is read),
 * and the body is then read with a running count that stops at the limit (so a client that
 * sends no length, or lies about it, cannot make the server buffer more than the limit).
 */

/** Room for the multipart boundaries and the other form fields around the file. */
const MULTIPART_OVERHEAD = 64 * 1024;

export const tooLarge = (message: string) => new AppError('too_large', message);

export async function readLimitedFormData(req: Request, fileLimitBytes: number, what: string): Promise<FormData> {
  const type = req.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data\s*;/i.test(type)) {
    throw new AppError('unsupported_media_type', `Send the ${what} as multipart/form-data.`);
  }
  const limit = fileLimitBytes + MULTIPART_OVERHEAD;
  const declared = Number(req.headers.get('content-length'));
  if (Number.isFinite(declared) && declared > limit)
    throw tooLarge(`The ${what} is over ${fileLimitBytes / (1024 * 1024)} MB.`);
  if (!req.body) throw badRequest(`Attach the ${what}.`, [{ path: 'file', message: 'No file was sent.' }]);

  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let received = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    received += value.byteLength;
    if (received > limit) {
      await reader.cancel();
      throw tooLarge(`The ${what} is over ${fileLimitBytes / (1024 * 1024)} MB.`);
    }
    chunks.push(value);
  }
  const body = new Blob(chunks as BlobPart[]);
  try {
    return await new Response(body, { headers: { 'content-type': type } }).formData();
  } catch {
    throw badRequest('The upload is not a readable multipart form.', [
      { path: '', message: 'Malformed multipart body.' },
    ]);
  }
}

/** The form's `file` field as a File, or a 400 naming the field. */
export function fileField(form: FormData, what: string): File {
  const file = form.get('file');
  if (!(file instanceof File))
    throw badRequest(`Attach the ${what} as the "file" field.`, [{ path: 'file', message: 'Required.' }]);
  return file;
}
