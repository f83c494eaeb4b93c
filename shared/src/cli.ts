#!/usr/bin/env node
import { readFileSync } from 'node:fs';
import { extname } from 'node:path';
import { parseStandardsCsv } from './csv.js';
import { StudyValidationError } from './errors.js';
import { evaluateStudy } from './evaluate.js';

const USAGE = `usage: meritline-evaluate <study.json | standards.csv>

Evaluates a calibration / method-validation study and prints the result as JSON.
A .csv file holds the standards only: two columns x,y with a header line
(with ';' as separator, decimal commas are accepted). Use - to read JSON from stdin.`;

function fail(lines: string[], code = 2): never {
  process.stderr.write(`${lines.join('\n')}\n`);
  process.exit(code);
}

function main(argv: string[]): void {
  const file = argv[0];
  if (!file || file === '-h' || file === '--help') fail([USAGE], file ? 0 : 2);
  let text: string;
  try {
    text = readFileSync(file === '-' ? 0 : file, 'utf8');
  } catch (error) {
    fail([`cannot read ${file}: ${(error as Error).message}`]);
  }
  try {
    let input: unknown;
    if (extname(file).toLowerCase() === '.csv') {
      input = { standards: parseStandardsCsv(text) };
    } else {
      try {
        input = JSON.parse(text);
      } catch (error) {
        fail([`${file} is not valid JSON: ${(error as Error).message}`]);
      }
    }
    process.stdout.write(`${JSON.stringify(evaluateStudy(input), null, 2)}\n`);
  } catch (error) {
    if (error instanceof StudyValidationError) {
      fail([`${file}: the study cannot be evaluated:`, ...error.errors.map((e) => `  ${e.field}: ${e.message} [${e.code}]`)]);
    }
    fail([`${file}: internal error: ${(error as Error).message}`], 1);
  }
}

main(process.argv.slice(2));
