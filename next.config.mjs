/** @type {import('next').NextConfig} */
const nextConfig = {
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
};

export default nextConfig;
