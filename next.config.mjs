/** @type {import('next').NextConfig} */
const nextConfig = {
  // The physics command line and the workers import lib/physics directly; nothing to transpile.
  reactStrictMode: true,
  poweredByHeader: false,
  serverExternalPackages: ["pg", "bcryptjs"],
  // `npm test` builds into its own folder (.next-test), so a test run never rebuilds the build a
  // running `npm run demo` serves from the same checkout.
  distDir: process.env.GYROLUX_NEXT_DIST_DIR || ".next",
};

export default nextConfig;
