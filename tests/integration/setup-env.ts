import { inject } from "vitest";

// lib/db reads DATABASE_URL; point it at this run's database before any test imports it.
process.env.DATABASE_URL = inject("databaseUrl");
