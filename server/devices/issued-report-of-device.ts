import { QueryTypes } from 'sequelize';
import { Device } from '../db/models';

/**
 * The number of the first report issued on this device, or null when none was. Withdrawn and
 * superseded reports count: they were issued and still name the item (ISO/IEC 17025:2017 7.8.8).
 * Walks device -> plans -> runs -> reports on indexes that lead with organization_id (0003).
 */
export async function issuedReportOfDevice(organizationId: string, deviceId: string): Promise<string | null> {
  const rows = await Device.sequelize!.query<{ reportNumber: string }>(
    `SELECT r.report_number AS "reportNumber"
       FROM test_plans p
       JOIN test_runs t ON t.organization_id = p.organization_id AND t.plan_id = p.id
       JOIN reports r ON r.organization_id = t.organization_id AND r.run_id = t.id
      WHERE p.organization_id = :org AND p.device_id = :device
      ORDER BY r.issued_at
      LIMIT 1`,
    { replacements: { org: organizationId, device: deviceId }, type: QueryTypes.SELECT },
  );
  return rows[0]?.reportNumber ?? null;
}
