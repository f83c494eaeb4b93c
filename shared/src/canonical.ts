/**
 * Canonical JSON text: object keys sorted by UTF-16 code units, no whitespace, numbers in
 * ECMAScript's shortest round-trip form (the scheme of RFC 8785). Equal values give equal
 * text, so the text can be hashed.
 */
export function canonicalJson(value: unknown): string {
  return write(value, '$');
}

function write(value: unknown, path: string): string {
  if (value === null) return 'null';
  if (typeof value === 'object' && typeof (value as { toJSON?: unknown }).toJSON === 'function') {
    return write((value as { toJSON: () => unknown }).toJSON(), path);
  }
  switch (typeof value) {
    case 'boolean':
    case 'string':
      return JSON.stringify(value);
    case 'number':
      if (!Number.isFinite(value)) throw new TypeError(`canonicalJson: ${path} is not a finite number`);
      return JSON.stringify(value);
    case 'object': {
      if (Array.isArray(value)) {
        return `[${value.map((v, i) => (v === undefined || typeof v === 'function' ? 'null' : write(v, `${path}[${i}]`))).join(',')}]`;
      }
      const entries = Object.keys(value as object)
        .filter((k) => {
          const v = (value as Record<string, unknown>)[k];
          return v !== undefined && typeof v !== 'function';
        })
        .sort((a, b) => (a < b ? -1 : a > b ? 1 : 0))
        .map((k) => `${JSON.stringify(k)}:${write((value as Record<string, unknown>)[k], `${path}.${k}`)}`);
      return `{${entries.join(',')}}`;
    }
    default:
      throw new TypeError(`canonicalJson: ${path} has unsupported type ${typeof value}`);
  }
}
