/**
 * Looks for columns that hold direct identifiers (names, e-mail addresses,
 * national or student ID numbers, dates of birth) in an uploaded table, so the
 * filing form can block submission until the submitter removes them or says why
 * they are needed. Heuristics: column names and the shape of the values. A
 * subject column of pseudonymous codes under a neutral name (subject, code, id)
 * is not flagged; a column whose name says it holds student IDs is flagged even
 * when its values are codes, because only the submitter can say whether they
 * are real institutional IDs (the reason tells them how to confirm).
 */

/** Kinds of direct identifier we look for. */
export type IdentifierKind = 'email' | 'person-name' | 'national-id' | 'student-id' | 'date-of-birth' | 'phone' | 'postal-address';

/** One flagged column with the reason in plain words. */
export interface IdentifierFinding {
  column: string;
  kind: IdentifierKind;
  /** Share of non-empty sampled values that matched the pattern (0–1), or null when flagged by name only. */
  matchShare: number | null;
  reason: string;
}

const NAME_HINTS: { kind: IdentifierKind; re: RegExp; label: string }[] = [
  { kind: 'email', re: /e-?mail/i, label: 'an e-mail address' },
  { kind: 'person-name', re: /^(first|last|given|family|full|student|sur)?[ _-]?name$|^surname$|^forename$/i, label: "a person's name" },
  { kind: 'national-id', re: /\b(ssn|social[ _-]?security|national[ _-]?(id|insurance)|nin|passport|tax[ _-]?id|sin)\b/i, label: 'a national ID number' },
  { kind: 'student-id', re: /\b(student[ _-]?(id|number|no)|matric(ulation)?[ _-]?(no|number)?|banner[ _-]?id|emplid)\b/i, label: 'an institutional student ID' },
  { kind: 'date-of-birth', re: /\b(dob|date[ _-]?of[ _-]?birth|birth[ _-]?date|birthday)\b/i, label: 'a date of birth' },
  { kind: 'phone', re: /\b(phone|mobile|cell|tel(ephone)?)\b/i, label: 'a telephone number' },
  { kind: 'postal-address', re: /\b(address|street|postcode|zip[ _-]?code)\b/i, label: 'a postal address' },
];

const VALUE_PATTERNS: { kind: IdentifierKind; re: RegExp; label: string }[] = [
  { kind: 'email', re: /^[^\s@]+@[^\s@]+\.[^\s@]{2,}$/, label: 'e-mail addresses' },
  { kind: 'national-id', re: /^\d{3}-\d{2}-\d{4}$/, label: 'numbers shaped like US social security numbers (123-45-6789)' },
  { kind: 'national-id', re: /^[A-CEGHJ-PR-TW-Z]{2}\d{6}[A-D]$/i, label: 'numbers shaped like UK national insurance numbers' },
  { kind: 'phone', re: /^\+?\(?\d{1,4}\)?[\s.-]?\d{3,4}[\s.-]?\d{3,4}$/, label: 'telephone numbers' },
  { kind: 'date-of-birth', re: /^(19[3-9]\d|20[01]\d)-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, label: 'calendar dates from 1930–2019, which in a student file are likely birth dates' },
  { kind: 'person-name', re: /^[A-Z][a-z'’-]+(,)?\s+[A-Z][a-z'’-]+$/, label: 'two capitalised words, the shape of a person\'s name' },
];

/** Share of values that must match a pattern before a column is flagged by its content. */
export const VALUE_MATCH_THRESHOLD = 0.6;

/**
 * Scans a table given column-major cell strings. Only the first `sampleSize`
 * non-empty values of each column are examined, which keeps large uploads fast.
 */
export function scanForIdentifiers(header: string[], columns: string[][], sampleSize = 500): IdentifierFinding[] {
  const findings: IdentifierFinding[] = [];
  header.forEach((name, i) => {
    const values: string[] = [];
    for (const v of columns[i] ?? []) {
      const t = v.trim();
      if (t !== '' && t.toUpperCase() !== 'NA') values.push(t);
      if (values.length >= sampleSize) break;
    }
    let flagged: IdentifierFinding | null = null;
    for (const p of VALUE_PATTERNS) {
      if (values.length === 0) break;
      const share = values.filter((v) => p.re.test(v)).length / values.length;
      if (share >= VALUE_MATCH_THRESHOLD) {
        flagged = { column: name, kind: p.kind, matchShare: share, reason: `${Math.round(share * 100)}% of the values in column "${name}" look like ${p.label}.` };
        break;
      }
    }
    if (!flagged) {
      const hint = NAME_HINTS.find((h) => h.re.test(name.trim()));
      if (hint) {
        const codes = hint.kind === 'student-id' ? ' If the values are pseudonymous codes made for this analysis, confirm that; if they are real student numbers, replace them.' : '';
        flagged = { column: name, kind: hint.kind, matchShare: null, reason: `The column name "${name}" suggests it holds ${hint.label}.${codes}` };
      }
    }
    if (flagged) findings.push(flagged);
  });
  return findings;
}
