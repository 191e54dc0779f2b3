/** Gather a run's records into the plain ReportDocument the PDF template takes. */
import { Client, Device, Organization, Result, TestCase, TestPlan, TestRun, User } from '../db/models';
import type { ReportDocument, ReportResult } from '../../templates/report/report-document';
import { TEST_KIND_LABELS } from '../../shared/rules/test-kind';
import { ENGINE_VERSION } from '../../shared/engine-version';
import type { RuleSetBody } from '../../shared/rules/rule-set';
import type { Verdict } from '../../shared/uncertainty/decision-rule';
import { ROLE_LABELS } from '../../shared/access/roles';
import { assignedInstruments } from '../instruments/run-instruments';

export async function buildReportDocument(input: {
  run: TestRun;
  reportNumber: string;
  revision: number;
  replaces?: { reportNumber: string; reason: string };
  issuedAt: Date;
  authorizedBy: User;
  verificationUrl: string;
}): Promise<{ doc: ReportDocument; clientOrganizationId: string | null; contactEmail: string; contactName: string; verdicts: Verdict[] }> {
  const { run } = input;
  const plan = (await TestPlan.findByPk(run.planId))!;
  const device = (await Device.findByPk(plan.deviceId))!;
  const client = (await Client.findByPk(device.clientId))!;
  const lab = (await Organization.findByPk(run.organizationId))!;
  const engineer = run.engineerId ? await User.findByPk(run.engineerId) : null;
  const cases = await TestCase.findAll({ where: { planId: plan.id }, order: [['position', 'ASC']] });
  const results = await Result.findAll({ where: { organizationId: run.organizationId, runId: run.id }, order: [['createdAt', 'DESC']] });
  const rules = plan.ruleSetSnapshot as RuleSetBody & { name?: string; version?: number };
  const rows: ReportResult[] = cases.map((c) => {
    const r = results.find((x) => x.testCaseId === c.id);
    const params = c.parameters as { frequencyHz?: number; sideband?: string; powerLevel?: string | null };
    const point = [params.frequencyHz ? `${(params.frequencyHz / 1e6).toFixed(4)} MHz` : null, params.sideband, params.powerLevel].filter(Boolean).join(', ');
    return {
      testName: `${TEST_KIND_LABELS[c.kind]}: ${c.label}`,
      testPoint: point,
      value: r?.value ?? null,
      unit: r?.unit?.startsWith('dB') ? 'dB' : (r?.unit ?? ''),
      limit: (r?.detail as { limitText?: string } | undefined)?.limitText ?? 'No result',
      margin: r?.margin ?? null,
      expandedUncertainty: r?.expandedUncertainty ?? null,
      coverageFactor: r?.coverageFactor ?? null,
      verdict: (r?.verdict as ReportResult['verdict']) ?? 'not-evaluated',
    };
  });
  const today = (d: Date | string | null | undefined) => (d ? new Date(d).toISOString().slice(0, 10) : '');
  const decisionRuleText = (results[0]?.detail as { decisionRuleText?: string } | undefined)?.decisionRuleText ?? '';
  const doc: ReportDocument = {
    reportNumber: input.reportNumber,
    revision: input.revision,
    replaces: input.replaces,
    title: 'Test report: HF single-sideband transmitter',
    lab: {
      name: lab.name,
      addressLines: lab.addressLines,
      accreditation: lab.accreditation ?? undefined,
      email: lab.email ?? undefined,
      phone: lab.phone ?? undefined,
    },
    testSite: (lab.settings as { testSite?: string }).testSite ?? `${lab.name}, permanent laboratory`,
    client: { name: client.name, addressLines: client.addressLines, contactName: client.contactName, contactEmail: client.contactEmail },
    device: {
      manufacturer: device.manufacturer,
      model: device.model,
      serialNumber: device.serialNumber,
      firmware: device.firmware ?? undefined,
      ratedPepW: device.ratedPepW,
      emissionDesignator: device.emissionDesignator,
      frequencyRange: `${(device.frequencyMinHz / 1e6).toFixed(3)}-${(device.frequencyMaxHz / 1e6).toFixed(3)} MHz`,
      modes: device.modes,
      condition: device.condition,
    },
    dates: { received: today(device.receivedOn), testedFrom: today(run.testedFrom ?? run.createdAt), testedTo: today(run.testedTo ?? run.updatedAt), issued: today(input.issuedAt) },
    method: {
      ruleSetName: rules.name ?? 'Rule set',
      ruleSetVersion: String(rules.version ?? 1),
      references: rules.references.map((r) => ({ document: r.document, clause: r.clause, edition: r.edition })),
    },
    decisionRule: decisionRuleText,
    conditions: ((lab.settings as { conditions?: { label: string; value: string }[] }).conditions) ?? [
      { label: 'Ambient temperature', value: '23 °C ± 5 °C' },
      { label: 'Supply voltage', value: 'Nominal, as stated by the manufacturer' },
    ],
    equipment: (await assignedInstruments(run)).map((i) => ({ name: i.name, model: i.model, serialNumber: i.serialNumber, calibrationDue: i.calibrationDue })),
    results: rows,
    deviations: [],
    testedBy: { name: engineer?.displayName ?? 'Unknown', role: ROLE_LABELS.engineer },
    authorizedBy: { name: input.authorizedBy.displayName, role: ROLE_LABELS.reviewer, authorizedAt: input.issuedAt.toISOString() },
    verificationUrl: input.verificationUrl,
    engineVersion: ENGINE_VERSION,
  };
  return { doc, clientOrganizationId: client.clientOrganizationId, contactEmail: client.contactEmail, contactName: client.contactName, verdicts: rows.map((r) => r.verdict).filter((v): v is Verdict => v !== 'not-evaluated') };
}
