/**
 * The demo office's review requests, one per demo study plus drafts, in different states.
 * Each study's data and plan come from fixtures/demo/<slug>.csv and <slug>.plan.json.
 */
import type { Criterion, Decision, DesignKind, RequestState, Verdict } from '../../shared/api/types';

/** One seeded request. Day offsets are relative to the seeding day (negative = past). */
export interface DemoRequest {
  reference: string;
  title: string;
  submitter: string;
  department: string;
  designKind: DesignKind | null;
  state: RequestState;
  /** fixtures/demo/<slug>.csv and .plan.json, when the study has data. */
  slug: string | null;
  purpose: string;
  decisionInformed: string;
  audience: string;
  samplingNotes: string;
  reported: { term?: string; text: string }[];
  createdDay: number;
  filedDay: number | null;
  deadlineDay: number | null;
  reviewer: string | null;
  dueDay: number | null;
  decision?: { decision: Decision; conditions: string[]; rationale: string; day: number };
  revisionReason?: string;
  /** Review work already done: a completed rerun (day offset), checklist verdicts, and the signed letter once decided. */
  review?: DemoReview;
}

/** Seeded review work on a request (the seed runs the engine on the study's data for the rerun). */
export interface DemoReview {
  /** Day the reviewer ran the analysis. */
  rerunDay: number;
  /** The reviewer's verdicts and notes, one per criterion. */
  checklist?: { criterion: Criterion; verdict: Verdict; note: string }[];
  /** Whether the decision's letter is signed (on the decision day). */
  letter?: boolean;
}

