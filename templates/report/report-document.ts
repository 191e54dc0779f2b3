/**
 * Printed as the signed test report: the plain data the report generator takes. No ORM types and
 * no behaviour: the server maps its rows onto this shape, tests and benches build it with
 * {@link buildSampleReportDocument}. Field comments name the ISO/IEC 17025:2017 clause each
 * field serves (7.8.2.1 a-p, 7.8.3.1, 7.8.6, 7.8.8). Dates are ISO 8601 strings (YYYY-MM-DD, or
 * a full timestamp where a time matters) and are printed as given.
 */
import type { PlotSpec } from '../pdf-kit/plot-spec';

export type { PlotSeries, PlotSpec } from '../pdf-kit/plot-spec';

/** Verdicts of ILAC-G8:09/2019 (non-binary rule), plus "not evaluated" when no rule applied. */
export type ReportVerdict =
  | 'pass'
  | 'conditional-pass'
  | 'conditional-fail'
  | 'fail'
  | 'not-evaluated';

export interface ReportResult {
  /** The test, for example "Carrier suppression". Rows with the same name form one test. */
  testName: string;
  /** Where it was measured, for example "2182 kHz, 150 W PEP, 1 kHz tone". */
  testPoint: string;
  /** The measured value in `unit`; null when no value exists (not evaluated). 7.8.2.1 m */
  value: number | null;
  /** Unit of `value`, `margin` and `expandedUncertainty`, for example "dB" or "Hz". */
  unit: string;
  /** The requirement as printed, with its direction, for example "\u2265 40 dB below PEP". */
  limit: string;
  /** Distance to the limit in `unit`, positive inside it (headroom); null without a limit. */
  margin: number | null;
  /** Expanded uncertainty U in `unit` (JCGM 100:2008 6.2.1, U = k u_c). 7.8.3.1 c */
  expandedUncertainty: number | null;
  /** Coverage factor k of U, for example 2 (about 95 % for a normal distribution). */
  coverageFactor: number | null;
  verdict: ReportVerdict;
  /** Short remark printed as a numbered note under the results table. */
  note?: string;
  /** Name of the external provider that performed this test, if any. 7.8.2.1 p */
  externalProvider?: string;
  /** Decimals for `value`, `margin` and U; defaults to about four significant figures. */
  decimals?: number;
  /** A figure for this result (trace with limit, IMD spectrum). */
  plot?: PlotSpec;
}

export interface ReportPerson {
  name: string;
  role: string;
}

export interface ReportDocument {
  /** Unique identification printed on every page. 7.8.2.1 d */
  reportNumber: string;
  /** 0 for the first issue; each amendment is a new revision. 7.8.8 */
  revision: number;
  /** The document this one amends or replaces, and why. 7.8.8.2-7.8.8.3 */
  replaces?: { reportNumber: string; reason: string };
  /** 7.8.2.1 a */
  title: string;
  /** The issuing laboratory; logo is a PNG or JPEG image. 7.8.2.1 b */
  lab: {
    name: string;
    addressLines: string[];
    accreditation?: string;
    email?: string;
    phone?: string;
    logoPng?: Uint8Array;
  };
  /** Where the tests were carried out (the lab's premises or a site). 7.8.2.1 c */
  testSite: string;
  /** 7.8.2.1 e */
  client: { name: string; addressLines: string[]; contactName: string; contactEmail: string };
  /** Item tested: description, identification and condition on receipt. 7.8.2.1 g */
  device: {
    manufacturer: string;
    model: string;
    serialNumber: string;
    firmware?: string;
    /** Rated peak envelope power in watts. */
    ratedPepW: number;
    /** ITU emission designator, for example "2K70J3E". */
    emissionDesignator: string;
    frequencyRange: string;
    modes: string[];
    condition: string;
  };
  /** Receipt (h), testing (i) and issue (j) dates, ISO 8601. */
  dates: { received: string; testedFrom: string; testedTo: string; issued: string };
  /** The method: the rule set with its version and each referenced document. 7.8.2.1 f */
  method: {
    ruleSetName: string;
    ruleSetVersion: string;
    references: { document: string; clause?: string; edition: string }[];
  };
  /** Sampling plan, when the lab sampled; defaults to a "not applicable" statement. 7.8.2.1 k */
  sampling?: string;
  /** The decision rule applied, as one or two sentences. 7.8.6.2 */
  decisionRule: string;
  /** Environmental and operating conditions. 7.8.3.1 a */
  conditions: { label: string; value: string }[];
  /** Measuring equipment used, with calibration due dates. */
  equipment: { name: string; model: string; serialNumber: string; calibrationDue: string }[];
  /** 7.8.2.1 m */
  results: ReportResult[];
  /** Additions to, deviations from, exclusions from the method; [] prints "None". 7.8.2.1 n */
  deviations: string[];
  testedBy: ReportPerson;
  /** Who authorized the report, and when (ISO 8601 timestamp). 7.8.2.1 o */
  authorizedBy: ReportPerson & { authorizedAt: string };
  /** Public address where the report's authenticity can be checked; printed and QR-coded. */
  verificationUrl: string;
  /** Version of the measurement engine that computed the results (7.11). */
  engineVersion: string;
}
