import * as one from '@/app/api/reviews/[id]/route';
import * as mechanisms from '@/app/api/reviews/[id]/mechanisms/route';
import * as reviews from '@/app/api/reviews/route';
import { Review } from '@/models';
import type { Client } from '../../helpers/app';
import { newReview } from '../reviews/helpers';

/**
 * A review ready to publish, made through the workbench's own routes: a claim, two mechanisms,
 * a body with a mechanism block, a hostile-looking paragraph, and recommendations. Its status is
 * set to `approved` directly: closing a peer-review round is another module's job.
 */
export async function readyReview(
  author: Client,
  teamId: number,
  opts: { claim?: string; title?: string; tags?: string[]; approved?: boolean } = {},
): Promise<{ id: number; version: number }> {
  const created = await author.call(reviews.POST, {
    json: newReview(teamId, {
      claim: opts.claim ?? 'Light daily hangs make fingers stronger in eight weeks.',
      ...(opts.title ? { title: opts.title } : {}),
      tags: opts.tags ?? ['fingers', 'hangboard'],
    }),
  });
  if (created.status !== 201) throw new Error(`create failed: ${JSON.stringify(created.body)}`);
  const id = created.body.review.id as number;
  const params = { id: String(id) };
  const m1 = await author.call(mechanisms.POST, {
    params,
    json: {
      name: 'Tendon stiffness',
      kind: 'physiological',
      summary: 'Stiffer finger flexor tendons.',
      stated: true,
      prior: 0.4,
      minIntensity: 0.85,
      minEffort: 'hard',
    },
  });
  await author.call(mechanisms.POST, {
    params,
    json: {
      name: 'Neural drive',
      kind: 'physiological',
      summary: 'Better recruitment of the forearm flexors.',
      prior: 0.5,
    },
  });
  const patched = await author.call(one.PATCH, {
    params,
    method: 'PATCH',
    json: {
      version: created.body.review.version,
      body: {
        type: 'doc',
        content: [
          { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: 'The claim and its dose' }] },
          {
            type: 'paragraph',
            content: [{ type: 'text', text: 'Daily hangs at a light load <script>window.__pwned = 1</script>.' }],
          },
          { type: 'mechanismBlock', attrs: { mechanismId: m1.body.mechanism.id } },
          {
            type: 'paragraph',
            content: [
              { type: 'text', text: 'A link', marks: [{ type: 'link', attrs: { href: 'javascript:alert(1)' } }] },
            ],
          },
        ],
      },
      recommendations: {
        whoMightTry: 'Recreational climbers who want a gentle daily routine.',
        whoShouldNot: 'Anyone with a finger pulley injury that has not been cleared.',
        whatInstead: 'Two or three harder hangboard sessions a week.',
      },
    },
  });
  if (patched.status !== 200) throw new Error(`patch failed: ${JSON.stringify(patched.body)}`);
  if (opts.approved !== false) await Review.update({ status: 'approved' }, { where: { id } });
  return { id, version: patched.body.review.version };
}
