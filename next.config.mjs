/** @type {import('next').NextConfig} */
const nextConfig = {
  // The test command builds into its own folder so that it never disturbs a running demo.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  poweredByHeader: false,
  reactStrictMode: true,
  experimental: {
    serverActions: { bodySizeLimit: '2mb' },
    // forbidden() renders app/forbidden.tsx with status 403.
    authInterrupts: true,
  },
};

export default nextConfig;
