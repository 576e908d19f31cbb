/**
 * Demo letters from the invented Harrow Vale scenario, used by the letter specs and for
 * previews. Every letter quotes a real rerun of the demo data in fixtures/demo (the caller
 * passes the tutoring and writing-lab results; the advising one is computed here).
 */
import { formatBounded, formatP, formatTest } from '../../shared/stats/apa/format';
import type { RerunResult } from '../../shared/stats/contract';
import type { LetterInput } from './letter-input';
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { rerunFromText } from '../../shared/stats/rerun';

const LETTERHEAD: LetterInput['letterhead'] = {
  officeName: 'Office of Institutional Effectiveness',
  unit: 'Harrow Vale Community College',
  addressLines: ['Founders Hall, Room 214', '1200 Orchard Terrace', 'Harrow Vale HV4 7RT'],
  contactLines: ['oie@harrowvale.test', '+44 1632 960 214'],
  logoText: 'HV',
};

/** The advising pilot rerun: the real engine on the demo data (fixtures/demo/advising-pilot.*). */
export function advisingRerun(): RerunResult {
  const dir = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'fixtures', 'demo');
  const plan: unknown = JSON.parse(readFileSync(join(dir, 'advising-pilot.plan.json'), 'utf8'));
  return rerunFromText(plan, readFileSync(join(dir, 'advising-pilot.csv'), 'utf8'));
}

/** Levels of a factor in the order the rerun's cells list them. */
function levelsOf(result: RerunResult, factor: string): string[] {
  return [...new Set(result.descriptives.map((d) => d.levels[factor]).filter((v): v is string => v !== undefined))];
}

/** The rerun's test for a term; a sample letter needs it to quote real figures. */
function testFor(result: RerunResult, term: string) {
  const t = result.tests.find((row) => row.term === term);
  if (!t) throw new Error(`The rerun has no test for ${term}.`);
  return t;
}

/** Letter for the three-format advising pilot (one-way between, Tukey HSD), quoting the real rerun. */
export function advisingLetter(code: string, url: string, result: RerunResult = advisingRerun()): LetterInput {
  const format = testFor(result, 'advising_format');
  const a = result.assumptions;
  const power = result.power?.find((p) => p.term === 'advising_format');
  return {
    letterhead: LETTERHEAD,
    request: {
      id: 'req-0007',
      reference: 'HV-2026-007',
      title: 'Advising format pilot: first-year credits completed',
      purpose: 'The Student Success Committee will decide in spring whether to extend one of three advising formats to all first-year students. The analysis compares credits completed in the first year across the three formats of the pilot.',
    },
    submitter: { name: 'Priya Okonkwo-Hale', email: 'p.okonkwo-hale@harrowvale.test' },
    reviewer: { name: 'Dr Tomasz Reinholt', email: 't.reinholt@harrowvale.test', role: 'Methods reviewer' },
    countersigner: null,
    dates: { filed: '2026-10-05T09:12:00Z', decided: '2026-10-21T15:40:00Z', signed: '2026-10-21T16:02:00Z' },
    dataset: { filename: 'advising-pilot.csv', sha256: '', rows: result.n + result.excluded },
    plan: {
      designKind: 'between-anova',
      outcome: 'credits_completed',
      factors: [{ name: 'advising_format', levels: levelsOf(result, 'advising_format'), kind: 'between' }],
      subject: null,
      alpha: result.alpha,
      comparisons: ['advising_format: Tukey HSD'],
    },
    rerun: { engineVersion: result.engine, rerunId: 'run-0007-02', dataHash: '', result },
    checklist: [
      { criterion: 'independence', verdict: 'met', reviewerNote: 'Students were assigned to one format each by advisor caseload; no student appears twice.', automaticFinding: 'No repeated identifiers across groups.' },
      { criterion: 'variance-homogeneity', verdict: 'met', reviewerNote: 'Spreads are similar across formats.', automaticFinding: a?.brownForsythe ? `Brown–Forsythe ${formatP(a.brownForsythe.p)}.` : null },
      { criterion: 'sphericity', verdict: 'not-applicable', reviewerNote: 'No within-subjects factor.', automaticFinding: null },
      { criterion: 'multiplicity-control', verdict: 'met', reviewerNote: 'Tukey HSD as planned over all three pairs.', automaticFinding: 'Family of 3; method used matches the plan.' },
      { criterion: 'residual-normality', verdict: 'met', reviewerNote: 'Q-Q plot shows no systematic departure.', automaticFinding: a?.normality ? `Shapiro–Wilk W = ${formatBounded(a.normality.W, 3)}, ${formatP(a.normality.p)}.` : null },
      { criterion: 'outliers', verdict: 'met', reviewerNote: 'None needs attention.', automaticFinding: `${(result.outliers ?? []).length} standardized residual(s) beyond ±3.` },
      { criterion: 'effect-size-precision', verdict: 'concern', reviewerNote: 'The report gives the F test without an effect size; add it with the pairwise differences and their intervals.', automaticFinding: `Rerun: ${formatTest(format)}.` },
      { criterion: 'sample-size-power', verdict: 'concern', reviewerNote: 'With about thirty students per format the pilot detects only medium-to-large effects; say so in the limitations.', automaticFinding: power ? `Power ${formatBounded(power.power, 2)} at the observed f; f detectable with 80% power: ${formatBounded(power.detectable80, 2)}.` : null },
      { criterion: 'reported-agreement', verdict: 'met', reviewerNote: 'Reported F and p reproduce.', automaticFinding: null },
    ],
    decision: 'endorse-with-conditions',
    conditions: [
      'Report the pairwise differences with their Tukey-adjusted 95% intervals, not only the p-values.',
      'State in the limitations which effect sizes the pilot could detect with reasonable power.',
    ],
    summary: 'The one-way analysis of variance fits the design, its assumptions hold, and the reported results reproduce from the data.',
    verification: { code, url },
    version: 1,
    supersedes: null,
  };
}

