import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { expect } from 'vitest';

export const dataFile = (name: string): string => fileURLToPath(new URL(`../data/${name}`, import.meta.url));

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export function loadJson(name: string): any {
  return JSON.parse(readFileSync(dataFile(name), 'utf8'));
}

/** Rows of a reference CSV (lines starting with # are its provenance header). */
export function loadCsv(name: string): Record<string, string>[] {
  const lines = readFileSync(dataFile(name), 'utf8')
    .split(/\r?\n/)
    .filter((l) => l.trim() !== '' && !l.startsWith('#'));
  const header = lines[0].split(',');
  return lines.slice(1).map((line) => Object.fromEntries(line.split(',').map((cell, i) => [header[i], cell])));
}

/** |actual − expected| ≤ rel·|expected| (or ≤ rel when expected is 0). */
export function expectRel(actual: number | null | undefined, expected: number | string, rel: number, label = ''): void {
  const target = Number(expected);
  expect(actual, `${label}: no value`).not.toBeNull();
  expect(actual, `${label}: no value`).not.toBeUndefined();
  const error = Math.abs((actual as number) - target) / (target === 0 ? 1 : Math.abs(target));
  expect(error, `${label}: got ${actual}, expected ${target} (relative error ${error.toExponential(2)})`).toBeLessThanOrEqual(rel);
}

export function expectAbs(actual: number | null | undefined, expected: number | string, abs: number, label = ''): void {
  expect(actual, `${label}: no value`).not.toBeNull();
  const error = Math.abs((actual as number) - Number(expected));
  expect(error, `${label}: got ${actual}, expected ${expected}`).toBeLessThanOrEqual(abs);
}

export function standards(x: readonly number[], y: readonly number[]): { x: number; y: number }[] {
  return x.map((xi, i) => ({ x: xi, y: y[i] }));
}

/**
 * The shared reference-data folder of the installation (read in place, never copied into the project);
 * MERITLINE_REFERENCE_DATA points elsewhere. Checks that need it are skipped where it is absent.
 */
export const sharedReferenceDir = process.env.MERITLINE_REFERENCE_DATA ?? '/work/shared/reference-data';

export const hasSharedReference = (name: string): boolean => existsSync(join(sharedReferenceDir, name));

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export function loadSharedJson(name: string): any {
  return JSON.parse(readFileSync(join(sharedReferenceDir, name), 'utf8'));
}
