import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { RunState } from '../../../shared/runs/run-state';
import type { CalibrationStatus } from '../../../shared/schemas/instruments';

/** One entry of the lab's audit log as the home page shows it. */
export interface ActivityEntry {
  id: string;
  at: string;
  who: { userId: string; displayName: string | null } | null;
  action: string;
  entity: string;
  entityId: string | null;
}

/** GET /api/home (server/home/routes.ts): the four panels of the lab home in one answer. */
export interface LabHome {
  runsByState: Record<RunState, number>;
  awaitingMyReview: { id: string; number: string; state: RunState; updatedAt: string; engineerId: string | null; manufacturer: string; model: string; serialNumber: string; client: string }[];
  calibrationDue: { id: string; name: string; model: string; serialNumber: string; calibrationDue: string; certificateRef: string; calibrationStatus: CalibrationStatus }[];
  recentActivity: ActivityEntry[];
}

@Injectable({ providedIn: 'root' })
export class HomeApi {
  private readonly http = inject(HttpClient);

  home(): Observable<LabHome> {
    return this.http.get<LabHome>('/api/home');
  }
}
