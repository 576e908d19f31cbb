import { describe, it, expect } from 'vitest';
import { scanForIdentifiers } from './identifier-scan';

// Invented values throughout; the patterns are our own heuristics (common practice for de-identification checks).
describe('scanForIdentifiers', () => {
  it('flags e-mail columns by content even under an innocent name', () => {
    const f = scanForIdentifiers(['contact', 'score'], [['ana@demo.test', 'bo@demo.test', 'cy@demo.test'], ['1', '2', '3']]);
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({ column: 'contact', kind: 'email', matchShare: 1 });
    expect(f[0].reason).toContain('contact');
  });

  it('flags identifier column names with an empty sample', () => {
    const f = scanForIdentifiers(['Student ID', 'DOB', 'group'], [[], [], ['a']]);
    expect(f.map((x) => x.kind)).toEqual(['student-id', 'date-of-birth']);
  });

  it('flags SSN-shaped values and name-shaped values', () => {
    const f = scanForIdentifiers(['x', 'who'], [['123-45-6789', '987-65-4321'], ['Marta Quill', 'Ode Farrow', 'Lin Ashby']]);
    expect(f.map((x) => x.kind)).toEqual(['national-id', 'person-name']);
  });

  it('does not flag pseudonymous subject codes, factors or scores', () => {
    const f = scanForIdentifiers(['subject', 'format', 'credits'], [['S0001', 'S0002', 'S0003'], ['online', 'hybrid', 'in-person'], ['24', '27.5', 'NA']]);
    expect(f).toEqual([]);
  });

  it('needs a majority of matching values before flagging by content', () => {
    const f = scanForIdentifiers(['note'], [['ok', 'fine', 'a@b.test', 'x', 'y']]);
    expect(f).toEqual([]);
  });
});
