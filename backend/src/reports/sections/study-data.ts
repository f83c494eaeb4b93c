import {
  blankValue,
  describeCriterion,
  lowSpikeExclusion,
  mdlBlankValue,
  spikeValue,
  type MdlBlank,
  type Spike,
  type StudyInput,
} from '@meritline/shared';
import { colors, NOT_AVAILABLE, type PdfComposer } from '../pdf/index.js';
import type { ReportContent } from '../report-content.js';
import { STUDY_DATA_ATTACHMENT } from './methods.js';
import { xUnit, yUnit } from './common.js';

const value = (v: number | null | undefined) => (v === null || v === undefined ? 'no result' : String(v));
const list = (values: (number | null)[]) => values.map(value).join(', ');

/** The inputs exactly as stored (not rounded), so the numbers can be re-entered anywhere. */
export function studyDataAppendix(pdf: PdfComposer, content: ReportContent): void {
  const data: StudyInput = content.study.data;
  const x = xUnit(content);
  const y = yUnit(content);
  pdf.newPage();
  pdf.heading('Appendix: study data as evaluated');
  pdf.paragraph(`Values as entered, unrounded. The same data are attached as ${STUDY_DATA_ATTACHMENT}.`, { color: colors.muted });
  pdf.keyValues(
    [
      ['Units', `x: ${x}; y: ${y}`],
      ['Model and weighting', `${data.model ?? 'linear'}, ${data.weighting ?? 'none'}${data.twoPoint?.bracketing ? ', bracketing' : ''}`],
      ['Confidence level C / α', `${data.confidence ?? 0.95} / ${data.alpha ?? 0.05}`],
      ['Mass fraction (Horwitz)', data.massFraction === undefined ? NOT_AVAILABLE : String(data.massFraction)],
    ],
    { labelWidth: 150, size: 8.5 },
  );
  if (data.standards?.length) {
    pdf.table({
      caption: 'Standards',
      columns: [
        { header: 'Standard', width: 0.7, align: 'right' },
        { header: 'Id', width: 0.9 },
        { header: `x (${x})`, align: 'right' },
        { header: `y (${y})`, align: 'right' },
        { header: 'SD of y', width: 0.8, align: 'right' },
        { header: 'Excluded because', width: 2.6 },
      ],
      rows: data.standards.map((s, i) => [
        String(i + 1),
        s.id ?? '',
        String(s.x),
        String(s.y),
        s.sd === undefined ? '' : String(s.sd),
        s.excluded?.reason ?? '',
      ]),
      fontSize: 8,
    });
  }
  const lines: [string, string][] = [];
  if (data.blanks?.length) {
    const excluded = data.blanks.flatMap((b, i) => (typeof b !== 'number' && b.excluded ? [`blank ${i + 1}`] : []));
    const note = excluded.length ? `; excluded: ${excluded.join(', ')}` : '';
    lines.push([`Blanks (${y})`, `${list(data.blanks.map(blankValue))}${note}`]);
  }
  if (data.lowSpikes) {
    const excludedOf = (entries: readonly (Spike | MdlBlank)[], noun: string) => {
      const excluded = entries.flatMap((entry, i) => (lowSpikeExclusion(entry) ? [`${noun} ${i + 1}`] : []));
      return excluded.length ? `; excluded: ${excluded.join(', ')}` : '';
    };
    const { spiked, blanks } = data.lowSpikes;
    lines.push([`Low-level spikes (${x})`, `${list(spiked.map(spikeValue))}${excludedOf(spiked, 'spike')}`]);
    if (blanks) lines.push([`Method blanks (${x})`, `${list(blanks.map(mdlBlankValue))}${excludedOf(blanks, 'method blank')}`]);
  }
  for (const u of data.unknowns ?? [])
    lines.push([`Sample ${u.id} (${y})`, `${list(u.y)}${u.dilution && u.dilution !== 1 ? `; dilution ${u.dilution}` : ''}`]);
  for (const c of data.checks ?? []) lines.push([`Check ${c.id} (${y})`, `${list(c.y)}; nominal ${c.nominal} ${x}`]);
  if (lines.length) pdf.keyValues(lines, { labelWidth: 150, size: 8.5 });
  if (data.recovery?.length) {
    pdf.table({
      caption: 'Spiked samples',
      columns: [
        { header: 'Sample' },
        { header: 'Level' },
        { header: `Added (${x})`, align: 'right' },
        { header: `Native (${x})`, align: 'right' },
        { header: `Found (${x})`, align: 'right' },
      ],
      rows: data.recovery.map((r) => [r.id, r.level ?? '', String(r.added), String(r.native ?? 0), String(r.found)]),
      fontSize: 8,
    });
  }
  if (data.precision?.length) {
    const groups = [...new Set(data.precision.map((p) => p.group))];
    pdf.keyValues(
      groups.map((group) => [`Precision, ${group} (${x})`, list(data.precision!.filter((p) => p.group === group).map((p) => p.value))]),
      { labelWidth: 150, size: 8.5 },
    );
  }
  if (data.accuracy?.length) {
    const accuracy = data.accuracy;
    const cells = [...new Set(accuracy.map((a) => `${a.level}\u0000${a.series}`))];
    pdf.keyValues(
      cells.map((cell) => {
        const [level, series] = cell.split('\u0000');
        const items = accuracy.filter((a) => a.level === level && a.series === series);
        return [`Accuracy, ${level}, ${series} (${x})`, `nominal ${items[0].nominal}; found ${list(items.map((a) => a.found))}`];
      }),
      { labelWidth: 150, size: 8.5 },
    );
  }
  const options: [string, string][] = [];
  if (data.accuracyProfile)
    options.push(['Accuracy profile β / λ', `${data.accuracyProfile.beta ?? 0.8} / ${data.accuracyProfile.lambda ?? 10} %`]);
  if (data.uncertainty) {
    const u = data.uncertainty;
    options.push([
      'Uncertainty options',
      `k ${u.coverageFactor ?? 2}; relative from ${u.relativeAbove === undefined ? 'every level' : `${u.relativeAbove} ${x}`}; u(nominal) ${u.uReferencePct ?? 0} %`,
    ]);
  }
  if (data.referenceMaterial) {
    const rm = data.referenceMaterial;
    options.push([
      `Reference material (${x})`,
      `certified ${rm.certified}, standard uncertainty ${rm.uCertified}; found ${list(rm.results)}`,
    ]);
  }
  if (options.length) pdf.keyValues(options, { labelWidth: 150, size: 8.5 });
  if (data.criteria?.length) {
    pdf.heading('Acceptance criteria as evaluated', 3);
    pdf.bullets(
      data.criteria.map((c) => describeCriterion(c, { x, y: yUnit(content) })),
      { size: 8.5 },
    );
  }
}
