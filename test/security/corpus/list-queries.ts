/**
 * Query strings for list routes: SQL-looking filters and sort keys, oversize or negative
 * pagination, repeated parameters, NUL bytes and prototype keys. A list route answers a normal
 * page (200) or refuses with 400/422 (404 only where the path names a record); never 500.
 * Each entry is the raw query string, already percent-encoded.
 */
const q = (params: Record<string, string>) => Object.entries(params).map(([k, v]) => `${encodeURIComponent(k)}=${encodeURIComponent(v)}`).join('&');

export const HOSTILE_LIST_QUERIES: { label: string; query: string }[] = [
  { label: "sort ' OR 1=1 --", query: q({ sort: "' OR 1=1 --" }) },
  { label: 'sort name; DROP TABLE runs', query: q({ sort: 'name; DROP TABLE runs' }) },
  { label: 'sort with a subquery', query: q({ sort: 'createdAt DESC, (SELECT 1)' }) },
  { label: 'sort -', query: q({ sort: '-' }) },
  { label: 'sort --createdAt', query: q({ sort: '--createdAt' }) },
  { label: 'sort __proto__', query: q({ sort: '__proto__' }) },
  { label: 'sort constructor', query: q({ sort: 'constructor' }) },
  { label: 'sort toString', query: q({ sort: 'toString' }) },
  { label: 'sort repeated', query: 'sort=createdAt&sort=name' },
  { label: 'pageSize 1e9', query: q({ pageSize: '1e9' }) },
  { label: 'pageSize 1000000000', query: q({ pageSize: '1000000000' }) },
  { label: 'pageSize 0', query: q({ pageSize: '0' }) },
  { label: 'pageSize -1', query: q({ pageSize: '-1' }) },
  { label: 'page -1', query: q({ page: '-1' }) },
  { label: 'page 0', query: q({ page: '0' }) },
  { label: 'page 1e999', query: q({ page: '1e999' }) },
  { label: 'page NaN', query: q({ page: 'NaN' }) },
  { label: 'page 1.5', query: q({ page: '1.5' }) },
  { label: 'page 99999999999999999999', query: q({ page: '99999999999999999999' }) },
  { label: 'page 100000 (deep offset)', query: q({ page: '100000', pageSize: '200' }) },
  { label: 'page repeated', query: 'page=1&page=2' },
  { label: "search ' OR 1=1 --", query: q({ search: "' OR 1=1 --" }) },
  { label: 'search %', query: q({ search: '%' }) },
  { label: 'search _ and backslash', query: q({ search: '_\\' }) },
  { label: 'search with a NUL byte', query: 'search=a%00b' },
  { label: 'search of 10,000 characters', query: q({ search: 'a'.repeat(10_000) }) },
  { label: 'state with SQL', query: q({ state: "draft' OR '1'='1" }) },
  { label: 'state NUL', query: 'state=%00' },
  { label: 'format with SQL', query: q({ format: "x' OR '1'='1" }) },
  { label: 'format with a NUL byte', query: 'format=trace%00' },
  { label: 'testCaseId not a uuid', query: q({ testCaseId: "' OR 1=1 --" }) },
  { label: 'clientId not a uuid', query: q({ clientId: '1; DROP TABLE clients' }) },
  { label: 'deviceId with a NUL byte', query: 'deviceId=%00' },
  { label: 'engineerId not a uuid', query: q({ engineerId: 'x' }) },
  { label: 'runId not a uuid', query: q({ runId: "' OR 1=1 --" }) },
  { label: '__proto__[polluted]', query: '__proto__[polluted]=yes&__proto__.polluted=yes' },
  { label: 'constructor[prototype][polluted]', query: 'constructor[prototype][polluted]=yes' },
  { label: 'malformed percent escape', query: 'search=%E0%A4%A' },
  { label: 'part=../../etc/passwd', query: q({ part: '../../etc/passwd' }) },
];
