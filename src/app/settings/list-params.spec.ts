import { listParams } from './list-params';

describe('listParams', () => {
  it('keeps numbers and strings, leaves out empty and undefined values (the server applies its defaults)', () => {
    expect(listParams({ page: 2, pageSize: 25, search: '', sort: undefined, status: 'due-soon,overdue' }).toString()).toBe('page=2&pageSize=25&status=due-soon,overdue');
    expect(listParams({}).toString()).toBe('');
  });
});
