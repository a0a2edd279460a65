import { findTransition, type WorkOrderDetail, type WorkOrderStatus } from '@stringfield/shared';

export type AllowedTransition = WorkOrderDetail['allowedTransitions'][number];

/**
 * How the page asks for a transition: pick a technician (`assign`), give a reason (`reason`),
 * confirm first (`confirm`, for sign-off, which closes the ticket), or just do it (`direct`).
 */
export type TransitionKind = 'assign' | 'reason' | 'confirm' | 'direct';
export type TransitionAction = AllowedTransition & {
  kind: TransitionKind;
  variant: 'primary' | 'secondary' | 'danger';
};

const rank = { primary: 0, secondary: 1, danger: 2 } as const;

/**
 * The buttons for the transitions the server allows this person now, in screen order: the one
 * forward step first (primary), side steps next, cancelling last. Only what `allowedTransitions`
 * lists is shown; the server decides, the page never guesses.
 */
export function transitionActions(
  allowed: readonly AllowedTransition[],
  currentStatus: WorkOrderStatus,
): TransitionAction[] {
  const actions = allowed.map((t): TransitionAction => {
    const kind: TransitionKind = t.needsAssignee
      ? 'assign'
      : t.needsReason
        ? 'reason'
        : t.to === 'signed_off'
          ? 'confirm'
          : 'direct';
    const isReassign = t.to === currentStatus;
    const variant =
      t.to === 'cancelled' ? 'danger' : t.to === 'returned' || isReassign ? 'secondary' : 'primary';
    return { ...t, kind, variant };
  });
  let hasPrimary = false;
  return actions
    .sort((a, b) => rank[a.variant] - rank[b.variant])
    .map((a) => {
      if (a.variant !== 'primary') return a;
      if (hasPrimary) return { ...a, variant: 'secondary' };
      hasPrimary = true;
      return a;
    });
}

/** Whether a ticket in this state can be (re)assigned from the board. */
export function canAssignFrom(status: WorkOrderStatus): boolean {
  return findTransition(status, 'dispatched') !== undefined;
}
