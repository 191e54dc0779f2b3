import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page, RunInstrument } from './runs-api';

/** Read access to the lab's equipment register (GET /api/instruments), for choosing what a run used. */
@Injectable({ providedIn: 'root' })
export class InstrumentRegisterApi {
  private readonly http = inject(HttpClient);

  /** Up to 200 instruments by name; `search` matches name, model, serial number or certificate. */
  list(search = ''): Observable<Page<RunInstrument>> {
    let params = new HttpParams().set('pageSize', 200).set('sort', 'name');
    if (search.trim()) params = params.set('search', search.trim());
    return this.http.get<Page<RunInstrument>>('/api/instruments', { params });
  }
}
