import type { SessionUser } from '../../server/auth/session.js';

// The demo IdP's accounts (idp-fake/accounts.ts) acting in Setup, so the audit trail names them.
const user = (id: number, subject: string, name: string, role: SessionUser['role']): SessionUser =>
  ({ id, subject, name, email: `${subject}@plant.example`, role });

export const demoActors = {
  quality: user(1, 'quality', 'Piet Lindqvist', 'quality'),
  secondQuality: user(2, 'quality2', 'Ana Sousa', 'quality'),
  admin: user(3, 'admin', 'Jonas Weber', 'admin'),
} as const;
