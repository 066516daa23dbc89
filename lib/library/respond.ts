import { errorResponse } from '@/lib/api/respond';
import type { ImportProgress, ImportResult } from './import';

/**
 * The answer to an import: one JSON document by default, or — when the client sends
 * `Accept: application/x-ndjson` — a stream of JSON lines so the library page can show progress
 * on a 2,000-entry file: `{"type":"progress","phase":…,"done":…,"total":…}` lines, then one
 * `{"type":"result","results":[…],"studies":[…]}` line, or `{"type":"error","status":…,"error":…}`
 * if the import fails after the stream started (the status line is already sent by then).
 */
export async function importResponse(
  req: Request,
  run: (onProgress: (progress: ImportProgress) => void) => Promise<ImportResult>,
): Promise<Response> {
  const status = (result: ImportResult) => (result.results.some((r) => r.status === 'added') ? 201 : 200);
  if (!(req.headers.get('accept') ?? '').includes('application/x-ndjson')) {
    const result = await run(() => {});
    return Response.json({ results: result.results, studies: result.studies }, { status: status(result) });
  }
  const encoder = new TextEncoder();
  const stream = new ReadableStream<Uint8Array>({
    async start(controller) {
      const send = (line: object) => controller.enqueue(encoder.encode(`${JSON.stringify(line)}\n`));
      let last = 0;
      try {
        const result = await run((progress) => {
          // At most a few lines a second: enough for a progress bar, little for the wire.
          const now = Date.now();
          if (progress.phase === 'done' || now - last >= 100 || progress.done === progress.total) {
            last = now;
            send({ type: 'progress', ...progress });
          }
        });
        send({ type: 'result', results: result.results, studies: result.studies });
      } catch (error) {
        const response = errorResponse(error);
        const body = (await response.json()) as { error: string };
        send({ type: 'error', status: response.status, error: body.error });
      }
      controller.close();
    },
  });
  return new Response(stream, {
    status: 200,
    headers: { 'content-type': 'application/x-ndjson; charset=utf-8', 'cache-control': 'no-store' },
  });
}
