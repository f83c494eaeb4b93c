import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { fitCalibration, type FitOptions } from '../engine/calibration.js';
import { evaluateStudy } from '../evaluate.js';
import { typicalStudy } from './helpers.js';

/** Invented standards: a slightly curved response with replicate scatter, `levels` × `replicates`. */
function standards(levels: number, replicates: number, withSd = false) {
  return Array.from({ length: levels * replicates }, (_, i) => {
    const level = Math.floor(i / replicates);
    const x = 0.5 * (level + 1) ** 1.3;
    const y = 0.02 + 0.31 * x + 0.0004 * x * x + 0.003 * x * Math.sin(7 * i + 1) + 0.001 * Math.cos(3 * i);
    return withSd ? { x, y, sd: 0.002 + 0.004 * x } : { x, y };
  });
}

const excluded = typicalStudy.standards.map((s, i) => (i === 4 || i === 11 ? { ...s, excluded: { reason: 'injection fault' } } : s));

const STUDIES: Record<string, unknown> = {
  typical: typicalStudy,
  'typical, weighting 1/x': { ...typicalStudy, weighting: '1/x' },
  'typical, weighting 1/x2, 99 %': { ...typicalStudy, weighting: '1/x2', confidence: 0.99 },
  'typical, quadratic': { ...typicalStudy, model: 'quadratic' },
  'typical, through the origin': { ...typicalStudy, model: 'linear-through-origin' },
  'typical, two excluded standards': { ...typicalStudy, standards: excluded },
  'weighting 1/s2': { standards: standards(6, 3, true), weighting: '1/s2', blanks: [0.01, 0.012, 0.009, 0.011] },
  'one-point': {
    model: 'one-point',
    standards: [
      { x: 5, y: 1.52 },
      { x: 5, y: 1.55 },
    ],
    unknowns: [{ id: 'U', y: [0.9] }],
  },
  'two-point, bracketing': {
    model: 'two-point',
    twoPoint: { bracketing: true },
    standards: standards(4, 2),
    unknowns: [{ id: 'U', y: [1.1, 1.2] }],
  },
  '5,000 standards': { standards: standards(500, 10), unknowns: [{ id: 'U', y: [10, 10.2] }] },
};

/**
 * SHA-256 of the result JSON of each study, recorded with the engine before its per-point tables moved
 * into typed arrays: the figures, their order and their formatting must not change with speed work.
 */
const EXPECTED: Record<string, string> = {
  typical: 'e1a15d5ee8094a8a58b0b17ad72d51749dc02b1a28b3d3e5ddea0575083df3e8',
  'typical, weighting 1/x': 'f4679b204d4f05f9d929a92637a9051cf28b75bb32f2f879b63fc5389c057ee0',
  'typical, weighting 1/x2, 99 %': '310899b6aa422412c2b988cb979ef7a61b59e36596ac7b974bbf3de46ea7501f',
  'typical, quadratic': '599f79b0d7b83af3122d0ac4532f5645128fb900f5f7740ce1249a410dd81242',
  'typical, through the origin': 'fc849bf06f9294e3e175e417e85247667e7457c2de317e868ae5cf82d405eed5',
  'typical, two excluded standards': '8a777f485dcab9507a69fd440dd2616becc85345f75fe2377d7437c081f8e821',
  'weighting 1/s2': 'e1566eec50798cba9f98784b159eadaecc3a10c17024af3c7cc8202a8188ea9c',
  'one-point': 'b579471ff27fa4d8afcd411cbe98af6cf8d49aa59aa36b23550fec56a4e7d6d7',
  'two-point, bracketing': '0668571246705e9c4305b48191d5be22300d32dc6ae1e374428988d7075359d6',
  '5,000 standards': 'f72df09481432a539150fe01ce45407f3234008ca8558a185c38aac7cb48f312',
};

describe('result JSON of fixed studies', () => {
  for (const [name, study] of Object.entries(STUDIES)) {
    it(`is unchanged: ${name}`, () => {
      const hash = createHash('sha256')
        .update(JSON.stringify(evaluateStudy(study)))
        .digest('hex');
      expect(hash).toBe(EXPECTED[name]);
    });
  }
});

/** Above the study's list bound: the calibration section alone, 20,000 standards at 1,000 levels. */
const CALIBRATIONS: [FitOptions, string][] = [
  [{}, '74d421203e090a848f3531644e577a4bde42425c3268813ff5298a9314cd785b'],
  [{ model: 'quadratic', weighting: '1/x' }, 'e270fe6f21c97ffbf6e287bb3fbc8bc4bd79178704927a3084f44a75cb3f2738'],
];

describe('calibration JSON of a large fit', () => {
  const data = Array.from({ length: 20_000 }, (_, i) => {
    const x = 1 + (i % 1000) / 10;
    return { x, y: 0.5 + 2 * x + 0.01 * Math.sin(i) };
  });
  for (const [options, expected] of CALIBRATIONS) {
    it(`is unchanged: ${JSON.stringify(options)}`, () => {
      const hash = createHash('sha256')
        .update(JSON.stringify(fitCalibration(data, options).calibration))
        .digest('hex');
      expect(hash).toBe(expected);
    });
  }
});
