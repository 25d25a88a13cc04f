/**
 * Roles and what each may do: the matrix of the product design, in one place, used by the
 * server to enforce and by the client to hide what the server would refuse.
 */
export const roles = ['operator', 'engineer', 'accountant', 'admin'] as const;
export type Role = (typeof roles)[number];

export const capabilities = {
  /** Live view, trends, totals, balances, calculations. */
  view: ['operator', 'engineer', 'accountant', 'admin'],
  /** Acknowledge and shelve alarms. */
  respondToAlarms: ['operator', 'engineer', 'admin'],
  /** Sites, meter runs, transmitters, configuration versions, calibrations. */
  configure: ['engineer', 'admin'],
  /** Import readings and field totals. */
  importData: ['engineer', 'admin'],
  proposeCorrection: ['engineer', 'admin'],
  /** Approve a correction proposed by somebody else. */
  approveCorrection: ['engineer', 'admin'],
  closePeriod: ['accountant', 'admin'],
  reopenPeriod: ['admin'],
  exportVolumes: ['engineer', 'accountant', 'admin'],
  /** Users, device credentials, the mail outbox. */
  administer: ['admin'],
  readAuditLog: ['engineer', 'accountant', 'admin'],
} as const satisfies Record<string, readonly Role[]>;

export type Capability = keyof typeof capabilities;

export function can(role: Role, capability: Capability): boolean {
  return (capabilities[capability] as readonly Role[]).includes(role);
}
