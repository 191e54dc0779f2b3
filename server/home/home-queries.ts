/**
 * The four queries behind the lab's home page, as SQL so the volume test can EXPLAIN exactly
 * what the route runs. Each names organization_id = :org itself: the row-level-security policy
 * is an OR with the system switch, which the planner cannot turn into an index condition, so the
 * explicit predicate is what lets each query start from an index that leads with organization_id.
 *
 * Plans seen with EXPLAIN on 100,000 runs in one lab (server/home/home-volume.spec.ts):
 * - RUNS_BY_STATE: Index Only Scan on test_runs_org_state_updated (organization_id = :org), then a
 *   GroupAggregate over the index order; reads the lab's index entries only, never the heap of
 *   other labs. Cost grows with the lab's own runs (about 10-30 ms at 100,000).
 * - AWAITING_REVIEW: Index Scan on test_runs_org_state_updated (organization_id, state =
 *   'in-review') in updated_at DESC order, stopping at the LIMIT; the NOT EXISTS probes
 *   readings_org_run_case per candidate run; plans, devices and clients join by primary key.
 * - CALIBRATION_DUE: Index Scan on instruments_org_due (organization_id, calibration_due <= :soon).
 * - RECENT_ACTIVITY: Index Scan on audit_log_org_at (organization_id, at DESC) stopping after 10
 *   rows; users join by primary key. audit_log has no row-level security, so the predicate on
 *   organization_id is also what confines it to the lab.
 */

export const RUNS_BY_STATE = `
  SELECT state, count(*)::int AS n
    FROM test_runs
   WHERE organization_id = :org
   GROUP BY state`;

/** Runs waiting for review that the caller neither owns as engineer nor took a reading on (four eyes). */
export const AWAITING_REVIEW = `
  SELECT r.id, r.number, r.state, r.updated_at AS "updatedAt", r.engineer_id AS "engineerId",
         d.manufacturer, d.model, d.serial_number AS "serialNumber", c.name AS client
    FROM test_runs r
    JOIN test_plans p ON p.id = r.plan_id
    JOIN devices d ON d.id = p.device_id
    JOIN clients c ON c.id = d.client_id
   WHERE r.organization_id = :org AND r.state = 'in-review'
     AND r.engineer_id IS DISTINCT FROM :me
     AND NOT EXISTS (SELECT 1 FROM readings x WHERE x.organization_id = :org AND x.run_id = r.id AND x.entered_by = :me)
   ORDER BY r.updated_at DESC
   LIMIT :limit`;

export const CALIBRATION_DUE = `
  SELECT id, name, model, serial_number AS "serialNumber", calibration_due AS "calibrationDue", certificate_ref AS "certificateRef"
    FROM instruments
   WHERE organization_id = :org AND calibration_due <= :soon
   ORDER BY calibration_due, name
   LIMIT :limit`;

export const RECENT_ACTIVITY = `
  SELECT a.id, a.action, a.entity, a.entity_id AS "entityId", a.at, a.user_id AS "userId", u.display_name AS "displayName"
    FROM audit_log a
    LEFT JOIN users u ON u.id = a.user_id
   WHERE a.organization_id = :org
   ORDER BY a.at DESC, a.id DESC
   LIMIT 10`;
