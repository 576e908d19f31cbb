import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import type { z } from 'zod';

/** A form validator from a shared zod schema: the schema's own message becomes the `zod` error. */
export function zodValidator(schema: z.ZodType): ValidatorFn {
  return (control: AbstractControl): ValidationErrors | null => {
    const r = schema.safeParse(control.value);
    return r.success ? null : { zod: r.error.issues[0]?.message ?? 'This value is not valid.' };
  };
}
