import { HttpParams } from '@angular/common/http';

/**
 * Query parameters for the API's list endpoints (?page=&pageSize=&sort=&<filter>=), leaving out
 * empty values so the server's defaults apply. Never throws.
 * @example listParams({ page: 2, search: '' }).toString(); // 'page=2'
 */
export function listParams(query: Record<string, string | number | undefined>): HttpParams {
  let params = new HttpParams();
  for (const [key, value] of Object.entries(query)) if (value !== undefined && value !== '') params = params.set(key, String(value));
  return params;
}
