import { z } from 'zod';
import type { Action } from './permissions.ts';
import type { Role } from './roles.ts';

export const workOrderStatuses = ['reported', 'dispatched', 'in_field', 'awaiting_signoff', 'returned', 'signed_off', 'cancelled'] as const;
export const workOrderStatusSchema = z.enum(workOrderStatuses);
export type WorkOrderStatus = z.infer<typeof workOrderStatusSchema>;
export const workOrderStatusLabels: Record<WorkOrderStatus, string> = {
  reported: 'Reported',
  dispatched: 'Dispatched',
  in_field: 'In the field',
  awaiting_signoff: 'Awaiting sign-off',
  returned: 'Returned',
  signed_off: 'Signed off',
  cancelled: 'Cancelled',
};
/** States in which a ticket still needs work (and so can run late). */
export const openStatuses: readonly WorkOrderStatus[] = ['reported', 'dispatched', 'in_field', 'awaiting_signoff', 'returned'];

export const priorities = ['P1', 'P2', 'P3', 'P4'] as const;
export const prioritySchema = z.enum(priorities);
export type Priority = z.infer<typeof prioritySchema>;
export const priorityLabels: Record<Priority, string> = { P1: 'P1 · urgent', P2: 'P2 · high', P3: 'P3 · normal', P4: 'P4 · low' };
/** Default time to repair per priority, in hours (admins change it per site). */
export const defaultSlaHours: Record<Priority, number> = { P1: 4, P2: 24, P3: 72, P4: 240 };

export const faultCategories = [
  'open_circuit',
  'low_voltage',
  'low_current',
  'reverse_polarity',
  'insulation_ground_fault',
  'bypass_diode_failure',
  'hot_spot',
  'physical_damage',
  'connector_cable_damage',
  'fuse',
  'shading_soiling',
  'other',
] as const;
export const faultCategorySchema = z.enum(faultCategories, { error: 'Choose a fault category' });
export type FaultCategory = z.infer<typeof faultCategorySchema>;
export const faultCategoryLabels: Record<FaultCategory, string> = {
  open_circuit: 'Open circuit',
  low_voltage: 'Low voltage',
  low_current: 'Low current',
  reverse_polarity: 'Reverse polarity',
  insulation_ground_fault: 'Insulation / ground fault',
  bypass_diode_failure: 'Bypass diode failure',
  hot_spot: 'Hot spot',
  physical_damage: 'Physical damage',
  connector_cable_damage: 'Connector or cable damage',
  fuse: 'Fuse',
  shading_soiling: 'Shading or soiling',
  other: 'Other',
};

export const workOrderSources = ['monitoring_alert', 'inspection', 'customer_call', 'other'] as const;
export const workOrderSourceSchema = z.enum(workOrderSources, { error: 'Choose where the fault was reported from' });
export const workOrderSourceLabels: Record<(typeof workOrderSources)[number], string> = {
  monitoring_alert: 'Monitoring alert',
  inspection: 'Inspection',
  customer_call: 'Customer call',
  other: 'Other',
};

/**
 * The lifecycle, declared once: which transition needs which permission, and what it asks for.
 * The API enforces it; the web app shows only the transitions the signed-in role may take.
 */
export type TransitionRule = {
  from: readonly WorkOrderStatus[];
  to: WorkOrderStatus;
  action: Action;
  /** Only the assigned technician may take it. */
  assigneeOnly?: boolean;
  needsReason?: boolean;
  needsAssignee?: boolean;
  label: string;
};
export const transitionRules: readonly TransitionRule[] = [
  { from: ['reported'], to: 'dispatched', action: 'workOrders:dispatch', needsAssignee: true, label: 'Dispatch' },
  { from: ['dispatched'], to: 'dispatched', action: 'workOrders:dispatch', needsAssignee: true, label: 'Reassign' },
  { from: ['dispatched', 'returned'], to: 'in_field', action: 'workOrders:work', assigneeOnly: true, label: 'Start work' },
  { from: ['in_field'], to: 'awaiting_signoff', action: 'workOrders:work', assigneeOnly: true, label: 'Submit for sign-off' },
  { from: ['awaiting_signoff'], to: 'signed_off', action: 'workOrders:review', label: 'Sign off' },
  { from: ['awaiting_signoff'], to: 'returned', action: 'workOrders:review', needsReason: true, label: 'Return to technician' },
  {
    from: ['reported', 'dispatched', 'in_field', 'awaiting_signoff', 'returned'],
    to: 'cancelled',
    action: 'workOrders:cancel',
    needsReason: true,
    label: 'Cancel ticket',
  },
];

/** The rule for moving a ticket from one state to another, if there is one. */
export function findTransition(from: WorkOrderStatus, to: WorkOrderStatus): TransitionRule | undefined {
  return transitionRules.find((r) => r.to === to && r.from.includes(from));
}

export type TransitionActor = { id: number; role: Role };

const reason = z.string().trim().min(5, 'Give a reason of at least 5 characters').max(2000, 'Use at most 2,000 characters');

