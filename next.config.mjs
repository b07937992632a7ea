/** @type {import('next').NextConfig} */
const nextConfig = {
  // The test command builds into its own folder so that it never disturbs a running demo.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  poweredByHeader: false,
  // The shop's IANA time zone, the same on the server and in the browser (lib/quality/shop-time.ts).
  env: { SHOP_TIME_ZONE: process.env.SHOP_TIME_ZONE ?? '' },
  reactStrictMode: true,
  async headers() {
    return [
      {
        source: '/:path*',
        headers: [
          { key: 'X-Content-Type-Options', value: 'nosniff' },
          { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
          { key: 'X-Frame-Options', value: 'DENY' },
          { key: 'Permissions-Policy', value: 'camera=(self), microphone=(), geolocation=()' },
        ],
      },
    ];
  },
  experimental: {
    serverActions: { bodySizeLimit: '2mb' },
    // forbidden() renders app/forbidden.tsx with status 403.
    authInterrupts: true,
  },
};

export default nextConfig;
