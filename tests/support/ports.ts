// Fixed loopback ports for the test services (the IdP must know the app's callback URL up front).
// FLUXTRAIL_TEST_PORT_BASE moves them all, so two suites can run side by side on one machine.
const base = Number(process.env.FLUXTRAIL_TEST_PORT_BASE ?? 3110);
export const testPorts = {
  apiApp: base,
  idp: base + 1,
  smtp: base + 2,
  mailWeb: base + 3,
  browserApp: base + 10,
  browserIdp: base + 11,
  browserSmtp: base + 12,
  browserMailWeb: base + 13,
} as const;

export const apiAppUrl = `http://127.0.0.1:${testPorts.apiApp}`;
export const idpUrl = `http://127.0.0.1:${testPorts.idp}`;
