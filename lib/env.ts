/**
 * Every environment variable the app reads, parsed once. Server-only.
 * DATABASE_URL is optional: without it the demo starts the embedded PostgreSQL
 * and passes the URL down to the processes it starts.
 */
import { z } from "zod";

const envSchema = z.object({
  DATABASE_URL: z
    .string()
    .regex(/^postgres(ql)?:\/\//, "DATABASE_URL must be a postgresql:// URL")
    .optional(),
  NEXTAUTH_SECRET: z.string().min(16, "NEXTAUTH_SECRET must be at least 16 characters").optional(),
  NEXTAUTH_URL: z.url("NEXTAUTH_URL must be a URL such as http://localhost:3000").optional(),
  /** set by `npm run demo`: the demo sign-ins the sign-in page lists */
  BIDWRIGHT_DEMO_ACCOUNTS: z.string().optional(),
  /**
   * The browser tests' clock: an instant the server's clock starts at when the
   * process starts (it runs on from there), so a seeded period's deadline
   * stays ahead of "now" whatever day the tests run. Unset everywhere else.
   */
  BIDWRIGHT_CLOCK_START: z.iso.datetime({ message: "BIDWRIGHT_CLOCK_START must be a UTC instant such as 2026-12-01T12:00:00Z" }).optional(),
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;

/** The parsed environment; throws one message naming every bad variable. */
export function env(): Env {
  if (cached) return cached;
  const parsed = envSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`invalid environment:\n${lines.join("\n")}`);
  }
  cached = parsed.data;
  return cached;
}

/** The database URL, which every server-side process must have by now. */
export function databaseUrl(): string {
  const url = env().DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set: start the app with `npm run demo`, or set DATABASE_URL");
  return url;
}
