import type { TestProject } from 'vitest/node';
import { createDatabaseIfMissing, startCluster, testClusterOptions } from '../../dev-services/postgres';
import { runMigrations } from '../../server/db/migrate';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

/** Starts the throwaway test cluster, gives the run a fresh database, and migrates it. */
export default async function setup(project: TestProject) {
  const cluster = startCluster(testClusterOptions());
  const database = 'restday_test';
  createDatabaseIfMissing(cluster, database, { recreate: true });
  const databaseUrl = cluster.urlFor(database);
  await runMigrations(databaseUrl);
  project.provide('databaseUrl', databaseUrl);

  return () => {
    if (cluster.startedHere) cluster.stop();
  };
}
