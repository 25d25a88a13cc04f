/**
 * Roles for the client's display. Which role may do what is the product's one matrix in
 * shared/auth/roles.ts (the server enforces it); this module adds only the words shown for
 * each role. A hidden button is a courtesy, never the protection.
 */
import { can, capabilities, roles, type Capability, type Role } from '@/shared/auth/roles';

export { can, capabilities, roles, type Capability, type Role };

export const roleLabel: Record<Role, string> = {
  operator: 'Operator',
  engineer: 'Engineer',
  accountant: 'Accountant',
  admin: 'Administrator',
};

/** One line per role, shown where an admin picks a role for someone. */
export const roleSummary: Record<Role, string> = {
  operator: 'Watches live flow and acknowledges alarms.',
  engineer: 'Sets up meter runs, imports readings, proposes and approves corrections.',
  accountant: 'Reviews monthly volumes, closes the month and exports volumes.',
  admin: 'Everything, plus users, device credentials and the mail outbox.',
};
