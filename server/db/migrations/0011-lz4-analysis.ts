/**
 * An upload's analysis (figures and the thinned trace, about 54 kB of JSON for a mask trace) is
 * compressed with LZ4 rather than PostgreSQL's default pglz. Both are lossless and both shrink it
 * to about a fifth or less; pglz took about 2 ms of the database's CPU to store one analysis
 * against about 0.5 ms for LZ4 on this machine (bench/load.ts: an upload), and LZ4 also reads
 * back faster. The setting applies to values written from now on; stored ones are read as they
 * are (each value records its own method). PostgreSQL 14 or later built with LZ4, as Debian's is.
 */
import type { MigrationFn } from 'umzug';
import type { QueryInterface } from 'sequelize';

const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE uploads ALTER COLUMN analysis SET COMPRESSION lz4');
};

const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE uploads ALTER COLUMN analysis SET COMPRESSION default');
};

export const migration = { name: '0011-lz4-analysis', up, down };
