import type { HealthCell } from '@stringfield/shared';

/** A health-map cell with sensible defaults; override what the test is about. */
export function buildHealthCell(overrides: Partial<HealthCell> = {}): HealthCell {
  return {
    stringId: 1,
    label: 'INV01-MPPT1-S1',
    inverterTag: 'INV01',
    mpptInput: 1,
    combinerTag: 'CB-01A',
    combinerPosition: 1,
    verdict: null,
    vocDeviationPct: null,
    iscDeviationPct: null,
    checkedAt: null,
    openTickets: 0,
    ...overrides,
  };
}

/**
 * A generated plant: `inverters` × `inputs` × `perInput` strings, handed over shuffled (as a
 * database might) so layout tests prove the ordering rather than inherit it.
 */
export function buildPlant({ inverters, inputs, perInput, seed = 7 }: { inverters: number; inputs: number; perInput: number; seed?: number }): HealthCell[] {
  const cells: HealthCell[] = [];
  const verdicts: HealthCell['verdict'][] = [null, 'pass', 'pass', 'pass', 'attention', 'fail'];
  let id = 1;
  for (let i = 1; i <= inverters; i++) {
    const inv = `INV${String(i).padStart(2, '0')}`;
    for (let m = 1; m <= inputs; m++) {
      for (let s = 1; s <= perInput; s++) {
        const verdict = verdicts[id % verdicts.length] ?? null;
        cells.push(
          buildHealthCell({
            stringId: id,
            label: `${inv}-MPPT${m}-S${s}`,
            inverterTag: inv,
            mpptInput: m,
            combinerTag: `CB-${String(i).padStart(2, '0')}`,
            combinerPosition: (m - 1) * perInput + s,
            verdict,
            vocDeviationPct: verdict ? -((id % 17) * 1.3) : null,
            iscDeviationPct: verdict ? (id % 5) * -0.4 : null,
            checkedAt: verdict ? '2026-11-20T09:30:00.000Z' : null,
            openTickets: id % 97 === 0 ? 1 : 0,
          }),
        );
        id++;
      }
    }
  }
  // Deterministic shuffle (mulberry32).
  let t = seed;
  const random = () => {
    t = (t + 0x6d2b79f5) | 0;
    let r = Math.imul(t ^ (t >>> 15), 1 | t);
    r = (r + Math.imul(r ^ (r >>> 7), 61 | r)) ^ r;
    return ((r ^ (r >>> 14)) >>> 0) / 4294967296;
  };
  for (let k = cells.length - 1; k > 0; k--) {
    const j = Math.floor(random() * (k + 1));
    [cells[k], cells[j]] = [cells[j]!, cells[k]!];
  }
  return cells;
}
