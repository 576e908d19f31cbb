/** Mapping SSO attributes to roles, and normalising single- and multi-valued attributes. */
import { describe, expect, it } from 'vitest';
import type { RoleMapping } from '../../shared/api/types';
import { normaliseAttributes } from '../auth/saml';
import { rolesFromAttributes } from './role-mappings';

const MAPPINGS: RoleMapping[] = [
  { id: '1', attribute: 'isMemberOf', value: 'oie-reviewers', role: 'reviewer' },
  { id: '2', attribute: 'isMemberOf', value: 'oie-head', role: 'head' },
  { id: '3', attribute: 'eduPersonAffiliation', value: 'staff', role: 'submitter' },
];

describe('normaliseAttributes', () => {
  it('turns single values into one-element lists and keeps lists, dropping empty values and profile fields', () => {
    const out = normaliseAttributes({
      nameID: 'a@demo.test', issuer: 'idp', sessionIndex: 's',
      mail: 'a@demo.test', isMemberOf: ['oie-reviewers', ' oie-head ', ''], eduPersonAffiliation: 'staff', empty: '',
    });
    expect(out).toEqual({ mail: ['a@demo.test'], isMemberOf: ['oie-reviewers', 'oie-head'], eduPersonAffiliation: ['staff'] });
  });

  it('reads the attributes object when the profile carries one', () => {
    expect(normaliseAttributes({ nameID: 'x', attributes: { mail: 'x@demo.test' } })).toEqual({ mail: ['x@demo.test'] });
  });
});

describe('rolesFromAttributes', () => {
  it('grants every mapped role, in canonical order, without repeats', () => {
    expect(rolesFromAttributes(MAPPINGS, { isMemberOf: ['oie-head', 'oie-reviewers'], eduPersonAffiliation: ['staff', 'member'] }))
      .toEqual(['submitter', 'reviewer', 'head']);
  });

  it('matches attribute names case-insensitively and scoped affiliations by their unscoped part', () => {
    expect(rolesFromAttributes(MAPPINGS, { edupersonaffiliation: ['staff@harrowvale.test'] })).toEqual(['submitter']);
  });

  it('matches values exactly otherwise', () => {
    expect(rolesFromAttributes(MAPPINGS, { isMemberOf: ['OIE-REVIEWERS', 'oie-reviewers-old'] })).toEqual([]);
  });
});
