import type { TestKind } from '../rules/test-kind';
import type { UncertaintyResult } from '../uncertainty/combine-uncertainty';
import type { Verdict } from '../uncertainty/decision-rule';

/** What the engine concludes for one test case; the same object in the browser and on the server. */
export interface TestCaseResult {
  kind: TestKind;
  /** The measured quantity (for example carrier suppression in dB below PEP). */
  value: number;
  unit: string;
  limit: number;
  /** How the limit reads in a report, e.g. "at least 40 dB below PEP". */
  limitText: string;
  direction: 'at-least' | 'at-most';
  /** Distance from the limit in the value's unit (dB or Hz); positive = inside the limit. */
  margin: number;
  uncertainty: UncertaintyResult;
  verdict: Verdict;
  decisionRuleText: string;
  /** Intermediate values worth showing a reviewer. */
  detail: Record<string, number | string | null>;
}
