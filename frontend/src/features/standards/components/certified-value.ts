import { roundToInterval, type ReferenceMaterialDto } from '@meritline/shared';

/** "0.99992 ± 0.00012 g/g (k = 2)" as on the certificate, or with u when the certificate states u. */
export function certifiedValueWords(m: ReferenceMaterialDto): string {
  if (m.expandedUncertainty !== null && m.coverageFactor !== null) {
    const r = roundToInterval(m.certifiedValue, m.expandedUncertainty);
    return `${r.value} ± ${r.halfWidth} ${m.unit} (k\u00a0=\u00a0${Number(m.coverageFactor.toPrecision(3))})`;
  }
  const r = roundToInterval(m.certifiedValue, m.standardUncertainty);
  return `${r.value} ${m.unit}, u = ${r.halfWidth} ${m.unit}`;
}
