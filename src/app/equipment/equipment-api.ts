import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { CalibrationStatus, InstrumentBody } from '../../../shared/schemas/instruments';
import type { Page } from '../runs/runs-api';
import { listParams } from '../settings/list-params';

/** An instrument of the register with its status today (server/instruments/instrument-presenter.ts). */
export interface Instrument extends InstrumentBody {
  id: string;
  calibrationStatus: CalibrationStatus;
  createdAt: string;
  updatedAt: string;
}

export interface InstrumentQuery {
  page?: number;
  pageSize?: number;
  sort?: string;
  /** One status or several joined by commas, e.g. 'due-soon,overdue'. */
  status?: string;
  search?: string;
}

/** The lab's equipment register (/api/instruments). */
@Injectable({ providedIn: 'root' })
export class EquipmentApi {
  private readonly http = inject(HttpClient);

  list(query: InstrumentQuery = {}): Observable<Page<Instrument>> {
    return this.http.get<Page<Instrument>>('/api/instruments', { params: listParams({ ...query }) });
  }

  get(id: string): Observable<Instrument> {
    return this.http.get<Instrument>(`/api/instruments/${encodeURIComponent(id)}`);
  }

  create(body: InstrumentBody): Observable<Instrument> {
    return this.http.post<Instrument>('/api/instruments', body);
  }

  /** Replaces the whole record (a new calibration, a corrected certificate). */
  update(id: string, body: InstrumentBody): Observable<Instrument> {
    return this.http.put<Instrument>(`/api/instruments/${encodeURIComponent(id)}`, body);
  }
}
