/**
 * The life of a test run. A run is measured (testing), checked by a second competent person
 * (in-review -> approved, ISO/IEC 17025:2017 7.8.1.1) and issued as a report; an issued report can
 * later be withdrawn or superseded by a corrected revision (7.8.8), which keeps the record.
 */
export const RUN_STATES = ['draft', 'testing', 'in-review', 'approved', 'issued', 'withdrawn', 'superseded'] as const;
export type RunState = (typeof RUN_STATES)[number];

export type RunAction = 'start' | 'submit' | 'return' | 'approve' | 'issue' | 'withdraw' | 'revise';

/** Allowed transitions: action -> [from states, to state]. */
export const RUN_TRANSITIONS: Record<RunAction, { from: readonly RunState[]; to: RunState }> = {
  start: { from: ['draft'], to: 'testing' },
  submit: { from: ['testing'], to: 'in-review' },
  return: { from: ['in-review', 'approved'], to: 'testing' },
  approve: { from: ['in-review'], to: 'approved' },
  issue: { from: ['approved'], to: 'issued' },
  withdraw: { from: ['issued'], to: 'withdrawn' },
  /** Reopen an issued run for correction; re-issuing makes a new revision that supersedes the old report. */
  revise: { from: ['issued'], to: 'testing' },
};

/** Our words for each state, as shown on screen and in lists. */
export const RUN_STATE_LABELS: Record<RunState, string> = {
  draft: 'Not started',
  testing: 'On the bench',
  'in-review': 'Awaiting review',
  approved: 'Authorized',
  issued: 'Issued',
  withdrawn: 'Withdrawn',
  superseded: 'Superseded',
};

export function nextState(state: RunState, action: RunAction): RunState | null {
  const rule = RUN_TRANSITIONS[action];
  return rule.from.includes(state) ? rule.to : null;
}

export function availableActions(state: RunState): RunAction[] {
  return (Object.keys(RUN_TRANSITIONS) as RunAction[]).filter((a) => RUN_TRANSITIONS[a].from.includes(state));
}
