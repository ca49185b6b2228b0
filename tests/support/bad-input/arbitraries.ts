// fast-check arbitraries for the bad-input sweep (tests/integration/bad-input.test.ts): hostile
// values of every kind, bad path parameters, and request bodies that are guaranteed to be wrong in
// at least one place. Everything an id could point at is kept far away from the fixture's ids, so a
// lenient parser that accepts "0x1" or " 1" can never reach a real row by accident.
import fc from 'fast-check';

/** Ids that never exist in the sweep's database (the fixture's rows are small numbers or listed in AVOID_IDS). */
export const MISSING_ID = 987_654_321;
/** Ids of fixture rows that a generated value must never name. */
export const AVOID_IDS = new Set<number>();

const avoids = (value: unknown): boolean => {
  if (typeof value === 'number') return AVOID_IDS.has(value);
  if (typeof value === 'string') {
    const t = value.trim();
    return AVOID_IDS.has(Number(t)) || AVOID_IDS.has(parseInt(t, 10)) || AVOID_IDS.has(parseFloat(t));
  }
  return false;
};

/** Strings nobody should have to handle: control characters, lone surrogates, direction marks, paths, injections. */
export const NASTY_STRINGS = [
  '',
  ' ',
  '   \t\n',
  '\u0000',
  'a\u0000b',
  '\uD800',
  '\uDFFF',
  'x\uD83Dy',
  '\uFFFE',
  '\uFEFFbom',
  '\u202Egnp.exe',
  '\u200F\u200E\u2066rtl\u2069',
  '\u0301\u0301\u0301',
  'Z̴͉̈a̵̙͝l̶̰̓g̸̗̾o̷̜͒',
  '𝔘𝔫𝔦𝔠𝔬𝔡𝔢 🥒🫙',
  '../x',
  '..\\..\\windows',
  '%2e%2e%2f',
  '%',
  '%E0%A4%A',
  '%00',
  '100%',
  '<script>alert(1)</script>',
  "' OR 1=1 --",
  '"; DROP TABLE users; --',
  '${7*7}',
  '{{7*7}}',
  'NaN',
  '-NaN',
  'Infinity',
  '-Infinity',
  '-0',
  '0x1F',
  '1e99',
  '-1e99',
  '9'.repeat(400),
  'null',
  'undefined',
  'true',
  '[]',
  '{}',
  '__proto__',
  'constructor',
  'javascript:alert(1)',
  '//evil.example',
  'http://[::1',
];

/** A few very long strings (kept to ~100k characters so the whole sweep stays fast). */
export const hugeString = fc.oneof(
  fc.constantFrom('x'.repeat(100_000), '🥒'.repeat(20_000), '\u0000'.repeat(5_000), 'a'.repeat(1_001), 'é'.repeat(65_536)),
  fc.string({ minLength: 300, maxLength: 3_000 }),
);

export const nastyString: fc.Arbitrary<string> = fc
  .oneof(
    { weight: 4, arbitrary: fc.constantFrom(...NASTY_STRINGS) },
    { weight: 3, arbitrary: fc.string({ maxLength: 40 }) },
    { weight: 2, arbitrary: fc.string({ unit: 'binary', maxLength: 40 }) },
    { weight: 1, arbitrary: fc.string({ unit: 'grapheme', maxLength: 20 }) },
    { weight: 1, arbitrary: hugeString },
  )
  .filter((s) => !avoids(s));

export const nastyNumber: fc.Arbitrary<number> = fc
  .oneof(
    fc.constantFrom(
      -1,
      0,
      -0,
      0.5,
      1.5,
      -1.5,
      1e99,
      -1e99,
      1e308,
      -1e308,
      5e-324,
      2 ** 31,
      2 ** 32,
      2 ** 53,
      2 ** 53 + 2,
      -(2 ** 63),
      Number.MAX_VALUE,
      Number.EPSILON,
    ),
    fc.integer({ min: -2_000_000_000, max: 0 }),
    fc.double({ noNaN: true, noDefaultInfinity: true }),
  )
  .filter((n) => !avoids(n));

/** Any JSON value of the wrong shape: nasty strings and numbers, booleans, null, arrays, objects. */
export const wrongValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 4, arbitrary: nastyString },
  { weight: 3, arbitrary: nastyNumber },
  { weight: 1, arbitrary: fc.boolean() },
  { weight: 1, arbitrary: fc.constant(null) },
  { weight: 1, arbitrary: fc.array(fc.oneof(nastyString, nastyNumber), { maxLength: 4 }) },
  { weight: 1, arbitrary: fc.dictionary(nastyString, fc.oneof(nastyString, nastyNumber), { maxKeys: 3 }) },
);

