import { AbstractControl, FormControl, FormGroup, ValidationErrors, ValidatorFn, Validators } from '@angular/forms';
import type { OfficeSettings } from '../../../shared/api/workflow';

/** Whole number between min and max (inclusive). */
export function wholeNumber(min: number, max: number): ValidatorFn {
  return (c: AbstractControl): ValidationErrors | null => {
    const v = c.value;
    if (v === null || v === '' || v === undefined) return { required: true };
    const n = Number(v);
    if (!Number.isInteger(n)) return { whole: true };
    if (n < min || n > max) return { range: { min, max } };
    return null;
  };
}

/** Alpha strictly between 0 and 0.5. */
export const alphaValidator: ValidatorFn = (c) => {
  const v = c.value;
  if (v === null || v === '' || v === undefined) return { required: true };
  const n = Number(v);
  return Number.isFinite(n) && n > 0 && n < 0.5 ? null : { alpha: true };
};

/** An optional web address starting with http:// or https://. */
export const websiteValidator: ValidatorFn = (c) =>
  !c.value || /^https?:\/\/[^\s/$.?#].[^\s]*$/i.test(String(c.value)) ? null : { website: true };

// The due-soon warning must start before the service level ends, or every request would be "due soon" at once.
const dueSoonBeforeSla: ValidatorFn = (g) => {
  const sla = Number(g.get('serviceLevelDays')?.value);
  const soon = Number(g.get('dueSoonDays')?.value);
  return Number.isInteger(sla) && sla >= 1 && Number.isInteger(soon) && soon >= sla ? { dueSoonTooLong: true } : null;
};

/** Builds the settings form with its validators. */
export function buildSettingsForm() {
  return new FormGroup(
    {
      name: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(200)] }),
      serviceLevelDays: new FormControl<number | null>(null, wholeNumber(1, 365)),
      dueSoonDays: new FormControl<number | null>(null, wholeNumber(1, 60)),
      defaultAlpha: new FormControl<number | null>(null, alphaValidator),
      countersignRequired: new FormControl(false, { nonNullable: true }),
      letterhead: new FormGroup({
        unit: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(200)] }),
        institution: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(200)] }),
        addressLines: new FormControl('', { nonNullable: true, validators: [maxLines(6, 200)] }),
        email: new FormControl('', { nonNullable: true, validators: [Validators.email, Validators.maxLength(160)] }),
        phone: new FormControl('', { nonNullable: true, validators: [Validators.pattern(/^[0-9+()\-.\s]{0,60}$/)] }),
        website: new FormControl('', { nonNullable: true, validators: [websiteValidator] }),
      }),
    },
    { validators: dueSoonBeforeSla },
  );
}

/** The form's type. */
export type SettingsForm = ReturnType<typeof buildSettingsForm>;

/** At most `lines` non-empty lines of at most `width` characters each. */
export function maxLines(lines: number, width: number): ValidatorFn {
  return (c) => {
    const parts = String(c.value ?? '').split('\n').map((l) => l.trim()).filter(Boolean);
    if (parts.length > lines) return { lines: { max: lines } };
    if (parts.some((l) => l.length > width)) return { lineWidth: { max: width } };
    return null;
  };
}

/** Puts saved settings into the form. */
export function fillSettingsForm(form: SettingsForm, s: OfficeSettings): void {
  form.reset({
    name: s.name,
    serviceLevelDays: s.serviceLevelDays,
    dueSoonDays: s.dueSoonDays,
    defaultAlpha: s.defaultAlpha,
    countersignRequired: s.countersignRequired,
    letterhead: { ...s.letterhead, addressLines: s.letterhead.addressLines.join('\n') },
  });
}

/** Reads the form back into the API shape. */
export function settingsFromForm(form: SettingsForm, version: number): OfficeSettings {
  const v = form.getRawValue();
  return {
    name: v.name.trim(),
    serviceLevelDays: Number(v.serviceLevelDays),
    dueSoonDays: Number(v.dueSoonDays),
    defaultAlpha: Number(v.defaultAlpha),
    countersignRequired: v.countersignRequired,
    letterhead: {
      unit: v.letterhead.unit.trim(),
      institution: v.letterhead.institution.trim(),
      addressLines: v.letterhead.addressLines.split('\n').map((l) => l.trim()).filter(Boolean),
      email: v.letterhead.email.trim(),
      phone: v.letterhead.phone.trim(),
      website: v.letterhead.website.trim(),
    },
    version,
  };
}

/** Human names of the fields, used in messages. */
export const FIELD_NAMES: Record<string, string> = {
  name: 'Office name',
  serviceLevelDays: 'Service-level days',
  dueSoonDays: 'Due-soon warning',
  defaultAlpha: 'Default alpha',
  'letterhead.unit': 'Unit',
  'letterhead.institution': 'Institution',
  'letterhead.addressLines': 'Address',
  'letterhead.email': 'E-mail',
  'letterhead.phone': 'Phone',
  'letterhead.website': 'Website',
};

/** The message for a field's first error, naming the field. */
export function fieldMessage(path: string, errors: ValidationErrors | null): string | null {
  if (!errors) return null;
  const name = FIELD_NAMES[path] ?? path;
  if (errors['server']) return String(errors['server']);
  if (errors['required']) return `${name} is required.`;
  if (errors['whole']) return `${name} must be a whole number of days.`;
  if (errors['range']) return `${name} must be between ${errors['range'].min} and ${errors['range'].max} days.`;
  if (errors['alpha']) return `${name} must be a number above 0 and below 0.5 (usually 0.05).`;
  if (errors['maxlength']) return `${name} can be at most ${errors['maxlength'].requiredLength} characters.`;
  if (errors['email']) return `${name} must be an e-mail address such as office@college.example.`;
  if (errors['pattern']) return `${name} may contain only digits, spaces and + ( ) - .`;
  if (errors['website']) return `${name} must start with https:// (or http://).`;
  if (errors['lines']) return `${name} can have at most ${errors['lines'].max} lines.`;
  if (errors['lineWidth']) return `Each ${name.toLowerCase()} line can be at most ${errors['lineWidth'].max} characters.`;
  return `${name} is not valid.`;
}
