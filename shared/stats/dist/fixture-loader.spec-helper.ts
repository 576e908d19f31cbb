/** Loads the R reference fixtures written by test/reference/dist/generate-dist.R (test-only helper). */
import { readFileSync } from 'node:fs';

/** Parsed JSON of one fixture file in test/reference/dist. */
export function loadDistFixture(name: string): any {
  return JSON.parse(readFileSync(new URL(`../../../test/reference/dist/${name}`, import.meta.url), 'utf8'));
}

/** Running maximum of absolute and relative errors, for the accuracy figures the specs print. */
export class ErrorTally {
  maxAbs = 0;
  maxRel = 0;
  count = 0;
  /** Records one comparison; relative error only where |expected| ≥ relFloor. */
  add(actual: number, expected: number, relFloor = 1e-300): void {
    const abs = Math.abs(actual - expected);
    this.count++;
    if (!(abs <= this.maxAbs)) this.maxAbs = abs;
    if (Math.abs(expected) >= relFloor) {
      const rel = abs / Math.abs(expected);
      if (!(rel <= this.maxRel)) this.maxRel = rel;
    }
  }
  /** One-line summary. */
  toString(): string {
    return `${this.count} values, max abs ${this.maxAbs.toExponential(2)}, max rel ${this.maxRel.toExponential(2)}`;
  }
}