/** Letter for the peer-tutoring programme (mixed: group between, midterm within, Holm), quoting the given rerun. */
export function tutoringLetter(code: string, url: string, result: RerunResult): LetterInput {
  const midterm = testFor(result, 'midterm');
  const interaction = testFor(result, 'group:midterm');
  const normality = result.assumptions?.normality;
  const outliers = result.outliers ?? [];
  return {
    letterhead: LETTERHEAD,
    request: {
      id: 'req-0011',
      reference: 'HV-2026-011',
      title: 'Peer tutoring across three midterms, with a comparison group',
      purpose: 'The Mathematics department asks whether scores of tutored students rose more across the three midterms than those of a comparison group, for its annual programme report to the Academic Board.',
    },
    submitter: { name: 'Marcus Bellweather', email: 'm.bellweather@harrowvale.test' },
    reviewer: { name: 'Dr Aiyana Castellanos', email: 'a.castellanos@harrowvale.test', role: 'Senior methods reviewer' },
    countersigner: { name: 'Prof. Helen Achterberg', email: 'h.achterberg@harrowvale.test', role: 'Head of office' },
    dates: { filed: '2026-09-14T10:00:00Z', decided: '2026-10-02T11:20:00Z', signed: '2026-10-02T12:45:00Z' },
    dataset: { filename: 'peer-tutoring.csv', sha256: '', rows: result.n + result.excluded },
    plan: {
      designKind: 'mixed',
      outcome: 'score',
      factors: [
        { name: 'group', levels: levelsOf(result, 'group'), kind: 'between' },
        { name: 'midterm', levels: levelsOf(result, 'midterm'), kind: 'within' },
      ],
      subject: 'student_id',
      alpha: result.alpha,
      comparisons: ['midterm: Holm'],
    },
    rerun: { engineVersion: result.engine, rerunId: 'run-0011-03', dataHash: '', result },
    checklist: [
      { criterion: 'independence', verdict: 'concern', reviewerNote: 'Tutored students chose to enrol; the comparison group is not randomised. The report must not claim the programme caused the gain.', automaticFinding: 'Each subject sits in one group only.' },
      { criterion: 'variance-homogeneity', verdict: 'met', reviewerNote: 'Spreads are similar across groups at every midterm.', automaticFinding: null },
      {
        criterion: 'sphericity', verdict: 'met', reviewerNote: 'Sphericity is not rejected; uncorrected degrees of freedom are appropriate.',
        automaticFinding: midterm.sphericity ? `Mauchly W = ${formatBounded(midterm.sphericity.W, 3)}, ${formatP(midterm.sphericity.p)}.` : null,
      },
      { criterion: 'multiplicity-control', verdict: 'met', reviewerNote: 'Holm over the three midterm pairs, as planned.', automaticFinding: 'Family of 3; method used matches the plan.' },
      { criterion: 'residual-normality', verdict: 'met', reviewerNote: '', automaticFinding: normality ? `Shapiro–Wilk W = ${formatBounded(normality.W, 3)}, ${formatP(normality.p)}.` : null },
      { criterion: 'outliers', verdict: 'met', reviewerNote: 'No case needs attention.', automaticFinding: `${outliers.length} standardized residual${outliers.length === 1 ? '' : 's'} beyond ±3.` },
      { criterion: 'effect-size-precision', verdict: 'met', reviewerNote: 'Generalized η² is reported for every term.', automaticFinding: null },
      { criterion: 'sample-size-power', verdict: 'concern', reviewerNote: 'About 25 students per group give limited power for the interaction; say so when describing the size of the difference.', automaticFinding: null },
      { criterion: 'reported-agreement', verdict: 'not-met', reviewerNote: 'The draft reports F(2, 98) = 4.61 for the interaction, which does not reproduce.', automaticFinding: `Rerun: ${formatTest(interaction)}.` },
    ],
    decision: 'endorse-with-conditions',
    conditions: [
      `Report the group × midterm interaction as recomputed: ${formatTest(interaction)}.`,
      'Describe the comparison group as self-selected and avoid causal wording.',
    ],
    summary: null,
    verification: { code, url },
    version: 1,
    supersedes: null,
  };
}

