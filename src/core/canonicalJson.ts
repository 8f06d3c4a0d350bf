import { ScoringError } from './errors';

/**
 * Deterministic JSON for hashing signed cards: object keys sorted by UTF-16 code units at every
 * level, no whitespace, numbers and strings as JSON.stringify writes them. Anything JSON would
 * drop or bend silently (undefined, NaN, Infinity, functions, Dates, Maps, class instances,
 * cycles) is refused, so two parties can never hash different readings of the same value.
 */
export function canonicalJson(value: unknown): string {
  return write(value, '$', new Set());
}

function refuse(path: string, what: string): never {
  throw new ScoringError('not-canonical-json', `Cannot sign ${path}: ${what}.`);
}

function write(value: unknown, path: string, open: Set<object>): string {
  switch (typeof value) {
    case 'string':
    case 'boolean':
      return JSON.stringify(value);
    case 'number':
      if (!Number.isFinite(value)) refuse(path, `${value} is not a JSON number`);
      return JSON.stringify(value);
    case 'object':
      break;
    default:
      refuse(path, `${typeof value} has no JSON form`);
  }
  if (value === null) return 'null';
  if (open.has(value)) refuse(path, 'it contains itself');
  open.add(value);
  let json: string;
  if (Array.isArray(value)) {
    const items: string[] = [];
    // Indexed loop, not map: map skips holes, which must be refused like undefined.
    for (let i = 0; i < value.length; i += 1) items.push(write(value[i], `${path}[${i}]`, open));
    json = `[${items.join(',')}]`;
  } else {
    const proto: unknown = Object.getPrototypeOf(value);
    if (proto !== Object.prototype && proto !== null) {
      const kind = (value as { constructor?: { name?: string } }).constructor?.name ?? 'object';
      refuse(path, `a ${kind} is not plain data; convert it first (a Date to an ISO string)`);
    }
    const record = value as Record<string, unknown>;
    const members = Object.keys(record)
      .sort()
      .map((key) => `${JSON.stringify(key)}:${write(record[key], `${path}.${key}`, open)}`);
    json = `{${members.join(',')}}`;
  }
  open.delete(value);
  return json;
}
