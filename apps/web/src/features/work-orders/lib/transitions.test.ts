import { describe, expect, it } from 'vitest';
import { canAssignFrom, transitionActions, type AllowedTransition } from './transitions';

const t = (
  to: AllowedTransition['to'],
  label: string,
  extra: Partial<AllowedTransition> = {},
): AllowedTransition => ({
  to,
  label,
  needsReason: false,
  needsAssignee: false,
  ...extra,
});

describe('transitionActions', () => {
  it('shows a dispatcher Dispatch first and Cancel last on a reported ticket', () => {
    const actions = transitionActions(
      [t('cancelled', 'Cancel ticket', { needsReason: true }), t('dispatched', 'Dispatch', { needsAssignee: true })],
      'reported',
    );
    expect(actions.map((a) => [a.label, a.kind, a.variant])).toEqual([
      ['Dispatch', 'assign', 'primary'],
      ['Cancel ticket', 'reason', 'danger'],
    ]);
  });

  it('makes Reassign a side step, not the main action', () => {
    const [reassign] = transitionActions(
      [t('dispatched', 'Reassign', { needsAssignee: true })],
      'dispatched',
    );
    expect(reassign).toMatchObject({ kind: 'assign', variant: 'secondary' });
  });

  it('asks a supervisor to confirm sign-off and for a reason to return', () => {
    const actions = transitionActions(
      [t('returned', 'Return to technician', { needsReason: true }), t('signed_off', 'Sign off')],
      'awaiting_signoff',
    );
    expect(actions.map((a) => [a.to, a.kind, a.variant])).toEqual([
      ['signed_off', 'confirm', 'primary'],
      ['returned', 'reason', 'secondary'],
    ]);
  });

  it('lets a technician start work in one press', () => {
    expect(transitionActions([t('in_field', 'Start work')], 'dispatched')).toMatchObject([
      { kind: 'direct', variant: 'primary' },
    ]);
  });

  it('shows nothing when the server allows nothing (an owner, or a closed ticket)', () => {
    expect(transitionActions([], 'signed_off')).toEqual([]);
  });
});

describe('canAssignFrom', () => {
  it.each([
    ['reported', true],
    ['dispatched', true],
    ['in_field', false],
    ['awaiting_signoff', false],
    ['returned', false],
    ['signed_off', false],
  ] as const)('%s → %s', (status, expected) => {
    expect(canAssignFrom(status)).toBe(expected);
  });
});
