#!/usr/bin/env node
import { readFileSync } from 'node:fs';
import { extname } from 'node:path';
import { parseStandardsCsv } from './csv.js';
import { StudyValidationError } from './errors.js';
import { compareResults } from './engine/compare.js';
import { evaluateStudy } from './evaluate.js';
import type { EvaluationResult } from './result.js';

const USAGE = `usage: meritline-evaluate <study.json | standards.csv>
       meritline-evaluate --compare <earlier.json> <later.json> [--margin <percentage points>]

Evaluates a calibration / method-validation study and prints the result as JSON.
A .csv file holds the standards only: two columns x,y with a header line
(with ';' as separator, decimal commas are accepted). Use - to read JSON from stdin.
--compare evaluates two studies (an earlier and a later method version) and prints
their comparison: slopes, intercepts, residual SD, precision, recovery (Welch and
equivalence within the margin, default 5 percentage points), detection limits, range.`;

function fail(lines: string[], code = 2): never {
  process.stderr.write(`${lines.join('\n')}\n`);
  process.exit(code);
}

function readInput(file: string): unknown {
  let text: string;
  try {
    text = readFileSync(file === '-' ? 0 : file, 'utf8');
  } catch (error) {
    fail([`cannot read ${file}: ${(error as Error).message}`]);
  }
  if (extname(file).toLowerCase() === '.csv') return { standards: parseStandardsCsv(text) };
  try {
    return JSON.parse(text);
  } catch (error) {
    fail([`${file} is not valid JSON: ${(error as Error).message}`]);
  }
}

function evaluateFile(file: string): EvaluationResult {
  try {
    return evaluateStudy(readInput(file));
  } catch (error) {
    if (error instanceof StudyValidationError) {
      fail([`${file}: the study cannot be evaluated:`, ...error.errors.map((e) => `  ${e.field}: ${e.message} [${e.code}]`)]);
    }
    fail([`${file}: internal error: ${(error as Error).message}`], 1);
  }
}

function compare(argv: string[]): void {
  const [earlier, later, flag, marginText] = argv;
  if (!earlier || !later || (flag !== undefined && flag !== '--margin')) fail([USAGE]);
  let recoveryMarginPct: number | undefined;
  if (flag === '--margin') {
    recoveryMarginPct = Number(marginText);
    if (!(recoveryMarginPct > 0 && recoveryMarginPct <= 100))
      fail(['--margin takes a number of percentage points above 0 and at most 100']);
  }
  const result = compareResults(evaluateFile(earlier), evaluateFile(later), { recoveryMarginPct });
  process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
}

function main(argv: string[]): void {
  const file = argv[0];
  if (!file || file === '-h' || file === '--help') fail([USAGE], file ? 0 : 2);
  if (file === '--compare') return compare(argv.slice(1));
  process.stdout.write(`${JSON.stringify(evaluateFile(file), null, 2)}\n`);
}

main(process.argv.slice(2));