/** Letter for the writing-lab visit study (paired first and last essay); the rerun result is required. */
export function writingLabLetter(code: string, url: string, result: RerunResult): LetterInput {
  return {
    letterhead: LETTERHEAD,
    request: {
      id: 'req-0009',
      reference: 'HV-2026-009',
      title: 'Writing-lab visits: first and last essay scores',
      purpose: 'The English department wants to state in its accreditation self-study whether essay scores of students who used the writing lab changed between the first and the last graded essay of the term.',
    },
    submitter: { name: 'Rosalind Fairweather-Ng', email: 'r.fairweather-ng@harrowvale.test' },
    reviewer: { name: 'Dr Tomasz Reinholt', email: 't.reinholt@harrowvale.test', role: 'Methods reviewer' },
    countersigner: null,
    dates: { filed: '2026-09-28T08:30:00Z', decided: '2026-10-09T13:10:00Z', signed: '2026-10-09T13:25:00Z' },
    dataset: { filename: 'writing-lab.csv', sha256: '', rows: result.n + result.excluded },
    plan: {
      designKind: 'paired',
      outcome: 'score',
      factors: [{ name: 'essay', levels: levelsOf(result, 'essay'), kind: 'within' }],
      subject: 'student_id',
      alpha: 0.05,
      comparisons: [],
    },
    rerun: { engineVersion: result.engine, rerunId: 'run-0009-01', dataHash: '', result },
    checklist: [
      { criterion: 'independence', verdict: 'met', reviewerNote: 'One pair of essays per student; students wrote independently.', automaticFinding: 'Each subject has exactly one first and one last essay.' },
      {
        criterion: 'residual-normality', verdict: 'met', reviewerNote: 'With about forty pairs the t test tolerates the mild skew flagged here, and the rank-based test agrees.',
        automaticFinding: result.assumptions?.normality ? `Shapiro–Wilk W = ${formatBounded(result.assumptions.normality.W, 3)}, ${formatP(result.assumptions.normality.p)}.` : null,
      },
      { criterion: 'effect-size-precision', verdict: 'met', reviewerNote: 'dz and its interval are reported.', automaticFinding: null },
      { criterion: 'reported-agreement', verdict: 'met', reviewerNote: 'The reported t and p reproduce.', automaticFinding: null },
    ],
    decision: 'endorse',
    conditions: [],
    summary: null,
    verification: { code, url },
    version: 1,
    supersedes: null,
  };
}
