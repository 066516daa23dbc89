import type { NextConfig } from 'next';
import { STRICT_POLICY, staticSecurityHeaders } from './lib/security/headers';

const nextConfig: NextConfig = {
  // Native and Node-only packages stay outside the bundle (Sequelize otherwise pulls in every
  // dialect's driver, pg-hstore among them, and the build fails).
  serverExternalPackages: [
    'sequelize',
    'sqlite3',
    'pg',
    'pg-hstore',
    'nodemailer',
    'smtp-server',
    'mailparser',
    'umzug',
    '@aws-sdk/client-s3',
  ],
  // Shared caches in front may serve a cached page stale for an hour at most while it refreshes.
  expireTime: 3600,
  // The dev server only hydrates for origins it knows; tests and people open it by address too.
  allowedDevOrigins: ['127.0.0.1', 'localhost'],
  poweredByHeader: false,
  // Security headers on every response; pages with scripts get their nonce policy from proxy.ts.
  async headers() {
    const strict = [{ key: 'Content-Security-Policy', value: STRICT_POLICY }];
    return [
      { source: '/:path*', headers: staticSecurityHeaders() },
      { source: '/api/:path*', headers: strict },
      { source: '/_next/static/:path*', headers: strict },
      { source: '/v/:slug', headers: strict },
      { source: '/feed.xml', headers: strict },
    ];
  },
  typedRoutes: false,
};

export default nextConfig;
