import type { TestProject } from "vitest/node";
import { ChromiumUnavailable, ensureChromium } from "../helpers/chromium";
import { startProductionServer } from "../helpers/server";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    databaseUrl: string;
    outboxDir: string;
  }
}

/**
 * Finds (or installs) Chromium, then serves the production build (rebuilt when older than the
 * code) on a fresh seeded database.
 */
export default async function setup(project: TestProject) {
  try {
    ensureChromium("npm test");
  } catch (error) {
    if (!(error instanceof ChromiumUnavailable)) throw error;
    // A thrown error here reaches the reader wrapped in vitest's "no test files found" and its
    // include lists; one sentence and a failed exit, before any test has started, says it plainly.
    console.error(`\n${error.message}\n`);
    process.exit(1);
  }
  const server = await startProductionServer();
  project.provide("baseUrl", server.baseUrl);
  project.provide("databaseUrl", server.databaseUrl);
  project.provide("outboxDir", server.outboxDir);
  return server.stop;
}
