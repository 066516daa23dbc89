import { z } from 'zod';
import { route } from '@/lib/auth/handler';
import { notFound } from '@/lib/api/errors';
import { env } from '@/lib/env';
import { publicFeed } from '@/lib/publishing/queries';

const query = z.object({
  team: z
    .string()
    .regex(/^[a-z0-9-]{1,140}$/, { error: 'Not a team address.' })
    .optional(),
});

const xml = (s: string) =>
  s.replace(/[<>&'"]/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', "'": '&apos;', '"': '&quot;' })[c]!);

// GET /feed.xml[?team=<slug>] — Atom feed of public, not withdrawn verdicts (RFC 4287), newest first.
export const GET = route({ query, auth: 'optional' }, async ({ query }) => {
  const feed = await publicFeed(query.team);
  if (!feed) throw notFound('That team');
  const base = env().APP_URL;
  const self = `${base}/feed.xml${query.team ? `?team=${query.team}` : ''}`;
  const updated = feed.entries[0]?.item.publishedAt ?? new Date(0).toISOString();
  const entries = feed.entries
    .map(({ item, snapshot }) => {
      const url = `${base}/v/${item.slug}`;
      return `  <entry>
    <id>${xml(`${url}#v${item.version}`)}</id>
    <title>${xml(`${item.verdictLabel}: ${item.claim}`)}</title>
    <link rel="alternate" type="text/html" href="${xml(url)}"/>
    <updated>${item.publishedAt}</updated>
    <author><name>${xml(snapshot.authors.join(', '))}</name></author>
    <summary>${xml(`${snapshot.verdict.summary} Education, not a diagnosis or treatment plan: stop on pain and see a licensed clinician.`)}</summary>
    ${snapshot.tags.map((t) => `<category term="${xml(t)}"/>`).join('')}
  </entry>`;
    })
    .join('\n');
  const title = feed.team
    ? `${feed.team.name}: verdicts on training claims`
    : 'Loadbearing: verdicts on training claims';
  const body = `<?xml version="1.0" encoding="utf-8"?>
<feed xmlns="http://www.w3.org/2005/Atom">
  <id>${xml(self)}</id>
  <title>${xml(title)}</title>
  <link rel="self" type="application/atom+xml" href="${xml(self)}"/>
  <link rel="alternate" type="text/html" href="${xml(base)}"/>
  <updated>${updated}</updated>
${entries}
</feed>
`;
  return new Response(body, { headers: { 'content-type': 'application/atom+xml; charset=utf-8' } });
});
