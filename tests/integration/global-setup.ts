import type { TestProject } from "vitest/node";
import { createTestDatabase } from "../support/test-database.ts";

declare module "vitest" {
  export interface ProvidedContext {
    databaseUrl: string;
    serverUrl: string;
  }
}

/** One migrated database for the whole integration run; dropped at the end. */
export default async function setup(project: TestProject) {
  const t = Date.now();
  const db = await createTestDatabase("it");
  console.log(`integration database ${db.name} on ${new URL(db.url).host} ready in ${Date.now() - t} ms`);
  project.provide("databaseUrl", db.url);
  project.provide("serverUrl", db.serverUrl);
  return async () => {
    await db.drop();
  };
}
