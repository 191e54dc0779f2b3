/**
 * The test report as an ordered list of sections. To add a section, write one file under
 * sections/ and insert it here; the generator core does not change.
 */
import type { ReportSection } from './report-section';
import { authorizationSection } from './sections/authorization-section';
import { clientSection } from './sections/client-section';
import { conditionsSection } from './sections/conditions-section';
import { decisionRuleSection } from './sections/decision-rule-section';
import { deviationsSection } from './sections/deviations-section';
import { endOfReportSection } from './sections/end-of-report-section';
import { equipmentSection } from './sections/equipment-section';
import { figuresSection } from './sections/figures-section';
import { itemSection } from './sections/item-section';
import { methodSection } from './sections/method-section';
import { resultsSection } from './sections/results-section';
import { safetySection } from './sections/safety-section';
import { summarySection } from './sections/summary-section';
import { titleBlockSection } from './sections/title-block-section';
import { verificationSection } from './sections/verification-section';

export const REPORT_SECTIONS: readonly ReportSection[] = [
  titleBlockSection,
  summarySection,
  clientSection,
  itemSection,
  methodSection,
  decisionRuleSection,
  conditionsSection,
  equipmentSection,
  resultsSection,
  figuresSection,
  deviationsSection,
  safetySection,
  authorizationSection,
  verificationSection,
  endOfReportSection,
];
