/**
 * The office settings the head edits (service level, default alpha, letterhead, reminders),
 * stored in offices.settings JSON. The stored letterhead keeps its original keys (office,
 * address) beside the new ones so earlier readers keep working.
 */
import type { Request } from 'express';
import type { OfficeSettings } from '../../shared/api/workflow';
import { staleVersion } from '../middleware/errors';
import type { Office } from '../models/index';
import type { OfficeSettings as StoredSettings } from '../models/office';
import { audit } from './audit';

/** Days before the due date at which a review counts as due soon, when the office sets none. */
export const DEFAULT_DUE_SOON_DAYS = 3;

/** What offices.settings may hold beyond the original shape. */
type StoredExtended = Partial<Omit<StoredSettings, 'letterhead'>> & {
  dueSoonDays?: number;
  letterhead?: Partial<StoredSettings['letterhead']> & { unit?: string; addressLines?: string[]; website?: string };
};

/** The API view of an office's settings, with defaults for anything never set. */
export function toOfficeSettings(o: Office): OfficeSettings {
  const s = (o.settings ?? {}) as StoredExtended;
  const lh: NonNullable<StoredExtended['letterhead']> = s.letterhead ?? {};
  return {
    name: o.name,
    serviceLevelDays: s.serviceLevelDays ?? 15,
    defaultAlpha: s.defaultAlpha ?? 0.05,
    countersignRequired: s.countersignRequired ?? false,
    dueSoonDays: s.dueSoonDays ?? DEFAULT_DUE_SOON_DAYS,
    letterhead: {
      unit: lh.unit ?? lh.office ?? '',
      institution: lh.institution ?? '',
      addressLines: lh.addressLines ?? (lh.address ? lh.address.split(/\r?\n/).filter(Boolean) : []),
      email: lh.email ?? '',
      phone: lh.phone ?? '',
      website: lh.website ?? '',
    },
    version: o.version,
  };
}

/** Saves new settings (optimistic locking on the office's version) and audits the changed fields. */
export async function updateOfficeSettings(o: Office, body: OfficeSettings, actorId: string, req?: Request): Promise<OfficeSettings> {
  if (body.version !== o.version) throw staleVersion();
  const before = toOfficeSettings(o);
  const old = (o.settings ?? {}) as StoredExtended;
  const lh = body.letterhead;
  o.name = body.name;
  o.settings = {
    ...old,
    serviceLevelDays: body.serviceLevelDays,
    defaultAlpha: body.defaultAlpha,
    countersignRequired: body.countersignRequired,
    dueSoonDays: body.dueSoonDays,
    referencePrefix: old.referencePrefix ?? 'REQ',
    letterhead: {
      institution: lh.institution, office: lh.unit, address: lh.addressLines.join('\n'), email: lh.email, phone: lh.phone,
      unit: lh.unit, addressLines: lh.addressLines, website: lh.website,
    },
  } as StoredSettings;
  o.changed('settings', true);
  await o.save();
  const after = toOfficeSettings(o);
  const changed = (Object.keys(after) as (keyof OfficeSettings)[]).filter((k) => k !== 'version' && JSON.stringify(after[k]) !== JSON.stringify(before[k]));
  await audit({ actorId, action: 'office.settings-changed', entityType: 'office', entityId: o.id, details: { fields: changed, before, after } }, req);
  return after;
}
