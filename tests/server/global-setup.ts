import type { TestProject } from 'vitest/node';
import { databaseForTests, migrate } from '../support/throwaway-db';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

export default async function setup(project: TestProject) {
  const db = await databaseForTests('TEST_DATABASE_URL', 'scrubline_api');
  await migrate(db.url);
  project.provide('databaseUrl', db.url);
  return db.stop;
}