/** Strings that are not a positive whole number in any spelling Number() or parseInt() would accept. */
export const notAnId: fc.Arbitrary<string> = fc
  .oneof(
    fc.constantFrom(
      '-1',
      '0',
      '-0',
      '1.5',
      '1e99',
      '1e-3',
      'abc',
      '../x',
      '..',
      '.',
      '',
      ' ',
      'NaN',
      'Infinity',
      '-Infinity',
      '[id]',
      'null',
      '1/2',
      '1;2',
      '%00',
      '\u0000',
      '\uD800',
      '٣',
      '１',
      '9'.repeat(30),
      '18446744073709551616',
      '-2147483649',
    ),
    nastyString,
  )
  .filter((s) => !avoids(s));

/** Well-formed ids in odd spellings, all naming rows that do not exist. */
export const missingId: fc.Arbitrary<string> = fc.constantFrom(
  String(MISSING_ID),
  ` ${MISSING_ID}`,
  `${MISSING_ID} `,
  `0${MISSING_ID}`,
  `${MISSING_ID}.0`,
  `0x${MISSING_ID.toString(16)}`,
  `${MISSING_ID / 1000}e3`,
  String(2 ** 32 - 1),
  String(2 ** 31 - 1),
);

/** A path parameter that should name a numeric row: garbage, or a well-formed id of nothing. */
export const idParam: fc.Arbitrary<string> = fc.oneof({ weight: 4, arbitrary: notAnId }, { weight: 1, arbitrary: missingId });

/** Slug-like path parameters: garbage and well-formed slugs of nothing. */
export const slugParam = (missing: string[]): fc.Arbitrary<string> =>
  fc.oneof(
    { weight: 4, arbitrary: nastyString },
    { weight: 1, arbitrary: fc.constantFrom(...missing) },
    { weight: 1, arbitrary: fc.stringMatching(/^[a-z0-9]{1,12}(-[a-z0-9]{1,8}){0,3}$/) },
  );

/** A value for a JSON field that must be an id: anything but a real row's id. */
export const idValue: fc.Arbitrary<unknown> = fc.oneof(wrongValue, fc.constant(MISSING_ID), fc.constant(String(MISSING_ID)));

export type FieldSpec = {
  /** Values of the right shape (or at least plausible). They may be valid: safety comes from `bad`. */
  ok: fc.Arbitrary<unknown>;
  /** Values that the schema MUST refuse for this field (missing counts for a required field). */
  bad: fc.Arbitrary<unknown>;
};

const MISSING = Symbol('missing');

/**
 * Objects with the route's field names where at least one field is guaranteed wrong (from its `bad`
 * arbitrary), the others mixed from ok / wrong-typed / missing, plus a few unknown keys now and then.
 * So a body built here can never be a valid request, however lenient the other fields are.
 */
export function brokenObject(fields: Record<string, FieldSpec>): fc.Arbitrary<Record<string, unknown>> {
  const names = Object.keys(fields);
  const each = Object.fromEntries(
    names.map((name) => [
      name,
      fc.oneof(
        { weight: 3, arbitrary: fields[name].ok },
        { weight: 2, arbitrary: fields[name].bad },
        { weight: 1, arbitrary: wrongValue },
        { weight: 1, arbitrary: fc.constant(MISSING) },
      ),
    ]),
  );
  return fc
    .tuple(fc.record(each), fc.constantFrom(...names), fc.option(fc.dictionary(nastyString, wrongValue, { maxKeys: 2 }), { freq: 5 }))
    .chain(([record, forced, extra]) =>
      fields[forced].bad.map((badValue) => {
        const out: Record<string, unknown> = { ...(extra ?? {}) };
        for (const name of names) {
          const value = name === forced ? badValue : record[name];
          if (value !== MISSING) out[name] = value;
        }
        if (badValue === MISSING) delete out[forced];
        return out;
      }),
    );
}

/** `bad` for a required field: missing, or one of the given wrong values. */
export const requiredBad = (...wrong: fc.Arbitrary<unknown>[]): fc.Arbitrary<unknown> => fc.oneof(fc.constant(MISSING), ...wrong);

