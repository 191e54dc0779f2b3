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

  clients(): Observable<Page<ClientRow>> {
    return this.http.get<Page<ClientRow>>('/api/clients', { params: { pageSize: 200 } });
  }
}
