// Fixed loopback ports for the test services (the IdP must know the app's callback URL up front).
export const testPorts = {
  apiApp: 3110,
  idp: 3111,
  smtp: 3112,
  mailWeb: 3113,
  browserApp: 3120,
  browserIdp: 3121,
  browserSmtp: 3122,
  browserMailWeb: 3123,
} as const;

export const apiAppUrl = `http://127.0.0.1:${testPorts.apiApp}`;
export const idpUrl = `http://127.0.0.1:${testPorts.idp}`;
