import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import * as file from '@/app/api/studies/[id]/file/route';
import * as one from '@/app/api/studies/[id]/route';
import * as studies from '@/app/api/studies/route';
import { Study } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam, sendForm, snapshot, useDoiFakeAndStorage, type TeamFixture } from '../reviews/helpers';

useTestApp();
const env = useDoiFakeAndStorage();
let t: TeamFixture;
let studyId: number;
const fixture = (name: string) =>
  new Uint8Array(readFileSync(path.resolve(__dirname, '../../../fixtures/files', name)));
const storedFiles = (): string[] => {
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      if (entry.isDirectory()) walk(path.join(dir, entry.name));
      else out.push(path.join(dir, entry.name));
    }
  };
  walk(env.storageDir());
  return out;
};
const params = () => ({ id: String(studyId) });

beforeAll(async () => {
  t = await makeTeam('fi');
  studyId = (await t.coach.call(studies.POST, { json: { teamId: t.teamId, title: 'A study with a PDF', year: 2022 } }))
    .body.studies[0].id;
});

describe('POST /api/studies/:id/file — the study’s PDF', () => {
  it('refuses a file named .pdf that is not one (415) and stores nothing', async () => {
    const before = await snapshot();
    const res = await sendForm(t.coach, file.POST, {
      params: params(),
      file: { name: 'paper.pdf', type: 'application/pdf', bytes: fixture('not-a-pdf.pdf') },
    });
    expect(res.status).toBe(415);
    expect(res.body.error).toMatch(/not a PDF/);
    expect(storedFiles()).toEqual([]);
    expect(await snapshot()).toEqual(before);
  });

  it('refuses more than 20 MB (413) — declared, or streamed without a length — and stores nothing', async () => {
    const before = await snapshot();
    const big = new Uint8Array(20 * 1024 * 1024 + 1);
    big.set(fixture('tiny.pdf'));
    const declared = await sendForm(t.coach, file.POST, {
      params: params(),
      file: { name: 'big.pdf', type: 'application/pdf', bytes: big },
    });
    expect(declared.status).toBe(413);
    // No Content-Length: a chunked body of 21 MB; the reader stops at the limit.
    const form = new FormData();
    form.set(
      'file',
      new File([big as BlobPart, new Uint8Array(1024 * 1024) as BlobPart], 'big.pdf', { type: 'application/pdf' }),
    );
    const encoded = new Request('http://app.test/', { method: 'POST', body: form });
    const stream = encoded.body!;
    const streamed = await sendForm(t.coach, file.POST, {
      params: params(),
      body: stream,
      headers: { 'content-type': encoded.headers.get('content-type')! },
    });
    expect(streamed.status).toBe(413);
    expect(storedFiles()).toEqual([]);
    expect(await snapshot()).toEqual(before);
  });

  it('stops reading at the limit: an upload that never ends is refused with 413, not buffered', async () => {
    const boundary = 'endless-boundary';
    let sent = 0;
    const chunk = new Uint8Array(1024 * 1024).fill(0x41);
    const endless = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(
          new TextEncoder().encode(
            `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="x.pdf"\r\nContent-Type: application/pdf\r\n\r\n%PDF-`,
          ),
        );
      },
      pull(controller) {
        sent += chunk.byteLength;
        controller.enqueue(chunk);
      },
    });
    const res = await sendForm(t.coach, file.POST, {
      params: params(),
      body: endless,
      headers: { 'content-type': `multipart/form-data; boundary=${boundary}` },
    });
    expect(res.status).toBe(413);
    // It read a little past 20 MB and stopped (the stream would have gone on for ever).
    expect(sent).toBeLessThan(25 * 1024 * 1024);
    expect(storedFiles()).toEqual([]);
  });

  it('refuses a request without a file (400) or not sent as multipart (415)', async () => {
    expect((await sendForm(t.coach, file.POST, { params: params(), fields: { note: 'no file' } })).status).toBe(400);
    expect((await t.coach.call(file.POST, { params: params(), json: { file: 'JVBERi0=' } })).status).toBe(415);
  });

  it('is for owners and coaches of the team; outsiders get 404', async () => {
    const form = { params: params(), file: { name: 'tiny.pdf', type: 'application/pdf', bytes: fixture('tiny.pdf') } };
    expect((await sendForm(t.reviewer, file.POST, form)).status).toBe(403);
    expect((await sendForm(t.athlete, file.POST, form)).status).toBe(403);
    expect((await sendForm(t.outsider, file.POST, form)).status).toBe(404);
    expect((await sendForm(t.anonymous, file.POST, form)).status).toBe(401);
    expect(storedFiles()).toEqual([]);
  });

  it('stores a real PDF (checked by its %PDF- header), and team staff download the same bytes', async () => {
    const tiny = fixture('tiny.pdf');
    const res = await sendForm(t.coach, file.POST, {
      params: params(),
      file: { name: 'whatever-name.bin', type: 'application/octet-stream', bytes: tiny },
    });
    expect(res.status).toBe(200);
    expect(res.body.study).toMatchObject({ id: studyId, hasPdf: true });
    expect(storedFiles()).toHaveLength(1);
    // The storage key is ours, not the uploaded name.
    expect(path.basename(storedFiles()[0])).toMatch(new RegExp(`^${studyId}-[0-9a-f]{16}\\.pdf$`));

    const req = new Request('http://app.test/x', { headers: { cookie: t.reviewer.cookie } });
    const download = await file.GET(req, { params: Promise.resolve(params()) });
    expect(download.status).toBe(200);
    expect(download.headers.get('content-type')).toBe('application/pdf');
    expect(download.headers.get('cache-control')).toBe('private, no-store');
    expect(new Uint8Array(await download.arrayBuffer())).toEqual(tiny);
  });

  it('keeps downloads to team staff: athletes 403, outsiders 404, signed out 401', async () => {
    expect((await t.athlete.call(file.GET, { params: params() })).status).toBe(403);
    expect((await t.outsider.call(file.GET, { params: params() })).status).toBe(404);
    expect((await t.anonymous.call(file.GET, { params: params() })).status).toBe(401);
  });

  it('replaces the PDF on a second upload and removes the old file', async () => {
    const first = storedFiles();
    await sendForm(t.owner, file.POST, {
      params: params(),
      file: { name: 'v2.pdf', type: 'application/pdf', bytes: fixture('tiny.pdf') },
    });
    const second = storedFiles();
    expect(second).toHaveLength(1);
    expect(second).not.toEqual(first);
  });

  it('removes the file with DELETE, and with the study', async () => {
    const res = await t.coach.call(file.DELETE, { method: 'DELETE', params: params() });
    expect(res.body.study.hasPdf).toBe(false);
    expect(storedFiles()).toEqual([]);
    expect((await t.coach.call(file.GET, { params: params() })).status).toBe(404);
    await sendForm(t.coach, file.POST, {
      params: params(),
      file: { name: 'tiny.pdf', type: 'application/pdf', bytes: fixture('tiny.pdf') },
    });
    expect(storedFiles()).toHaveLength(1);
    await t.coach.call(one.DELETE, { method: 'DELETE', params: params() });
    expect(await Study.count({ where: { id: studyId } })).toBe(0);
    expect(storedFiles()).toEqual([]);
  });
});
