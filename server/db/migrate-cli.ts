/** `npm run db:migrate` — apply pending migrations to DATABASE_URL ("down" reverts the last). */
import { createSequelize } from './sequelize';
import { createMigrator } from './migrate';

async function main() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('db:migrate: DATABASE_URL is not set (scripts/pg-cluster.sh url prints the private one)');
  const sequelize = createSequelize(url, { statementTimeoutMs: 0 });
  const migrator = createMigrator(sequelize);
  const applied = process.argv[2] === 'down' ? await migrator.down() : await migrator.up();
  console.log(applied.length ? `migrations: ${applied.map((m) => m.name).join(', ')}` : 'migrations: up to date');
  await sequelize.close();
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