/** JSON that does not parse, and JSON-like text with non-JSON literals. */
export const malformedJson: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom(
    '{',
    '}',
    '{"__proto__": {"role": "admin"}}',
    '{"constructor": {"prototype": {"role": "admin"}}}',
    '{"a":',
    '{"a" 1}',
    "{'a': 1}",
    '{"a": NaN}',
    '{"a": Infinity}',
    '{"a": -Infinity}',
    '{"a": undefined}',
    '[1,2,',
    '{"a":1,}',
    '\u0000',
    '\uFEFF{"a":1',
    'nul',
    'tru',
    '"unterminated',
    '{"a":"\\x41"}',
    '{"a":"\\u12"}',
    '{"a": 01}',
    '{"a": .5}',
    '{"a": 1e}',
    '<xml/>',
    'a=1&b=2',
    '--boundary',
  ),
  fc.string({ maxLength: 60 }).filter((s) => {
    try {
      JSON.parse(s);
      return false;
    } catch {
      return true;
    }
  }),
  fc.jsonValue().map((v) => JSON.stringify(v).slice(0, -1) || '{'),
);

export type BadBody = { contentType: string | null; body: string | Uint8Array | null; kind: string };

const withType =
  (contentType: string | null, kind: string) =>
  (body: string | Uint8Array | null): BadBody => ({ contentType, body, kind });

/** Content types that are not JSON, and JSON with odd parameters. */
export const wrongContentType = fc.constantFrom(
  'text/plain',
  'application/x-www-form-urlencoded',
  'multipart/form-data; boundary=xyz',
  'application/xml',
  'application/octet-stream',
  'image/jpeg',
  'application/jsonp',
  'text/json',
  '',
  'application/vnd.api+json',
);

/** Every kind of bad JSON body: broken objects, wrong-shaped JSON, malformed JSON, wrong types, empty, huge. */
export function badJsonBodies(fields: Record<string, FieldSpec>): fc.Arbitrary<BadBody> {
  return fc.oneof(
    { weight: 8, arbitrary: brokenObject(fields).map((o) => withType('application/json', 'broken object')(JSON.stringify(o))) },
    {
      weight: 2,
      arbitrary: fc
        .oneof(fc.jsonValue({ maxDepth: 3 }), wrongValue)
        .filter((v) => v === null || typeof v !== 'object' || Array.isArray(v) || Object.keys(v).every((k) => !(k in fields)))
        .map((v) => withType('application/json', 'wrong-shaped JSON')(JSON.stringify(v) ?? 'null')),
    },
    { weight: 3, arbitrary: malformedJson.map(withType('application/json', 'malformed JSON')) },
    {
      weight: 1,
      arbitrary: fc
        .constantFrom('APPLICATION/JSON', 'application/json; charset=utf-16', 'application/json; charset=latin1')
        .chain((t) => malformedJson.map(withType(t, 'malformed JSON, odd type'))),
    },
    { weight: 2, arbitrary: fc.tuple(wrongContentType, brokenObject(fields)).map(([t, o]) => withType(t, 'wrong content type')(JSON.stringify(o))) },
    {
      weight: 1,
      arbitrary: fc.constantFrom(
        withType('application/json', 'empty body')(''),
        withType(null, 'no body, no type')(null),
        withType('application/json', 'no body')(null),
      ),
    },
    {
      weight: 1,
      arbitrary: hugeString.map((s) => withType('application/json', 'huge JSON string')(JSON.stringify({ [Object.keys(fields)[0] ?? 'x']: s, filler: s }))),
    },
    { weight: 1, arbitrary: fc.uint8Array({ maxLength: 200 }).map(withType('application/json', 'binary bytes as JSON')) },
    { weight: 1, arbitrary: fc.constant(withType('application/json', 'deeply nested')('['.repeat(5_000) + ']'.repeat(5_000))) },
  );
}

/** Query strings: the route's own names with bad values, unknown names, repeated names. */
export function badQuery(names: string[], okValues: Record<string, fc.Arbitrary<string>> = {}): fc.Arbitrary<[string, string][]> {
  const value = (name: string) => fc.oneof({ weight: 4, arbitrary: nastyString }, { weight: 1, arbitrary: okValues[name] ?? nastyString });
  const own = names.length
    ? fc.array(
        fc.constantFrom(...names).chain((n) => value(n).map((v): [string, string] => [n, v])),
        { maxLength: 6 },
      )
    : fc.constant([] as [string, string][]);
  return fc.tuple(own, fc.array(fc.tuple(nastyString, nastyString), { maxLength: 2 })).map(([a, b]) => [...a, ...b]);
}

/** Header values a client can send (HTTP header values are Latin-1 without controls). */
export const headerValue = fc.oneof(
  fc.constantFrom('', ' ', '1.2.3.4', '::1', 'unknown', '999.999.999.999', 'x'.repeat(2_000), '1.1.1.1, 2.2.2.2', '%00', '../x'),
  fc.string({ unit: fc.integer({ min: 0x20, max: 0x7e }).map((c) => String.fromCharCode(c)), maxLength: 80 }),
);