export const transitionInputSchema = z.object({
  to: workOrderStatusSchema,
  version: z.number({ error: 'Send the version you last saw' }).int().min(0),
  reason: reason.optional(),
  assigneeId: z.number().int().positive().optional(),
  dueAt: z.iso.datetime({ offset: true, error: 'Use an ISO date and time' }).optional(),
});
export type TransitionInput = z.infer<typeof transitionInputSchema>;

const flag = z.enum(['true', 'false']).transform((v) => v === 'true');
export const workOrderListQuerySchema = z.object({
  status: z
    .string()
    .optional()
    .transform((v) => (v ? v.split(',') : undefined))
    .pipe(z.array(workOrderStatusSchema).optional()),
  priority: z
    .string()
    .optional()
    .transform((v) => (v ? v.split(',') : undefined))
    .pipe(z.array(prioritySchema).optional()),
  siteId: z.coerce.number().int().positive().optional(),
  assigneeId: z.union([z.literal('me'), z.literal('none'), z.coerce.number().int().positive()]).optional(),
  faultCategory: faultCategorySchema.optional(),
  overdue: flag.optional(),
  open: flag.optional(),
  q: z.string().trim().max(100).optional(),
  /** Exactly these tickets (comma-separated ids), e.g. the ones a bulk create just made. */
  ids: z
    .string()
    .optional()
    .transform((v) => (v ? v.split(',').map(Number) : undefined))
    .pipe(z.array(z.number().int().positive({ error: 'ids: comma-separated ticket ids' })).max(500).optional()),
  sort: z
    .enum(['dueAt', '-dueAt', 'reportedAt', '-reportedAt', 'signedOffAt', '-signedOffAt', 'priority', '-priority', 'number', '-number', 'status', '-status'])
    .default('dueAt'),
});

export const workOrderListItemSchema = z.object({
  id: z.number(),
  number: z.string(),
  title: z.string(),
  status: workOrderStatusSchema,
  priority: prioritySchema,
  faultCategory: faultCategorySchema,
  site: z.object({ id: z.number(), code: z.string(), name: z.string(), timeZone: z.string() }),
  assignee: z.object({ id: z.number(), name: z.string() }).nullable(),
  reportedAt: z.string(),
  dueAt: z.string(),
  isOverdue: z.boolean(),
  isDueSoon: z.boolean(),
  stringCount: z.number(),
  stringLabels: z.array(z.string()),
  submittedAt: z.string().nullable().optional(),
  signedOffAt: z.string().nullable().optional(),
  /** For closed tickets: whether it was submitted before its due time. */
  isSlaMet: z.boolean().nullable().optional(),
  version: z.number(),
});
export type WorkOrderListItem = z.infer<typeof workOrderListItemSchema>;

export const workOrderEventSchema = z.object({
  id: z.number(),
  type: z.enum(['created', 'transition', 'assigned', 'updated', 'comment']),
  actor: z.object({ id: z.number(), name: z.string() }).nullable(),
  fromStatus: workOrderStatusSchema.nullable(),
  toStatus: workOrderStatusSchema.nullable(),
  changes: z.record(z.string(), z.object({ from: z.unknown(), to: z.unknown() })).nullable(),
  comment: z.string().nullable(),
  createdAt: z.string(),
});
export type WorkOrderEvent = z.infer<typeof workOrderEventSchema>;

export const workOrderDetailSchema = workOrderListItemSchema.extend({
  description: z.string(),
  source: workOrderSourceSchema,
  createdBy: z.object({ id: z.number(), name: z.string() }),
  returnReason: z.string().nullable(),
  cancelReason: z.string().nullable(),
  strings: z.array(
    z.object({ id: z.number(), label: z.string(), symptom: z.string(), inverterTag: z.string(), mpptInput: z.number() }),
  ),
  events: z.array(workOrderEventSchema),
  /** Raised by safety-relevant evidence (a CoA 3 thermal finding), for the dispatcher to act on. */
  prioritySuggestion: z.object({ priority: prioritySchema, reason: z.string() }).nullable().optional(),
  allowedTransitions: z.array(
    z.object({ to: workOrderStatusSchema, label: z.string(), needsReason: z.boolean(), needsAssignee: z.boolean() }),
  ),
});
export type WorkOrderDetail = z.infer<typeof workOrderDetailSchema>;

/** Due within this many hours counts as "due soon". */
export const DUE_SOON_HOURS = 2;

export const mailCategories = ['assignment', 'submission', 'return', 'overdue'] as const;
export const mailCategoryLabels: Record<(typeof mailCategories)[number], string> = {
  assignment: 'A ticket is assigned to me',
  submission: 'A ticket is submitted for sign-off',
  return: 'A ticket of mine is returned',
  overdue: 'A ticket goes overdue',
};
export const mailPreferencesSchema = z.object({ optOut: z.array(z.enum(mailCategories)).max(4) });

export const slaPolicySchema = z.object({
  P1: z.number().int().min(1).max(24 * 60),
  P2: z.number().int().min(1).max(24 * 60),
  P3: z.number().int().min(1).max(24 * 60),
  P4: z.number().int().min(1).max(24 * 60),
});
export type SlaPolicy = z.infer<typeof slaPolicySchema>;
