import type { TestProject } from "vitest/node";
import { startProductionServer } from "../helpers/server";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    databaseUrl: string;
    outboxDir: string;
  }
}

/** Serves the production build (rebuilt when older than the code) on a fresh seeded database. */
export default async function setup(project: TestProject) {
  const server = await startProductionServer();
  project.provide("baseUrl", server.baseUrl);
  project.provide("databaseUrl", server.databaseUrl);
  project.provide("outboxDir", server.outboxDir);
  return server.stop;
}
