import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { CreateDeviceBody } from '../../../shared/schemas/records';
import type { Page } from '../runs/runs-api';

export interface DeviceRow extends CreateDeviceBody {
  id: string;
  createdAt: string;
}
export interface ClientRow {
  id: string;
  name: string;
  contactName: string;
  contactEmail: string;
}

@Injectable({ providedIn: 'root' })
export class DevicesApi {
  private readonly http = inject(HttpClient);

  list(query: { page?: number; pageSize?: number; search?: string } = {}): Observable<Page<DeviceRow>> {
    let params = new HttpParams();
    for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== '') params = params.set(k, String(v));
    return this.http.get<Page<DeviceRow>>('/api/devices', { params });
  }

  create(body: CreateDeviceBody): Observable<DeviceRow> {
    return this.http.post<DeviceRow>('/api/devices', body);
  }

  get(id: string): Observable<DeviceRow> {
    return this.http.get<DeviceRow>(`/api/devices/${encodeURIComponent(id)}`);
  }

  /** Replaces the record; once a report is issued on the device its identification is refused with 409. */
  update(id: string, body: CreateDeviceBody): Observable<DeviceRow> {
    return this.http.put<DeviceRow>(`/api/devices/${encodeURIComponent(id)}`, body);
  }

  clients(): Observable<Page<ClientRow>> {
    return this.http.get<Page<ClientRow>>('/api/clients', { params: { pageSize: 200 } });
  }
}
