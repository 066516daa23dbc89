import { mulberry32 } from '../../seeded-random';

/**
 * Malformed request bodies and path ids: values no field of the API accepts in that place
 * (docs/api/README.md: "Never a 500 for bad input"; lib/validation/ids.ts for ids).
 */
export interface Malformed {
  label: string;
  raw: string;
  contentType?: string;
}

/** Raw JSON text that JSON.parse reads differently from what was written (1e309 is Infinity). */
const RAW = (text: string) => `\u0000raw:${text}\u0000`;
const HUGE = 'x'.repeat(1_000_001);

/** Ids as paths carry them: everything but decimal digits without sign, space or leading zero. */
export const ODD_PATH_IDS = [
  '0x3',
  '3e0',
  '%2B3',
  '%203',
  '03',
  '-1',
  '0',
  '1e309',
  '1.0',
  '%5B1%5D',
  'true',
  'null',
  '9'.repeat(30),
  'abc',
  '%00',
  '3%00',
];

/** Values wrong for any id or number field of a JSON body. */
const ODD_NUMBERS: unknown[] = [
  '1',
  '0x3',
  '3e0',
  '+3',
  ' 3',
  true,
  [1],
  { $gt: 0 },
  { a: { b: { c: [1] } } },
  RAW('1e309'),
  RAW('-1e309'),
  'NaN',
  '',
];
const ODD_IDS: unknown[] = [...ODD_NUMBERS, -1, 0, 1.5, 2 ** 60];
const ODD_STRINGS: unknown[] = [1, true, [1], { a: 1 }, [{ a: 'b' }], RAW('1e309'), HUGE];
const ODD_BOOLEANS: unknown[] = ['true', 1, [true], { a: true }, 'yes'];
const ODD_ARRAYS: unknown[] = ['1', 1, { 0: 1 }, true, [true, { a: [] }], [RAW('1e309')], [HUGE]];
// Not objects: an object of unknown keys is a well-formed one whose fields all have defaults.
const ODD_OBJECTS: unknown[] = ['{}', 1, [1], true, [{ a: { b: HUGE } }]];

function oddFor(key: string, value: unknown): unknown[] {
  if (/Ids?$/.test(key) || key === 'version') return ODD_IDS;
  if (typeof value === 'number' || value === null) return ODD_NUMBERS;
  if (typeof value === 'string') return ODD_STRINGS;
  if (typeof value === 'boolean') return ODD_BOOLEANS;
  if (Array.isArray(value)) return ODD_ARRAYS;
  return ODD_OBJECTS;
}

export function text(body: unknown): string {
  return JSON.stringify(body).replace(/"\\u0000raw:([^\\]*)\\u0000"/g, '$1');
}

/** Not JSON, or JSON of the wrong shape altogether. */
export const BROKEN_JSON = [
  '',
  ' ',
  '{',
  '}',
  '{"a":',
  '[1,',
  'nul',
  'undefined',
  "{'a':1}",
  '{"a":1,}',
  '{"a":1}{"a":2}',
  '\u0000',
  '\ufeff{}',
  '{"__proto__":{"polluted":1}}',
  '{"constructor":{"prototype":{"polluted":1}}}',
  '['.repeat(20_000) + ']'.repeat(20_000),
  `"${HUGE}"`,
  'NaN',
  'Infinity',
  '1e309',
  '-0',
  'null',
  'true',
  '[]',
  '[{}]',
  '"str"',
  '{"a":"\\ud800"}',
  '{"a":"\\u0000"}',
];

export const WRONG_TYPES = [
  'text/plain',
  'application/x-www-form-urlencoded',
  'multipart/form-data',
  'multipart/form-data; boundary=x',
  'application/jsonx',
  'text/json',
  'application/xml',
  'application/json-patch+json',
];

/** One field of a well-formed body replaced, for every field and every value wrong for it. */
export function oneFieldWrong(base: Record<string, unknown>): Malformed[] {
  const out: Malformed[] = [];
  for (const [key, value] of Object.entries(base)) {
    for (const odd of oddFor(key, value)) {
      out.push({ label: `${key}=${describe(odd)}`, raw: text({ ...base, [key]: odd }) });
    }
    // One level down: the first element of a list, each field of an object.
    if (Array.isArray(value) && value.length && typeof value[0] !== 'object') {
      for (const odd of oddFor(key, value[0]))
        out.push({ label: `${key}[0]=${describe(odd)}`, raw: text({ ...base, [key]: [odd] }) });
    } else if (value && typeof value === 'object') {
      const inner = Array.isArray(value) ? (value[0] as Record<string, unknown>) : (value as Record<string, unknown>);
      for (const [k, v] of Object.entries(inner ?? {})) {
        for (const odd of oddFor(k, v)) {
          const changed = { ...inner, [k]: odd };
          out.push({
            label: `${key}.${k}=${describe(odd)}`,
            raw: text({ ...base, [key]: Array.isArray(value) ? [changed] : changed }),
          });
        }
      }
    }
  }
  return out;
}

/**
 * `count` bodies from a seeded generator: each keeps some fields of the well-formed body, drops
 * others, and gives one to three fields a value wrong for them, so none of them is well formed.
 */
export function randomlyWrong(base: Record<string, unknown>, count: number, seed: number): Malformed[] {
  const random = mulberry32(seed);
  const pick = <T>(list: T[]) => list[Math.floor(random() * list.length)];
  const keys = Object.keys(base);
  const out: Malformed[] = [];
  for (let i = 0; i < count; i++) {
    const body: Record<string, unknown> = {};
    for (const key of keys) if (random() < 0.8) body[key] = base[key];
    const wrong = keys.length ? Array.from({ length: 1 + Math.floor(random() * 3) }, () => pick(keys)) : ['x'];
    for (const key of wrong) body[key] = pick(oddFor(key, base[key]));
    out.push({ label: `random#${i}:${wrong.join(',')}`, raw: text(body) });
  }
  return out;
}

function describe(value: unknown): string {
  const s = typeof value === 'string' && value.startsWith('\u0000raw:') ? value.slice(5, -1) : JSON.stringify(value);
  return s.length > 24 ? `${s.slice(0, 12)}…(${s.length})` : s;
}
