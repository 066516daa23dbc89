import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import S3rver from 's3rver';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as file from '@/app/api/studies/[id]/file/route';
import * as studies from '@/app/api/studies/route';
import { storage } from '@/lib/storage';
import { S3Storage } from '@/lib/storage/s3';
import { useTestApp } from '../../helpers/app';
import { freePort } from '../../helpers/pg-cluster';
import { makeTeam, sendForm, type TeamFixture } from '../reviews/helpers';

// PDFs in an S3-compatible object store (S3_BUCKET set), against the S3 fake npm `s3rver`:
// the same limits and refusals as on the local disk, and nothing stored on a refusal.
useTestApp();
const BUCKET = 'loadbearing-test';
let fake: S3rver;
let endpoint: string;
let t: TeamFixture;
let studyId: number;
const fixture = (name: string) =>
  new Uint8Array(readFileSync(path.resolve(__dirname, '../../../fixtures/files', name)));

async function storedKeys(): Promise<string[]> {
  const client = new S3Client({
    endpoint,
    region: 'us-east-1',
    forcePathStyle: true,
    credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
  });
  const listed = await client.send(new ListObjectsV2Command({ Bucket: BUCKET }));
  return (listed.Contents ?? []).map((o) => o.Key!).sort();
}

beforeAll(async () => {
  const port = await freePort();
  endpoint = `http://127.0.0.1:${port}`;
  fake = new S3rver({
    port,
    address: '127.0.0.1',
    silent: true,
    directory: mkdtempSync(path.join(tmpdir(), 'loadbearing-s3-')),
    configureBuckets: [{ name: BUCKET, configs: [] }],
  });
  await fake.run();
  Object.assign(process.env, {
    S3_BUCKET: BUCKET,
    S3_ENDPOINT: endpoint,
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
  });
  t = await makeTeam('s3');
  studyId = (await t.coach.call(studies.POST, { json: { teamId: t.teamId, title: 'A study in the bucket', year: 2023 } }))
    .body.studies[0].id;
});

afterAll(async () => {
  delete process.env.S3_BUCKET;
  await fake?.close();
});

describe('the object store driver', () => {
  it('is the driver when S3_BUCKET is set, and keeps the storage contract', async () => {
    const driver = storage();
    expect(driver).toBeInstanceOf(S3Storage);
    expect(await driver.get('studies/none.pdf')).toBeNull();
    expect(await driver.exists('studies/none.pdf')).toBe(false);
    await driver.delete('studies/none.pdf'); // a missing key is not an error
    await driver.put('probe/a.bin', new Uint8Array([1, 2, 3]));
    expect(await driver.exists('probe/a.bin')).toBe(true);
    const got = await driver.get('probe/a.bin');
    expect(got?.size).toBe(3);
    expect(new Uint8Array(await new Response(got!.stream).arrayBuffer())).toEqual(new Uint8Array([1, 2, 3]));
    await driver.delete('probe/a.bin');
    expect(await storedKeys()).toEqual([]);
    await expect(driver.put('../escape', new Uint8Array())).rejects.toThrow(/Invalid storage key/);
  });
});

describe('POST /api/studies/:id/file with the object store', () => {
  const params = () => ({ id: String(studyId) });

  it('refuses a file that is not a PDF (415) and an oversized one (413), storing nothing', async () => {
    const notPdf = await sendForm(t.coach, file.POST, {
      params: params(),
      file: { name: 'paper.pdf', type: 'application/pdf', bytes: fixture('not-a-pdf.pdf') },
    });
    expect(notPdf.status).toBe(415);
    const big = await sendForm(t.coach, file.POST, {
      params: params(),
      file: { name: 'big.pdf', type: 'application/pdf', bytes: new Uint8Array(21 * 1024 * 1024) },
    });
    expect(big.status).toBe(413);
    expect(await storedKeys()).toEqual([]);
  });

  it('stores a PDF in the bucket, serves the same bytes, and a second upload replaces it', async () => {
    const tiny = fixture('tiny.pdf');
    const form = { params: params(), file: { name: 'tiny.pdf', type: 'application/pdf', bytes: tiny } };
    expect((await sendForm(t.coach, file.POST, form)).status).toBe(200);
    const [first] = await storedKeys();
    expect(first).toMatch(new RegExp(`${studyId}-[0-9a-f]{16}\\.pdf$`));
    const download = await file.GET(new Request('http://app.test/x', { headers: { cookie: t.reviewer.cookie } }), {
      params: Promise.resolve(params()),
    });
    expect(download.status).toBe(200);
    expect(new Uint8Array(await download.arrayBuffer())).toEqual(tiny);

    expect((await sendForm(t.coach, file.POST, form)).status).toBe(200);
    const keys = await storedKeys();
    expect(keys).toHaveLength(1);
    expect(keys[0]).not.toBe(first);
  });
});
