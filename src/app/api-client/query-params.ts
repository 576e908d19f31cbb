import { HttpParams } from '@angular/common/http';

/** Builds HttpParams from a flat object, leaving out empty values so URLs stay short. */
export function toQueryParams(query: object): HttpParams {
  let params = new HttpParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === null || value === '') continue;
    if (Array.isArray(value)) {
      if (value.length) params = params.set(key, value.join(','));
      continue;
    }
    params = params.set(key, String(value));
  }
  return params;
}
