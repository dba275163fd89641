import { readBuildSettings } from "./lib/settings/build.mjs";

const buildSettings = readBuildSettings();

/*
 * Security headers on every answer. The Content-Security-Policy is what the app itself needs:
 * Next's inline bootstrap scripts and styles ('unsafe-inline': Next nonces its scripts only when a
 * nonce is minted per request in the proxy and every page renders per request; our prerendered
 * pages, the public ones, would lose their static build and the CDN-cacheable answer, so the
 * nonce is not used; no page renders user text as HTML, which is what 'unsafe-inline' would
 * expose), module Web Workers from our own origin (worker-src 'self'), SVG/PNG exports through
 * blob: and data: URLs (img-src), and no framing by anyone (frame-ancestors 'none'). The
 * development server also evaluates code for fast refresh, hence 'unsafe-eval' there only.
 */
const isDev = buildSettings.nodeEnv !== "production";

const csp = [
  "default-src 'self'",
  `script-src 'self' 'unsafe-inline'${isDev ? " 'unsafe-eval'" : ""}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self' data:",
  "worker-src 'self' blob:",
  `connect-src 'self'${isDev ? " ws: wss:" : ""}`,
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join("; ");

const securityHeaders = [
  { key: "Content-Security-Policy", value: csp },
  { key: "X-Frame-Options", value: "DENY" },
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
  { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=(), payment=(), usb=(), interest-cohort=()" },
  // Behind TLS only (GYROLUX_HSTS_MAX_AGE > 0): browsers then refuse plain http for this host.
  ...(buildSettings.hstsMaxAgeS > 0
    ? [{ key: "Strict-Transport-Security", value: `max-age=${buildSettings.hstsMaxAgeS}; includeSubDomains` }]
    : []),
];

/** @type {import('next').NextConfig} */
const nextConfig = {
  // The physics command line and the workers import lib/physics directly; nothing to transpile.
  reactStrictMode: true,
  poweredByHeader: false,
  serverExternalPackages: ["pg", "@node-rs/bcrypt", "nodemailer", "pg-boss"],
  // `npm test` builds into its own folder (lib/settings/build.mjs).
  distDir: buildSettings.nextDistDir,
  // Server actions (sign-in and sign-up forms) get the API's body limit instead of Next's 1 MB.
  experimental: { serverActions: { bodySizeLimit: "64kb" } },
  async headers() {
    return [{ source: "/:path*", headers: securityHeaders }];
  },
  // The measurement-set and lab-run pages were at /measurements and /runs; old links and
  // bookmarks still arrive there.
  async redirects() {
    return [
      { source: "/measurements/:path*", destination: "/measurement-sets/:path*", permanent: true },
      { source: "/runs/:path*", destination: "/lab-runs/:path*", permanent: true },
    ];
  },
};

export default nextConfig;
