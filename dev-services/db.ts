// `npm run db:migrate` and `npm run db:seed` against the project's own cluster (or DATABASE_URL).
import { prepareDatabase } from './prepare-database';

const command = process.argv[2];
if (command !== 'migrate' && command !== 'seed') {
  console.error('usage: tsx dev-services/db.ts migrate|seed');
  process.exit(2);
}
const database = await prepareDatabase({ seed: command === 'seed' });
console.log(`Database ${command === 'seed' ? 'migrated and seeded' : 'migrated'}: ${database.url}`);
// The cluster stays up for the next command; `npm run db:stop` stops it.
