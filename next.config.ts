import type { NextConfig } from "next";
import { API_CONTENT_SECURITY_POLICY, SECURITY_HEADERS } from "./server/http/security-headers";

const nextConfig: NextConfig = {
  reactStrictMode: true,
  // Parallel test runs on one machine build into their own folders (scripts/test.sh).
  distDir: process.env.SEALPITCH_DIST_DIR || ".next",
  poweredByHeader: false,
  // Nothing is fetched at build or run time: fonts come from node_modules through next/font/local.
  images: { unoptimized: true },
  // piscina starts its worker threads from files of its own package: it must stay outside the bundle.
  serverExternalPackages: ["piscina"],
  experimental: {
    serverActions: { bodySizeLimit: "2mb" },
    authInterrupts: true,
  },
  // Every /api/ response (JSON, downloads, errors and Next's own 404s there): the fixed API policy
  // and the common security headers. Pages get theirs, with a per-request nonce, from proxy.ts.
  async headers() {
    return [
      {
        source: "/api/:path*",
        headers: [
          { key: "content-security-policy", value: API_CONTENT_SECURITY_POLICY },
          ...Object.entries(SECURITY_HEADERS).map(([key, value]) => ({ key, value })),
        ],
      },
    ];
  },
};

export default nextConfig;
