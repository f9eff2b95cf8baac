/**
 * `npm run screenshots`: the README's pictures of the main screens, taken in Chromium from the
 * demo club on a fresh database, served by the production build (rebuilt when older than the code).
 * `npm run screenshots -- <folder>` writes them elsewhere (the browser test that keeps this
 * command working does).
 */
import { ChromiumUnavailable, ensureChromium } from "../tests/helpers/chromium";
import { README_SCREENSHOTS, takeReadmeScreenshots } from "../tests/helpers/readme-screenshots";
import { startProductionServer } from "../tests/helpers/server";

try {
  ensureChromium("npm run screenshots");
} catch (error) {
  if (!(error instanceof ChromiumUnavailable)) throw error;
  console.error(error.message);
  process.exit(1);
}

const server = await startProductionServer();
try {
  const shots = await takeReadmeScreenshots(server.baseUrl, process.argv[2] || README_SCREENSHOTS);
  for (const shot of shots) {
    console.log(`${shot.path}  ${shot.width}×${shot.height}  ${Math.round(shot.bytes / 1024)} KB`);
  }
} finally {
  await server.stop();
}
