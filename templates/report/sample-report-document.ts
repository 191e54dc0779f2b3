/**
 * A complete, invented report for tests, benches and the demo: the lab, client and radio are
 * made up (addresses without real towns, e-mail under the reserved .example domain of RFC 2606,
 * a phone number from the UK range set aside for fiction). Override any top-level field.
 */
import type { ReportDocument } from './report-document';
import { buildSampleResults } from './sample-report-results';

/**
 * Returns a fresh sample report; `overrides` replace top-level fields (shallow).
 * @example buildSampleReportDocument({ revision: 1 }).reportNumber // 'KRT-2025-0142'
 */
export function buildSampleReportDocument(overrides: Partial<ReportDocument> = {}): ReportDocument {
  return {
    reportNumber: 'KRT-2025-0142',
    revision: 0,
    title: 'Test report: HF SSB radiotelephone transmitter',
    lab: {
      name: 'Kestrelmoor Radio Test Laboratory',
      addressLines: ['Unit 7, Saltings Business Park', 'Port Ellery PE7 3QX'],
      accreditation: 'Accredited to ISO/IEC 17025:2017, accreditation number 0000 (sample)',
      email: 'reports@kestrelmoor-rf.example',
      phone: '+44 20 7946 0321',
    },
    testSite: 'Kestrelmoor Radio Test Laboratory, shielded room 2, Port Ellery',
    client: {
      name: 'Orrin Vale Marine Systems',
      addressLines: ['4 Chandlers Yard', 'Westhaven WH2 9LP'],
      contactName: 'Mira Castellan',
      contactEmail: 'mira.castellan@orrinvale.example',
    },
    device: {
      manufacturer: 'Orrin Vale Marine Systems',
      model: 'OV-HF150',
      serialNumber: 'OV15-002317',
      firmware: '2.4.1',
      ratedPepW: 150,
      emissionDesignator: '2K70J3E',
      frequencyRange: '1.6 MHz to 27.5 MHz',
      modes: ['J3E', 'H3E'],
      condition:
        'Received in good condition, no visible damage; tested as supplied with the maker\u2019s 13.8 V supply lead.',
    },
    dates: {
      received: '2025-03-03',
      testedFrom: '2025-03-04',
      testedTo: '2025-03-06',
      issued: '2025-03-10',
    },
    method: {
      ruleSetName: 'Maritime HF SSB radiotelephone (47 CFR Part 80)',
      ruleSetVersion: '2024.2',
      references: [
        { document: '47 CFR 80.207', clause: '(c)', edition: '2024' },
        { document: '47 CFR 80.209', edition: '2024' },
        { document: '47 CFR 80.211', clause: '(a)', edition: '2024' },
        { document: '47 CFR 2.1049', edition: '2024' },
        { document: 'ILAC-G8', edition: '09/2019' },
        { document: 'JCGM 100 (GUM)', edition: '2008' },
      ],
    },
    decisionRule:
      'Non-binary decision rule with a guard band equal to the expanded uncertainty U ' +
      '(ILAC-G8:09/2019), agreed with the client before testing.',
    conditions: [
      { label: 'Ambient temperature', value: '22.5 \u00b0C \u00b1 1.0 \u00b0C' },
      { label: 'Relative humidity', value: '41 % \u00b1 5 %' },
      { label: 'Supply voltage', value: '13.8 V DC \u00b1 0.1 V' },
      { label: 'Load', value: '50 \u03a9 dummy load through a 30 dB attenuator' },
    ],
    equipment: [
      {
        name: 'Spectrum analyser',
        model: 'Lab asset KRT-SA-01',
        serialNumber: 'SA01-11873',
        calibrationDue: '2025-11-30',
      },
      {
        name: 'RF power meter with sensor',
        model: 'Lab asset KRT-PM-02',
        serialNumber: 'PM02-40551',
        calibrationDue: '2025-09-15',
      },
      {
        name: 'Frequency counter, GNSS-disciplined',
        model: 'Lab asset KRT-FC-01',
        serialNumber: 'FC01-2290',
        calibrationDue: '2026-01-31',
      },
      {
        name: 'Two-tone audio generator',
        model: 'Lab asset KRT-AG-03',
        serialNumber: 'AG03-7714',
        calibrationDue: '2025-08-01',
      },
      {
        name: 'Dummy load, 1.5 kW',
        model: 'Lab asset KRT-DL-01',
        serialNumber: 'DL01-0192',
        calibrationDue: '2025-12-31',
      },
      {
        name: 'Attenuator, 30 dB, 500 W',
        model: 'Lab asset KRT-AT-04',
        serialNumber: 'AT04-3318',
        calibrationDue: '2025-12-31',
      },
    ],
    results: buildSampleResults(),
    deviations: [],
    testedBy: { name: 'Tomas Leverett', role: 'Test engineer' },
    authorizedBy: {
      name: 'Dr Ilse Marrow',
      role: 'Technical reviewer',
      authorizedAt: '2025-03-10T14:32:00Z',
    },
    verificationUrl: 'https://verify.kestrelmoor-rf.example/r/KRT-2025-0142',
    engineVersion: '1.0.0',
    ...overrides,
  };
}
