import fc from 'fast-check';

/**
 * Values a careless or hostile client sends, for fuzzing the API with fast-check: NUL and lone
 * surrogates, dates PostgreSQL cannot hold, numbers beyond any column, text that looks like
 * something else, plus fast-check's own arbitrary strings and numbers.
 */
export const hostileString = fc.oneof(
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'binary', maxLength: 20 }),
  fc.constantFrom(
    '\u0000',
    'Sea\u0000Salt',
    '\ud800',
    'x\udc00',
    '\ufeff',
    '0000-01-01',
    '0000-02-29',
    '-0001-01-01',
    '10000-01-01',
    '2025-02-30',
    '2025-13-01',
    '99999999999',
    '-1',
    '1e309',
    'NaN',
    '',
    ' ',
    '%00',
    '%E0%A4%A',
    '__proto__',
    "'; drop table materials; --",
    '00000000-0000-0000-0000-000000000000',
    'x'.repeat(5000),
  ),
);

export const hostileNumber = fc.oneof(
  fc.double(),
  fc.integer(),
  fc.constantFrom(
    0,
    -0,
    -1,
    1e-7,
    0.00001,
    0.00004,
    99999999999,
    2 ** 31,
    2 ** 53,
    1e308,
    -1e308,
    Number.MIN_VALUE,
  ),
);

/** Any one hostile JSON value, nested a little. */
export const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 4, arbitrary: hostileString },
  { weight: 4, arbitrary: hostileNumber },
  fc.boolean(),
  fc.constant(null),
  fc.array(fc.oneof(hostileString, hostileNumber), { maxLength: 3 }),
  fc.dictionary(hostileString, fc.oneof(hostileString, hostileNumber), { maxKeys: 3 }),
);

type Path = (string | number)[];

/** Every path into a JSON value below its root: object keys and array indexes. */
function pathsOf(value: unknown, prefix: Path = []): Path[] {
  if (value === null || typeof value !== 'object') return [];
  const entries = Array.isArray(value)
    ? value.map((v, i) => [i, v] as const)
    : Object.entries(value);
  return entries.flatMap(([key, child]) => [[...prefix, key], ...pathsOf(child, [...prefix, key])]);
}

function setAt(root: unknown, path: Path, value: unknown): unknown {
  if (path.length === 0) return value;
  let node: unknown = root;
  for (const key of path.slice(0, -1)) {
    // An earlier change may have replaced a parent with a plain value: nothing left to reach.
    if (node === null || typeof node !== 'object') return root;
    node = (node as Record<string | number, unknown>)[key];
  }
  if (node !== null && typeof node === 'object') {
    (node as Record<string | number, unknown>)[path.at(-1)!] = value;
  }
  return root;
}

/**
 * A nastier version of one value, keeping its type where it has one, so that it still passes the
 * shape checks and reaches the rule that must refuse it: text gains a NUL or a lone surrogate, a
 * date moves to year 0, a number becomes a trace or exceeds any column.
 */
function nastier(value: unknown, pick: number, other: unknown): unknown {
  if (typeof value === 'string') {
    const year0 = /^\d{4}-/.test(value) ? `0000${value.slice(4)}` : `${value}\u0000`;
    return [`${value}\u0000`, `\ud800${value}`, year0, other][pick % 4];
  }
  if (typeof value === 'number') return [1e-7, 0.00001, 99999999999, 2 ** 31, other][pick % 5];
  return other;
}

/**
 * A valid body with one to three of its values (or the whole body) made hostile, so the hostile
 * value gets past the shape of the request and reaches the rule that must refuse it.
 */
export function mutated(valid: unknown): fc.Arbitrary<unknown> {
  const paths: Path[] = [[], ...pathsOf(valid)];
  const change = fc.tuple(fc.nat(paths.length - 1), fc.nat(19), hostileValue);
  return fc.array(change, { minLength: 1, maxLength: 3 }).map((changes) =>
    changes.reduce<unknown>((body, [i, pick, other]) => {
      const path = paths[i]!;
      return setAt(body, path, nastier(valueAt(body, path), pick, other));
    }, structuredClone(valid)),
  );
}

function valueAt(root: unknown, path: Path): unknown {
  let node = root;
  for (const key of path) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<string | number, unknown>)[key];
  }
  return node;
}

/** A body for a route: mostly a mutated valid body, sometimes any hostile value at all. */
export const hostileBody = (valid: unknown) =>
  fc.oneof({ weight: 4, arbitrary: mutated(valid) }, { weight: 1, arbitrary: hostileValue });
