/** A column title with its unit. */
export function headerWithUnit(label: string, unit: string) {
  return `${label} (${unit})`;
}
