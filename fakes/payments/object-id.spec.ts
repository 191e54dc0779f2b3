import { newObjectId } from './object-id';

describe('newObjectId', () => {
  it('keeps the prefix and draws base-62 characters of the requested length', () => {
    const ids = Array.from({ length: 500 }, () => newObjectId('cus', 14));
    for (const id of ids) expect(id).toMatch(/^cus_[0-9A-Za-z]{14}$/);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('throws RangeError for a length outside 8..64', () => {
    expect(() => newObjectId('pi', 4)).toThrow(/^newObjectId/);
    expect(() => newObjectId('pi', 65)).toThrow(RangeError);
  });
});
