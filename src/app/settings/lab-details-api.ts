import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { MailSettingsBody } from '../../../shared/schemas/organization';

/**
 * The lab's details as printed on its reports (ISO/IEC 17025:2017 7.8.2.1 b: the laboratory's
 * name and address), with the contact and accreditation lines of the report's first page.
 */
export interface LabDetails {
  name: string;
  code: string;
  addressLines: string[];
  email: string | null;
  phone: string | null;
  accreditation: string | null;
}

export type LabDetailsBody = Omit<LabDetails, 'code'>;

/** The lab's choices for the e-mails it sends its clients (shared/schemas/organization.ts). */
export type MailSettings = MailSettingsBody;

/**
 * GET and PUT /api/organization: the active organization's own record. The contract follows the
 * organizations table (server/db/models/organization.ts); the code is fixed once reports carry it.
 * GET and PUT /api/organization/mail-settings: the lab's e-mail choices (lab administrators only).
 */
@Injectable({ providedIn: 'root' })
export class LabDetailsApi {
  private readonly http = inject(HttpClient);

  get(): Observable<LabDetails> {
    return this.http.get<LabDetails>('/api/organization');
  }

  save(body: LabDetailsBody): Observable<LabDetails> {
    return this.http.put<LabDetails>('/api/organization', body);
  }

  mailSettings(): Observable<MailSettings> {
    return this.http.get<MailSettings>('/api/organization/mail-settings');
  }

  saveMailSettings(body: MailSettings): Observable<MailSettings> {
    return this.http.put<MailSettings>('/api/organization/mail-settings', body);
  }
}
