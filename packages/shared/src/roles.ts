import { z } from 'zod';

/** The five roles of an O&M crew, as stored on each user. */
export const roles = ['admin', 'dispatcher', 'technician', 'supervisor', 'owner'] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;

/** Words shown to people for each role. */
export const roleLabels: Record<Role, string> = {
  admin: 'Administrator',
  dispatcher: 'Dispatcher',
  technician: 'Field technician',
  supervisor: 'Supervisor',
  owner: 'Asset owner',
};
