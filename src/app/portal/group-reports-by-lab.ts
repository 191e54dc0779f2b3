import type { ReportRow } from '../reports/reports-api';

export interface DeviceReports {
  /** "Manufacturer Model" as printed on the report. */
  device: string;
  serialNumber: string;
  reports: ReportRow[];
}

export interface LabReports {
  lab: string;
  devices: DeviceReports[];
  /** Reports of this lab that are current (neither withdrawn nor superseded). */
  currentCount: number;
}

/**
 * A manufacturer's reports arranged as the portal shows them: by issuing laboratory (A to Z),
 * then by device and serial number (A to Z), each device's reports newest first. A report with
 * no lab or device in its summary is grouped under "Unnamed". Pure; an empty list gives [].
 * @example groupReportsByLab(rows)[0].devices[0].reports[0].reportNumber // newest of the first device
 */
export function groupReportsByLab(rows: readonly ReportRow[]): LabReports[] {
  const labs = new Map<string, Map<string, DeviceReports>>();
  for (const r of rows) {
    const lab = r.summary.lab?.trim() || 'Unnamed laboratory';
    const device = r.summary.device?.trim() || 'Unnamed device';
    const serial = r.summary.serialNumber?.trim() || '—';
    const devices = labs.get(lab) ?? new Map<string, DeviceReports>();
    labs.set(lab, devices);
    const key = `${device}\u0000${serial}`;
    const entry = devices.get(key) ?? { device, serialNumber: serial, reports: [] };
    devices.set(key, entry);
    entry.reports.push(r);
  }
  const byText = (a: string, b: string) => a.localeCompare(b, 'en', { sensitivity: 'base', numeric: true });
  return [...labs.entries()]
    .sort(([a], [b]) => byText(a, b))
    .map(([lab, devices]) => {
      const list = [...devices.values()].sort((a, b) => byText(a.device, b.device) || byText(a.serialNumber, b.serialNumber));
      for (const d of list) d.reports.sort((a, b) => b.issuedAt.localeCompare(a.issuedAt) || b.revision - a.revision);
      return { lab, devices: list, currentCount: list.reduce((n, d) => n + d.reports.filter((r) => r.status === 'current').length, 0) };
    });
}
