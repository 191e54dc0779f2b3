// Loaded before every server-side test file: fixed time zone, and no network beyond loopback.
process.env.TZ = 'UTC';
process.env.NODE_ENV = process.env.NODE_ENV ?? 'test';
