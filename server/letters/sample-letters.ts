/**
 * Demo letters from the invented Harrow Vale scenario, used by the letter specs and for
 * previews. The tutoring and writing-lab letters quote a real rerun of fixtures/demo passed
 * in by the caller; the advising letter carries illustrative figures for layout only (the
 * one-way between-subjects family was not in the engine when it was written).
 */
import { formatBounded, formatP, formatTest } from '../../shared/stats/apa/format';
import type { RerunResult } from '../../shared/stats/contract';
import type { LetterInput } from './letter-input';

const LETTERHEAD: LetterInput['letterhead'] = {
  officeName: 'Office of Institutional Effectiveness',
  unit: 'Harrow Vale Community College',
  addressLines: ['Founders Hall, Room 214', '1200 Orchard Terrace', 'Harrow Vale HV4 7RT'],
  contactLines: ['oie@harrowvale.test', '+44 1632 960 214'],
  logoText: 'HV',
};

const ADVISING_RERUN: RerunResult = {
  engine: '0.1.0',
  design: 'anova',
  n: 60,
  excluded: 0,
  alpha: 0.05,
  descriptives: [
    { levels: { format: 'Standard' }, n: 20, mean: 21.35, sd: 4.12, se: 0.92, ciLower: 19.42, ciUpper: 23.28 },
    { levels: { format: 'Group sessions' }, n: 20, mean: 23.1, sd: 3.87, se: 0.87, ciLower: 21.29, ciUpper: 24.91 },
    { levels: { format: 'Peer-led' }, n: 20, mean: 24.85, sd: 4.41, se: 0.99, ciLower: 22.79, ciUpper: 26.91 },
  ],
  tests: [{ term: 'format', statistic: 'F', value: 3.68, df1: 2, df2: 57, p: 0.0314, ss: 122.5, ms: 61.25, partialEtaSq: 0.114, omegaSq: 0.082 }],
  residual: { ss: 948.7, df: 57, ms: 16.64 },
  assumptions: {
    levene: { center: 'mean', value: 0.31, df1: 2, df2: 57, p: 0.735 },
    brownForsythe: { center: 'median', value: 0.27, df1: 2, df2: 57, p: 0.764 },
    normality: { method: 'shapiro-wilk', W: 0.981, p: 0.472, n: 60 },
    varianceRatio: 1.3,
  },
  comparisons: [
    { factor: 'format', method: 'tukey', a: 'Group sessions', b: 'Standard', estimate: 1.75, se: 1.29, statistic: 1.36, df: 57, p: null, pAdjusted: 0.371, ciLower: -1.35, ciUpper: 4.85 },
    { factor: 'format', method: 'tukey', a: 'Peer-led', b: 'Standard', estimate: 3.5, se: 1.29, statistic: 2.71, df: 57, p: null, pAdjusted: 0.024, ciLower: 0.4, ciUpper: 6.6 },
    { factor: 'format', method: 'tukey', a: 'Peer-led', b: 'Group sessions', estimate: 1.75, se: 1.29, statistic: 1.36, df: 57, p: null, pAdjusted: 0.371, ciLower: -1.35, ciUpper: 4.85 },
  ],
  power: [{ term: 'format', metric: 'f', observed: 0.36, power: 0.66, detectable80: 0.41, alpha: 0.05 }],
  outliers: [],
  warnings: [],
};

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

/** Letter for the three-format advising pilot (one-way between, Tukey HSD). */
export function advisingLetter(code: string, url: string, result: RerunResult = ADVISING_RERUN): LetterInput {
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
    dataset: { filename: 'advising-pilot-2025.csv', sha256: 'a3f1c9e07b5d4a26c8e1f09b7d3a5c2e4f6081b9d7c5a3e1f0b2d4c6a8e0f1b3', rows: 60 },
    plan: {
      designKind: 'between-anova',
      outcome: 'credits_completed',
      factors: [{ name: 'format', levels: ['Standard', 'Group sessions', 'Peer-led'], kind: 'between' }],
      subject: null,
      alpha: 0.05,
      comparisons: ['format: Tukey HSD'],
    },
    rerun: { engineVersion: '0.1.0', rerunId: 'run-0007-02', dataHash: 'a3f1c9e07b5d4a26c8e1f09b7d3a5c2e4f6081b9d7c5a3e1f0b2d4c6a8e0f1b3', result },
    checklist: [
      { criterion: 'independence', verdict: 'met', reviewerNote: 'Students were assigned to one format each by advisor caseload; no student appears twice.', automaticFinding: 'No repeated identifiers across groups.' },
      { criterion: 'variance-homogeneity', verdict: 'met', reviewerNote: 'Spreads are similar across formats.', automaticFinding: "Levene p = .735; variance ratio 1.30." },
      { criterion: 'sphericity', verdict: 'not-applicable', reviewerNote: 'No within-subjects factor.', automaticFinding: null },
      { criterion: 'multiplicity-control', verdict: 'met', reviewerNote: 'Tukey HSD as planned over all three pairs.', automaticFinding: 'Family of 3; method used matches the plan.' },
      { criterion: 'residual-normality', verdict: 'met', reviewerNote: 'Q-Q plot shows no systematic departure.', automaticFinding: 'Shapiro–Wilk W = .981, p = .472.' },
      { criterion: 'outliers', verdict: 'met', reviewerNote: 'None.', automaticFinding: 'No standardized residual beyond ±3.' },
      { criterion: 'effect-size-precision', verdict: 'concern', reviewerNote: 'The report gives η²p without an interval; the pairwise intervals are wide and should be reported with the differences.', automaticFinding: 'η²p = .114; Peer-led − Standard 3.50 [0.40, 6.60].' },
      { criterion: 'sample-size-power', verdict: 'concern', reviewerNote: 'With 20 students per format the pilot detects only medium-to-large effects; say so in the limitations.', automaticFinding: 'Power .66 at the observed f = .36; f detectable at 80%: .41.' },
      { criterion: 'reported-agreement', verdict: 'met', reviewerNote: 'Reported F and p reproduce.', automaticFinding: 'F(2, 57) = 3.68, p = .031: consistent.' },
    ],
    decision: 'endorse-with-conditions',
    conditions: [
      'Report the pairwise differences with their Tukey-adjusted 95% intervals, not only the p-values.',
      'State in the limitations that the pilot had about two chances in three to detect an effect of the observed size.',
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
