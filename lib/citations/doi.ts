import { plainCsl } from './rich-text';

/**
 * DOIs: recognising, normalising and looking them up through the DOI content-negotiation
 * service (the resolver answers `Accept: application/vnd.citationstyles.csl+json` with the
 * reference as CSL-JSON — DOI content negotiation, https://citation.crosscite.org/docs.html).
 *
 * The base URL comes from DOI_BASE_URL (default the public resolver https://doi.org), so tests
 * and `npm run dev` point it at the local fake in ./fake-doi-server.ts.
 */
import { env } from '@/lib/env';

export const DEFAULT_DOI_BASE_URL = 'https://doi.org';
export const CSL_JSON_MEDIA_TYPE = 'application/vnd.citationstyles.csl+json';
const LOOKUP_TIMEOUT_MS = 8000;

/**
 * "10." + a registrant code of 4–9 digits (dot-separated parts allowed) + "/" + a suffix with no
 * spaces. Crossref's published pattern for modern DOIs is narrower on the suffix
 * (/^10.\d{4,9}\/[-._;()/:A-Z0-9]+$/i — A. Gilmartin, "DOIs and matching regular expressions",
 * Crossref blog, 11 Aug 2015 — which misses early DOIs such as Wiley's 10.1002/(SICI)…); a suffix
 * may hold any printable Unicode character (DOI Handbook, "General characteristics of the DOI
 * syntax"), so we only forbid spaces.
 */
const DOI_PATTERN = /^10\.\d{4,9}(?:\.\d+)*\/\S+$/;

/**
 * The bare DOI from what people paste: "https://doi.org/10.5555/X", "doi:10.5555/X", " 10.5555/X. ".
 * ASCII letters are lower-cased, since DOI names are case-insensitive under ASCII case folding
 * (DOI Handbook, ch. 2 "Numbering"); other characters are kept as given. Null when it is not a DOI.
 *
 * @example
 * normalizeDoi('https://doi.org/10.5555/JICS.2024.001'); // '10.5555/jics.2024.001'
 * normalizeDoi('not a doi'); // null
 */
export function normalizeDoi(input: string): string | null {
  let text = input.trim();
  text = text.replace(/^(?:https?:\/\/)?(?:dx\.)?doi\.org\//i, '').replace(/^doi:\s*/i, '');
  try {
    if (/%[0-9a-f]{2}/i.test(text)) text = decodeURIComponent(text);
  } catch {
    return null;
  }
  // A DOI pasted at the end of a sentence carries its full stop.
  text = text.replace(/[.,;]+$/, '');
  if (!DOI_PATTERN.test(text)) return null;
  return text.replace(/[A-Z]/g, (c) => c.toLowerCase());
}

export function isDoi(input: string): boolean {
  return normalizeDoi(input) !== null;
}

/** The resolver URL of a DOI; each segment is percent-encoded, the slashes kept. */
export function doiUrl(doi: string, base = DEFAULT_DOI_BASE_URL): string {
  return `${base.replace(/\/+$/, '')}/${doi.split('/').map(encodeURIComponent).join('/')}`;
}

export function doiBaseUrl(): string {
  return env().DOI_BASE_URL || DEFAULT_DOI_BASE_URL;
}

export type DoiLookup = { ok: true; csl: Record<string, unknown> } | { ok: false; reason: string };

/**
 * Looks a DOI up and returns its CSL-JSON, or a sentence a coach can act on. Never throws: a
 * failed lookup is one entry's failure, not the whole import's.
 */
export async function lookupDoi(
  doi: string,
  options: { baseUrl?: string; fetch?: typeof fetch; timeoutMs?: number } = {},
): Promise<DoiLookup> {
  const url = doiUrl(doi, options.baseUrl ?? doiBaseUrl());
  const doFetch = options.fetch ?? fetch;
  let response: Response;
  try {
    response = await doFetch(url, {
      headers: { Accept: CSL_JSON_MEDIA_TYPE },
      redirect: 'follow',
      signal: AbortSignal.timeout(options.timeoutMs ?? LOOKUP_TIMEOUT_MS),
    });
  } catch (error) {
    const timedOut = error instanceof Error && (error.name === 'TimeoutError' || error.name === 'AbortError');
    return {
      ok: false,
      reason: timedOut
        ? `The DOI service did not answer for ${doi} in time; try again, or paste the reference as BibTeX or RIS.`
        : `Could not reach the DOI service for ${doi}; check the connection, or paste the reference as BibTeX or RIS.`,
    };
  }
  if (response.status === 404) {
    return { ok: false, reason: `No record found for DOI ${doi}; check it for typos.` };
  }
  if (!response.ok) {
    return {
      ok: false,
      reason: `The DOI service answered ${response.status} for ${doi}; try again later, or paste the reference as BibTeX or RIS.`,
    };
  }
  let data: unknown;
  try {
    data = JSON.parse(await response.text());
  } catch {
    return { ok: false, reason: `The DOI service did not send a readable reference for ${doi}.` };
  }
  const item = Array.isArray(data) ? data[0] : data;
  if (
    typeof item !== 'object' ||
    item === null ||
    typeof (item as { title?: unknown }).title !== 'string' ||
    !(item as { title: string }).title.trim()
  ) {
    return { ok: false, reason: `The record for DOI ${doi} has no title, so it was not added.` };
  }
  // DOI registries send titles with rich-text tags too (<i>, <sub>); store them as plain text.
  return { ok: true, csl: plainCsl({ ...(item as Record<string, unknown>), DOI: doi }) };
}
