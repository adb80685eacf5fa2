// Prisma 7 reads the connection URL from here, not from schema.prisma.
// process.env is read directly: the config's env() helper throws when the
// variable is unset, which would break `prisma generate` on a fresh clone.
import path from "node:path";
import { defineConfig } from "prisma/config";

export default defineConfig({
  schema: path.join(import.meta.dirname, "schema.prisma"),
  migrations: { path: path.join(import.meta.dirname, "migrations") },
  datasource: { url: process.env.DATABASE_URL ?? "" },
});
