import type { PreparationDto } from '@meritline/shared';
import { newRow, type GridRow } from './grid-sections';

/** "mg/L", "mg / l" and "mg L-1" name the same unit; "µ", "μ" and a leading "u" the same prefix. */
export function normalizeUnit(unit: string): string {
  return unit
    .trim()
    .replace(/\s*\/\s*/g, '/')
    .replace(/\s+(\p{L}+)\s*(-1|⁻¹)$/u, '/$1')
    .replace(/^[uμ]/, 'µ')
    .toLowerCase();
}

export type PreparationFill = { rows: GridRow[] } | { refusal: string };

/** One standards row per working standard of the preparation, its concentration as x; refused when the units differ. */
export function standardsFromPreparation(preparation: PreparationDto, xUnit: string | undefined): PreparationFill {
  const unit = preparation.result.stock.unit;
  if (!xUnit?.trim())
    return { refusal: `The study has no concentration unit yet; set it to ${unit} on the setup step to take these concentrations.` };
  if (normalizeUnit(unit) !== normalizeUnit(xUnit))
    return {
      refusal: `The preparation's concentrations are in ${unit}, the study's in ${xUnit}. Nothing was put in the grid; convert by hand or use a preparation in ${xUnit}.`,
    };
  if (preparation.result.steps.length === 0)
    return { refusal: 'This preparation has no dilutions, so there are no working standards to take.' };
  return {
    rows: preparation.result.steps.map((step) => ({
      ...newRow({ x: String(Number(step.concentration.toPrecision(7))), y: '' }),
      preparationId: preparation.id,
    })),
  };
}

/** A standard whose concentration is typed over no longer comes from its preparation. */
export function dropRetypedPreparations(previous: readonly GridRow[], next: GridRow[]): GridRow[] {
  const before = new Map(previous.map((row) => [row.id, row.cells.x]));
  return next.map((row) => {
    if (!row.preparationId || before.get(row.id) === row.cells.x) return row;
    const { preparationId: _dropped, ...rest } = row;
    return rest;
  });
}
