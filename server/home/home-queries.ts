/**
 * The four queries behind the lab's home page, as SQL so the volume test can EXPLAIN exactly
 * what the route runs. Each names organization_id = :org itself: the row-level-security policy
 * is an OR with the system switch, which the planner cannot turn into an index condition, so the
 * explicit predicate is what lets each query start from an index that leads with organization_id.
 *
 * Plans seen with EXPLAIN ANALYZE at 100,000 runs (and as many readings and audit entries) in
 * each of two labs sharing the tables (server/home/home-volume.spec.ts checks the plan shapes):
 * - RUNS_BY_STATE counts every run of the lab, so it reads the lab's whole range: an index scan
 *   with Index Cond organization_id = :org (about 50 ms here), or a sequential scan when the lab
 *   is a large share of the table and that is cheaper (same time, the planner's choice). Without
 *   the explicit predicate the only plan is a scan of every lab's rows.
 * - AWAITING_REVIEW: Index Scan on test_runs_org_state_updated (organization_id, state =
 *   'in-review') in updated_at DESC order, each candidate's NOT EXISTS an index probe of
 *   readings_org_run_case, stopping at the LIMIT inside the CTE; only those 20 rows are joined
 *   to plans, devices and clients. 1.7 ms, against 158 ms when the LIMIT sat after the joins
 *   (all 2,000 runs in review were joined, then sorted).
 * - CALIBRATION_DUE: Bitmap Index Scan on instruments_org_due (organization_id, calibration_due
 *   <= :soon), 0.1 ms.
 * - RECENT_ACTIVITY: Index Scan on audit_log_org_at (organization_id, at DESC) with an incremental
 *   sort for the id tie-break (entries of one transaction share `at`), stopping after 10 rows;
 *   0.3 ms. audit_log has no row-level security, so the predicate is also its tenant boundary.
 */

export const RUNS_BY_STATE = `
  SELECT state, count(*)::int AS n
    FROM test_runs
   WHERE organization_id = :org
   GROUP BY state`;

/**
 * Runs waiting for review that the caller neither owns as engineer nor took a reading on (four
 * eyes). The LIMIT sits inside, on test_runs alone, so only the rows shown are joined.
 */
export const AWAITING_REVIEW = `
  WITH waiting AS MATERIALIZED (
    SELECT r.id, r.number, r.state, r.updated_at, r.engineer_id, r.plan_id
      FROM test_runs r
     WHERE r.organization_id = :org AND r.state = 'in-review'
       AND r.engineer_id IS DISTINCT FROM :me
       AND NOT EXISTS (SELECT 1 FROM readings x WHERE x.organization_id = :org AND x.run_id = r.id AND x.entered_by = :me)
     ORDER BY r.updated_at DESC
     LIMIT :limit)
  SELECT w.id, w.number, w.state, w.updated_at AS "updatedAt", w.engineer_id AS "engineerId",
         d.manufacturer, d.model, d.serial_number AS "serialNumber", c.name AS client
    FROM waiting w
    JOIN test_plans p ON p.organization_id = :org AND p.id = w.plan_id
    JOIN devices d ON d.organization_id = :org AND d.id = p.device_id
    JOIN clients c ON c.organization_id = :org AND c.id = d.client_id
   ORDER BY w.updated_at DESC`;

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
