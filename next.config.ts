import type { NextConfig } from 'next';

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
  typedRoutes: false,
};

export default nextConfig;
