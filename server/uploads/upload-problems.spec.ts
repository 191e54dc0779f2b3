import { formatBytes, ImportProblem, storageProblem } from './upload-problems';
import { StorageError } from '../storage/file-storage';

describe('upload problems', () => {
  it('a full store is 507 Insufficient Storage (RFC 4918 11.5), any other storage failure 500', () => {
    expect(storageProblem(new StorageError('no-space', 'x')).status).toBe(507);
    expect(storageProblem(new StorageError('failed', 'x')).status).toBe(500);
    expect(storageProblem(new StorageError('no-space', 'x')).message).toMatch(/Nothing was stored/);
  });

  it('an import problem carries the part and the location beside the problem+json members', () => {
    const p = new ImportProblem('decodeIqSamples: byte offset 32760: data ends inside a sample', { part: 'data', byteOffset: 32_760 });
    expect(p.toJSON('/api/x')).toMatchObject({ status: 422, code: 'import-failed', instance: '/api/x', location: { part: 'data', byteOffset: 32_760 }, errors: [{ pointer: '/data' }] });
  });

  it.each([
    [200_000_000, '200 MB'],
    [2_000_000, '2 MB'],
    [65_536, '65.5 kB'],
    [512, '512 bytes'],
  ])('formats %i bytes as %s (SI prefixes)', (bytes, text) => {
    expect(formatBytes(bytes)).toBe(text);
  });
});
