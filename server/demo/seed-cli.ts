/** `npm run db:seed` — built-in rule sets and the demo scenario into DATABASE_URL. */
import { createSequelize } from '../db/sequelize';
import { initModels } from '../db/models';
import { seedDemo } from './seed';

async function main() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('db:seed: DATABASE_URL is not set');
  const sequelize = createSequelize(url);
  initModels(sequelize);
  const { created } = await seedDemo(sequelize);
  console.log(created ? 'demo scenario loaded' : 'demo scenario already present');
  await sequelize.close();
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
