/** @type {import('next').NextConfig} */
const nextConfig = {
  // The physics command line and the workers import lib/physics directly; nothing to transpile.
  reactStrictMode: true,
  poweredByHeader: false,
  serverExternalPackages: ["pg", "bcryptjs", "pg-boss"],
};

export default nextConfig;
