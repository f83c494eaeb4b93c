import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { AUDIT_ACTION_LABELS, auditActionLabel, auditChangesInWords, auditEntityLabel } from '@meritline/shared';

const SRC = fileURLToPath(new URL('..', import.meta.url));

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(path);
    return entry.name.endsWith('.ts') && !entry.name.endsWith('.spec.ts') ? [path] : [];
  });
}

describe('the audit trail in words', () => {
  const sources = sourceFiles(SRC).map((file) => readFileSync(file, 'utf8'));

  it('has words for every action and record kind the server records', () => {
    const actions = new Set(sources.flatMap((text) => [...text.matchAll(/action: '([a-z-]+\.[a-z-]+)'/g)].map((m) => m[1])));
    const entities = new Set(sources.flatMap((text) => [...text.matchAll(/entity: '([a-z-]+)'/g)].map((m) => m[1])));
    expect(actions.size).toBeGreaterThan(30);
    expect([...actions].filter((action) => !AUDIT_ACTION_LABELS[action])).toEqual([]);
    expect([...entities].filter((entity) => auditEntityLabel(entity) === 'Other record')).toEqual([]);
  });

  it('never prints an unknown code', () => {
    expect(auditActionLabel('something.new')).toBe('Other recorded event');
  });

  it('puts coded values in the words of their field', () => {
    expect(
      auditChangesInWords(
        {
          status: { from: 'submitted', to: 'approved' },
          reviewStatus: { from: 'submitted', to: 'returned' },
          roles: { from: ['analyst'], to: ['analyst', 'quality_manager'] },
          active: { from: true, to: false },
          'standards[2].excluded': { from: null, to: { reason: 'injection error' } },
          copiedFromId: { from: null, to: 'a9bad384-13f5-4a3c-a265-abafa1190000' },
        },
        { 'a9bad384-13f5-4a3c-a265-abafa1190000': '“Nitrate, first validation”' },
      ),
    ).toEqual([
      { field: 'Status', from: 'Awaiting review', to: 'Approved' },
      { field: 'Review status', from: 'Submitted for review', to: 'Returned for changes' },
      { field: 'Roles', from: 'Analyst', to: 'Analyst, Quality manager' },
      { field: 'Account active', from: 'Yes', to: 'No' },
      { field: 'Standard 3 excluded', from: '—', to: 'Reason: injection error' },
      { field: 'Started from study', from: '—', to: '“Nitrate, first validation”' },
    ]);
  });
});
