import type { Role } from '@stringfield/shared';

/** The invented demo crew of Larkspur Field Services (see the README); every demo password is the same. */
export const DEMO_PASSWORD = 'stringfield-demo';

export const demoUsers: Array<{ email: string; name: string; role: Role }> = [
  { email: 'admin@stringfield.test', name: 'Demo Admin', role: 'admin' },
  { email: 'dispatcher@stringfield.test', name: 'Demo Dispatcher', role: 'dispatcher' },
  { email: 'tech@stringfield.test', name: 'Demo Technician', role: 'technician' },
  { email: 'supervisor@stringfield.test', name: 'Demo Supervisor', role: 'supervisor' },
  { email: 'owner@stringfield.test', name: 'Demo Owner (Fenwick Moor Holdings)', role: 'owner' },
  { email: 'calder.owner@stringfield.test', name: 'Demo Owner (Calder Bay Logistics)', role: 'owner' },
  { email: 'rosa.quill@stringfield.test', name: 'Rosa Quill', role: 'technician' },
  { email: 'tomas.brenn@stringfield.test', name: 'Tomas Brenn', role: 'technician' },
  { email: 'ada.merrow@stringfield.test', name: 'Ada Merrow', role: 'technician' },
];