/** The demo requests (submitter/reviewer are DemoPerson keys, department a department code). */
export const DEMO_REQUESTS: DemoRequest[] = [
  {
    reference: 'HV-2026-001', title: 'Advising pilot: three advising formats and first-year credits', submitter: 'submitter', department: 'SSA',
    designKind: 'between-anova', state: 'decided', slug: 'advising-pilot',
    purpose: 'Compare first-year credits completed across the standard, group and embedded advising formats piloted in the autumn intake.',
    decisionInformed: 'Whether to extend embedded advising to all first-year students next autumn.',
    audience: 'Vice-President for Student Success; budget committee',
    samplingNotes: 'Students were assigned to formats by the last digit of their application number; each student appears once. Advisers worked in one format only.',
    reported: [{ term: 'advising_format', text: 'F(2, 87) = 4.12, p = .020' }],
    createdDay: -60, filedDay: -55, deadlineDay: -20, reviewer: 'reviewer', dueDay: -35,
    decision: { decision: 'endorse-with-conditions', conditions: ['Report Tukey-adjusted comparisons rather than unadjusted t tests.', 'State the effect size with its 95% confidence interval.'], rationale: 'The design and the omnibus test reproduce; pairwise reporting needs adjustment.', day: -38 },
    review: {
      rerunDay: -40,
      letter: true,
      checklist: [
        { criterion: 'independence', verdict: 'met', note: 'Formats were assigned by the last digit of the application number, each student appears once, and advisers worked in one format only.' },
        { criterion: 'variance-homogeneity', verdict: 'met', note: 'Spreads are close across the three formats; the Welch test gives the same conclusion.' },
        { criterion: 'sphericity', verdict: 'not-applicable', note: 'No within-subjects factor.' },
        { criterion: 'multiplicity-control', verdict: 'concern', note: 'The draft report quotes unadjusted pairwise t tests; with Tukey HSD as planned only standard versus embedded advising differs.' },
        { criterion: 'residual-normality', verdict: 'met', note: 'The Q-Q plot of residuals is close to the line; nothing to act on with about 30 students per format.' },
        { criterion: 'outliers', verdict: 'met', note: 'No standardized residual beyond ±3.' },
        { criterion: 'effect-size-precision', verdict: 'concern', note: 'Partial eta squared is reported without an interval; report it, and the pairwise differences, with 95% confidence intervals.' },
        { criterion: 'sample-size-power', verdict: 'met', note: 'About 30 students per format gives adequate power for an effect of the size observed.' },
        { criterion: 'reported-agreement', verdict: 'met', note: 'The reported F and p reproduce from the data; one row with a missing credit count was excluded, as in the submitted analysis.' },
      ],
    },
  },
  {
    reference: 'HV-2026-002', title: 'Writing lab visits: first and last essay scores', submitter: 'analyst-writing', department: 'ENG',
    designKind: 'paired', state: 'assigned', slug: 'writing-lab',
    purpose: 'Check whether essay scores rose between the first and the last graded essay for students who used the writing lab at least three times.',
    decisionInformed: 'Renewal of the writing lab\'s peer-consultant funding.', audience: 'Dean of Humanities',
    samplingNotes: 'All students with three or more lab visits in the spring term; both essays graded blind by the same rubric.',
    reported: [{ text: 't(29) = 2.41, p = .022' }],
    createdDay: -12, filedDay: -10, deadlineDay: 18, reviewer: 'reviewer2', dueDay: 4,
  },
  {
    reference: 'HV-2026-003', title: 'Course modality by term: final scores in introductory statistics', submitter: 'submitter', department: 'SSA',
    designKind: 'between-anova', state: 'filed', slug: 'course-modality',
    purpose: 'Compare final scores across in-person, hybrid and online sections over the autumn and spring terms.',
    decisionInformed: 'The mix of sections scheduled for next year.', audience: 'Academic scheduling group',
    samplingNotes: 'Section enrolment is unbalanced; students chose their section. Each student contributes one final score.',
    reported: [{ term: 'modality', text: 'F(2, 114) = 3.30, p = .040' }],
    createdDay: -4, filedDay: -2, deadlineDay: 30, reviewer: null, dueDay: null,
  },
  {
    reference: 'HV-2026-004', title: 'Student belonging survey: four waves across the first year', submitter: 'submitter', department: 'SSA',
    designKind: 'repeated-measures', state: 'in-review', slug: 'belonging-survey',
    purpose: 'Describe how the sense-of-belonging score changes across four survey waves of the first year.',
    decisionInformed: 'Timing of the mid-year belonging workshop.', audience: 'Student Success leadership team',
    samplingNotes: 'A panel of first-year students answered all four waves; students missing a wave were excluded before analysis.',
    reported: [{ term: 'wave', text: 'F(3, 87) = 5.02, p = .003' }],
    createdDay: -25, filedDay: -21, deadlineDay: 9, reviewer: 'reviewer', dueDay: 2,
    review: { rerunDay: -3 },
  },
  {
    reference: 'HV-2026-005', title: 'Peer tutoring across three midterms, with a comparison group', submitter: 'analyst-support', department: 'LSC',
    designKind: 'mixed', state: 'revision-requested', slug: 'peer-tutoring',
    purpose: 'Compare midterm scores of tutored and non-tutored students over the three midterms of the gateway mathematics course.',
    decisionInformed: 'Whether peer tutoring becomes a standing service of the Learning Support Centre.', audience: 'Provost\'s office',
    samplingNotes: 'Tutoring was voluntary; the comparison group are students in the same sections who did not sign up.',
    reported: [{ term: 'group:midterm', text: 'F(2, 116) = 3.9, p = .02' }],
    createdDay: -30, filedDay: -28, deadlineDay: 14, reviewer: 'reviewer', dueDay: -3,
    revisionReason: 'Report the sphericity check and the correction applied to the midterm effect; describe how tutored students self-selected.',
  },
  {
    reference: 'HV-2026-006', title: 'Advising pilot follow-up: spring cohort', submitter: 'submitter', department: 'SSA',
    designKind: 'between-anova', state: 'draft', slug: null,
    purpose: 'Repeat the advising-format comparison for the spring intake.', decisionInformed: '', audience: '', samplingNotes: '', reported: [],
    createdDay: -1, filedDay: null, deadlineDay: null, reviewer: null, dueDay: null,
  },
  {
    reference: 'HV-2026-007', title: 'Writing lab: second-year follow-up (draft)', submitter: 'analyst-writing', department: 'ENG',
    designKind: 'paired', state: 'draft', slug: null,
    purpose: 'Follow the spring writing-lab users into their second year.', decisionInformed: '', audience: '', samplingNotes: '', reported: [],
    createdDay: -3, filedDay: null, deadlineDay: null, reviewer: null, dueDay: null,
  },
];
