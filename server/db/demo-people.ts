/**
 * The invented people of the Harrow Vale demo office: local accounts for the seed and
 * the attributes the fake identity provider asserts for them. All names are fictional;
 * addresses use the reserved .test domain.
 */
import type { Role } from '../../shared/api/types';

/** A department of the demo college. */
export interface DemoDepartment { code: string; name: string }

/** Departments of the demo college. */
export const DEMO_DEPARTMENTS: DemoDepartment[] = [
  { code: 'OIE', name: 'Office of Institutional Effectiveness' },
  { code: 'SSA', name: 'Student Success and Advising' },
  { code: 'ENG', name: 'English and Writing' },
  { code: 'ACA', name: 'Academic Affairs' },
  { code: 'LSC', name: 'Learning Support Centre' },
];

/** One demo person. */
export interface DemoPerson {
  /** Key used in the fake IdP picker. */
  key: string;
  email: string;
  name: string;
  department: string;
  /** Roles of the local account. */
  roles: Role[];
  /** Whether the person is one of the five advertised demo accounts. */
  advertised: boolean;
  /** Methods expertise (design kinds) for reviewer suggestions. */
  expertise?: string[];
  /** Attributes the fake IdP asserts; single strings on purpose for some, to exercise normalisation. */
  sso: Record<string, string | string[]>;
}

/** Everyone in the demo office. */
export const DEMO_PEOPLE: DemoPerson[] = [
  {
    key: 'submitter', email: 'submitter@demo.test', name: 'Dana Whitcombe', department: 'SSA', roles: ['submitter'], advertised: true,
    sso: { eduPersonAffiliation: ['staff', 'member'], isMemberOf: 'hv-analysts', department: 'Student Success and Advising' },
  },
  {
    key: 'reviewer', email: 'reviewer@demo.test', name: 'Tomasz Reyes-Hallam', department: 'OIE', roles: ['reviewer'], advertised: true,
    expertise: ['two-independent', 'between-anova', 'mixed', 'regression'],
    sso: { eduPersonAffiliation: ['staff', 'member'], isMemberOf: ['oie-staff', 'oie-reviewers'], department: 'Office of Institutional Effectiveness' },
  },
  {
    key: 'reviewer2', email: 'reviewer2@demo.test', name: 'Imani Castellanos', department: 'OIE', roles: ['reviewer'], advertised: true,
    expertise: ['paired', 'repeated-measures', 'mixed'],
    sso: { eduPersonAffiliation: 'staff', isMemberOf: ['oie-staff', 'oie-reviewers'], department: 'Office of Institutional Effectiveness' },
  },
  {
    key: 'head', email: 'head@demo.test', name: 'Ruth Abernethy-Osei', department: 'OIE', roles: ['head'], advertised: true,
    sso: { eduPersonAffiliation: ['staff', 'member'], isMemberOf: ['oie-staff', 'oie-head'], department: 'Office of Institutional Effectiveness' },
  },
  {
    key: 'admin', email: 'admin@demo.test', name: 'Felix Marchetti', department: 'OIE', roles: ['admin'], advertised: true,
    sso: { eduPersonAffiliation: 'staff', isMemberOf: 'oie-admins', department: 'Office of Institutional Effectiveness' },
  },
  {
    key: 'analyst-writing', email: 'owen.tarrant@demo.test', name: 'Owen Tarrant', department: 'ENG', roles: ['submitter'], advertised: false,
    sso: { eduPersonAffiliation: ['faculty', 'member'], isMemberOf: 'hv-analysts', department: 'English and Writing' },
  },
  {
    key: 'analyst-support', email: 'priya.lindqvist@demo.test', name: 'Priya Lindqvist', department: 'LSC', roles: ['submitter'], advertised: false,
    sso: { eduPersonAffiliation: 'staff', isMemberOf: 'hv-analysts', department: 'Learning Support Centre' },
  },
  {
    key: 'reviewer-emeritus', email: 'august.mbeki-rowe@demo.test', name: 'August Mbeki-Rowe', department: 'OIE', roles: ['reviewer', 'submitter'], advertised: false,
    expertise: ['one-sample', 'paired', 'regression'],
    sso: { eduPersonAffiliation: 'staff', isMemberOf: ['oie-reviewers', 'hv-analysts'], department: 'Office of Institutional Effectiveness' },
  },
];

/** People who exist only at the fake IdP: their first SSO sign-in creates the account (just in time). */
export const SSO_ONLY_PEOPLE: DemoPerson[] = [
  {
    key: 'newcomer', email: 'lena.okafor-strand@demo.test', name: 'Lena Okafor-Strand', department: 'ACA', roles: [], advertised: false,
    sso: { eduPersonAffiliation: 'staff', isMemberOf: 'hv-analysts', department: 'Academic Affairs' },
  },
  {
    key: 'visitor', email: 'visiting.scholar@demo.test', name: 'Jonas Verhoeven', department: 'ACA', roles: [], advertised: false,
    sso: { eduPersonAffiliation: 'affiliate', department: 'Academic Affairs' },
  },
];

/** Role mappings the demo office uses for the fake IdP's groups. */
export const DEMO_ROLE_MAPPINGS: { attribute: string; value: string; role: Role }[] = [
  { attribute: 'isMemberOf', value: 'hv-analysts', role: 'submitter' },
  { attribute: 'isMemberOf', value: 'oie-reviewers', role: 'reviewer' },
  { attribute: 'isMemberOf', value: 'oie-head', role: 'head' },
  { attribute: 'isMemberOf', value: 'oie-admins', role: 'admin' },
];
