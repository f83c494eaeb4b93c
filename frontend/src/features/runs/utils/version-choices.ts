import { METHOD_VERSION_STATUS_LABELS, type RunMethodChoiceDto } from '@meritline/shared';
import type { SelectOptionGroup } from '@/components/select-control';

/**
 * Methods and their versions for one drop-down list: a version's id, or with `allowMethods` also `method:<id>` for all
 * versions of a method (a filter of runs). Versions that cannot take new runs only with `includeUnusable` (past runs).
 */
export function versionChoices(
  methods: readonly RunMethodChoiceDto[],
  { allowMethods = false, includeUnusable = true }: { allowMethods?: boolean; includeUnusable?: boolean } = {},
): SelectOptionGroup[] {
  return methods.map((method) => ({
    label: method.name,
    options: [
      ...(allowMethods ? [{ value: `method:${method.id}`, label: `${method.name}: every version` }] : []),
      ...method.versions
        .filter((v) => includeUnusable || v.usable)
        .map((v) => ({
          value: v.id,
          label: `${method.name}, version ${v.number} (${METHOD_VERSION_STATUS_LABELS[v.status].toLowerCase()}${v.status === 'active' && !v.usable ? ', not validated' : ''})`,
        })),
    ],
  }));
}
