import { activityLink, activityText } from './activity-text';

// The wording is the product's own (common practice: who did what, in the past tense).
describe('activityText', () => {
  it.each([
    [{ who: { displayName: 'Tomasz Ellery' }, action: 'run-submit', entity: 'test-run' }, 'Tomasz Ellery sent a run for review'],
    [{ who: { displayName: 'Imogen Varga' }, action: 'create', entity: 'instrument' }, 'Imogen Varga added an instrument to the register'],
    [{ who: { displayName: null }, action: 'new-version', entity: 'rule-set' }, 'Someone saved a new version of a rule set'],
    [{ who: null, action: 'run-issue', entity: 'test-run' }, 'Sidecheck issued a report'],
    [{ who: { displayName: 'A' }, action: 'price-list-save', entity: 'credit-price-list' }, 'A saved the credit price list'],
    [{ who: null, action: 'credit-purchase-complete', entity: 'credit-purchase' }, 'Sidecheck recorded a paid credit purchase'],
    // An action the client has no words for yet is still shown, from its own name.
    [{ who: { displayName: 'A' }, action: 'future-thing', entity: 'some-entity' }, 'A future thing (some entity)'],
  ])('%j', (entry, expected) => {
    expect(activityText(entry, 'someone-else')).toBe(expected);
  });

  it('says "You" for the reader\'s own entries', () => {
    expect(activityText({ who: { userId: 'u1', displayName: 'Imogen Varga' }, action: 'copy', entity: 'rule-set' }, 'u1')).toBe('You copied a rule set');
    expect(activityText({ who: { userId: 'u1', displayName: 'Imogen Varga' }, action: 'copy', entity: 'rule-set' })).toBe('Imogen Varga copied a rule set');
  });
});

describe('activityLink', () => {
  it('opens runs, rule sets, instruments and clients, and nothing else', () => {
    expect(activityLink({ entity: 'test-run', entityId: 'r1' })).toEqual(['/runs', 'r1']);
    expect(activityLink({ entity: 'rule-set', entityId: 's1' })).toEqual(['/rule-sets', 's1']);
    expect(activityLink({ entity: 'instrument', entityId: 'i1' })).toEqual(['/equipment']);
    expect(activityLink({ entity: 'client', entityId: 'c1' })).toEqual(['/clients']);
    expect(activityLink({ entity: 'api-key', entityId: 'k1' })).toBeNull();
    expect(activityLink({ entity: 'test-run', entityId: null })).toBeNull();
  });
});
