import { describe, expect, it } from 'vitest';
import { canonicalJson } from '../canonical.js';
import { parseStandardsCsv } from '../csv.js';
import { validationErrors } from './helpers.js';

describe('canonicalJson', () => {
  it('sorts keys at every depth and drops undefined members', () => {
    expect(canonicalJson({ b: 1, a: { d: [3, { z: 1, y: 2 }], c: undefined } })).toBe('{"a":{"d":[3,{"y":2,"z":1}]},"b":1}');
  });

  it('writes numbers in their shortest round-trip form (RFC 8785 style)', () => {
    expect(canonicalJson([1e21, 0.1, -0, 5e-7, 100])).toBe('[1e+21,0.1,0,5e-7,100]');
  });

  it('escapes strings as JSON and sorts by code unit', () => {
    expect(canonicalJson({ é: '"', Z: '\n', a: 'µ' })).toBe('{"Z":"\\n","a":"µ","é":"\\""}');
  });

  it('refuses non-finite numbers rather than printing null', () => {
    expect(() => canonicalJson({ a: Number.NaN })).toThrow(/\$\.a/);
  });
});

describe('parseStandardsCsv', () => {
  it('comma-separated with a header', () => {
    expect(parseStandardsCsv('x,y\n0.5,0.0612\n1,0.121\n')).toEqual([
      { x: 0.5, y: 0.0612 },
      { x: 1, y: 0.121 },
    ]);
  });

  it('semicolon-separated with decimal commas, CRLF and a BOM', () => {
    expect(parseStandardsCsv('\uFEFFKonzentration;Signal\r\n0,5;0,0612\r\n1;0,121\r\n')).toEqual([
      { x: 0.5, y: 0.0612 },
      { x: 1, y: 0.121 },
    ]);
  });

  it('without a header, with comments and blank lines', () => {
    expect(parseStandardsCsv('# nitrate standards\n\n2,0.41\n4,0.82')).toHaveLength(2);
  });

  it('names the line of a bad value', () => {
    const errors = validationErrors(() => parseStandardsCsv('x,y\n1,2\n2,abc\n3'));
    expect(errors.map((e) => e.field)).toEqual(['line 3.y', 'line 4']);
  });

  it('an empty file', () => {
    expect(validationErrors(() => parseStandardsCsv('x,y\n'))[0].code).toBe('empty');
  });
});
