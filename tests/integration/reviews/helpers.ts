import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll } from 'vitest';
import { startFakeDoiServer, type FakeDoiServer } from '@/lib/citations/fake-doi-server';
import { db } from '@/lib/db';
import { Membership } from '@/models';
import type { Role } from '@/models/roles';
import { Client, signUpConfirmed, type CallResult } from '../../helpers/app';

/**
 * Shared set-up of the workbench's integration tests: a team with one person in every role, an
 * outsider who owns another team, the DOI fake, a private upload folder, and a snapshot of every
 * workbench table to prove a refused request changed nothing.
 */

export interface TeamFixture {
  teamId: number;
  otherTeamId: number;
  userIds: Record<string, number>;
  owner: Client;
  coach: Client;
  /** A second coach: not the author of the first coach's reviews. */
  coach2: Client;
  reviewer: Client;
  athlete: Client;
  /** Owner of another team, member of nothing here. */
  outsider: Client;
  anonymous: Client;
}

let addressCounter = 0;
const nextAddress = () => `10.77.${Math.floor(addressCounter / 250)}.${(addressCounter++ % 250) + 1}`;

async function person(tag: string, name: string): Promise<{ client: Client; userId: number; teamId: number }> {
  const client = new Client(nextAddress());
  const res = await signUpConfirmed(client, {
    name,
    email: `${name.toLowerCase().replace(/\W+/g, '.')}.${tag}@example.test`,
    password: 'long-enough-pass-1',
    teamName: `${name} ${tag}`,
  });
  if (res.status !== 201) throw new Error(`sign-up failed: ${JSON.stringify(res.body)}`);
  return { client, userId: res.body.user.id, teamId: res.body.team.id };
}

export async function makeTeam(tag: string): Promise<TeamFixture> {
  const owner = await person(tag, 'Runa Ostby');
  const members: [string, Role][] = [
    ['Cato Brill', 'coach'],
    ['Dagny Fell', 'coach'],
    ['Oswin Sorrel', 'reviewer'],
    ['Fenna Lark', 'athlete'],
  ];
  const joined = [];
  for (const [name, role] of members) {
    const p = await person(tag, name);
    await Membership.create({ teamId: owner.teamId, userId: p.userId, role });
    joined.push(p);
  }
  const outsider = await person(tag, 'Gert Wold');
  return {
    teamId: owner.teamId,
    otherTeamId: outsider.teamId,
    userIds: {
      owner: owner.userId,
      coach: joined[0].userId,
      coach2: joined[1].userId,
      reviewer: joined[2].userId,
      athlete: joined[3].userId,
      outsider: outsider.userId,
    },
    owner: owner.client,
    coach: joined[0].client,
    coach2: joined[1].client,
    reviewer: joined[2].client,
    athlete: joined[3].client,
    outsider: outsider.client,
    anonymous: new Client(nextAddress()),
  };
}

/** Starts the DOI fake for this file and points DOI_BASE_URL at it; gives each file its own upload folder. */
export function useDoiFakeAndStorage(): { doi: () => FakeDoiServer; storageDir: () => string } {
  let server: FakeDoiServer;
  const dir = mkdtempSync(path.join(tmpdir(), 'loadbearing-uploads-'));
  beforeAll(async () => {
    server = await startFakeDoiServer();
    process.env.DOI_BASE_URL = server.url;
    process.env.STORAGE_DIR = dir;
  });
  afterAll(async () => {
    await server?.close();
  });
  return { doi: () => server, storageDir: () => dir };
}

/** Every row of the workbench's tables (and the audit log's size): equal snapshots mean nothing changed. */
export async function snapshot(): Promise<Record<string, unknown>> {
  const out: Record<string, unknown> = {};
  for (const table of ['reviews', 'mechanisms', 'studies', 'appraisals']) {
    const [rows] = await db().query(`SELECT * FROM ${table} ORDER BY id`);
    out[table] = rows;
  }
  const [[audit]] = (await db().query('SELECT COUNT(*) AS n FROM audit_events')) as [{ n: number }[], unknown];
  out.audit = audit.n;
  return out;
}

// Plain data without vitest, shared with the several-processes test and the benchmarks.
export { newReview, protocol } from '../../helpers/review-input';

type Handler = Parameters<Client['call']>[0];

/** A multipart request (FormData) through a route handler, with the client's session cookie. */
export async function sendForm(
  client: Client,
  handler: Handler,
  opts: {
    params?: Record<string, string>;
    fields?: Record<string, string>;
    file?: { name: string; type: string; bytes: Uint8Array };
    headers?: Record<string, string>;
    body?: BodyInit;
    method?: string;
  },
): Promise<CallResult & { raw: Response }> {
  const headers = new Headers(opts.headers);
  if (client.cookie) headers.set('cookie', client.cookie);
  headers.set('x-forwarded-for', client.address);
  let body: BodyInit | undefined = opts.body;
  if (!body) {
    const form = new FormData();
    for (const [k, v] of Object.entries(opts.fields ?? {})) form.set(k, v);
    if (opts.file) form.set('file', new File([opts.file.bytes as BlobPart], opts.file.name, { type: opts.file.type }));
    // Encode it the way a browser would, so Content-Type carries the boundary and the length is known.
    const encoded = new Request('http://app.test/', { method: 'POST', body: form });
    headers.set('content-type', encoded.headers.get('content-type')!);
    const bytes = new Uint8Array(await encoded.arrayBuffer());
    if (!headers.has('content-length')) headers.set('content-length', String(bytes.byteLength));
    body = bytes;
  }
  const req = new Request('http://app.test/api/upload', {
    method: opts.method ?? 'POST',
    headers,
    body,
    duplex: 'half',
  } as RequestInit);
  const res = await handler(req, { params: Promise.resolve(opts.params ?? {}) });
  const raw = res.clone();
  const text = await res.text();
  let parsed: unknown = null;
  try {
    parsed = text ? JSON.parse(text) : null;
  } catch {
    parsed = text;
  }
  return { status: res.status, headers: res.headers, body: parsed, raw };
}
