// Writes the JSON Schema files of the domain's main documents into
// docs/schemas (npm run docs:schemas). A unit test regenerates them in memory
// and fails when the committed files have drifted from the zod schemas.
import { mkdir, readdir, rm, writeFile } from "node:fs/promises";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { jsonSchemaFiles } from "../domain/index.ts";

const folder = fileURLToPath(new URL("../../docs/schemas/", import.meta.url));

async function main(): Promise<void> {
  const files = jsonSchemaFiles();
  await mkdir(folder, { recursive: true });
  for (const name of await readdir(folder)) {
    // A document that is no longer published must not linger as a stale file.
    if (name.endsWith(".json") && !(name in files)) await rm(path.join(folder, name));
  }
  for (const [name, text] of Object.entries(files)) {
    await writeFile(path.join(folder, name), text, "utf8");
  }
  console.log(`wrote ${Object.keys(files).length} JSON Schema files to ${path.relative(process.cwd(), folder) || folder}`);
}

await main();
