import { Icon } from '@/components/ui/icon';

const rules = [
  {
    title: 'Wear PPE rated for DC arc flash',
    detail: 'Arc-rated clothing, face shield and insulating gloves suited to the array’s maximum DC voltage and the available fault current.',
  },
  {
    title: 'Never open a connector or disconnect under load',
    detail: 'A DC arc does not go out by itself. Stop the current at the inverter or a load-break switch first, then open connectors.',
  },
  {
    title: 'Use rated test leads and meters',
    detail: 'Category and voltage rating at or above the string’s maximum open-circuit voltage on a cold morning, leads undamaged and fused.',
  },
  {
    title: 'Lock out and tag out',
    detail: 'Isolate, lock, tag and prove dead before you touch. Modules in daylight stay live on their own side of any isolator.',
  },
  {
    title: 'Qualified persons only',
    detail: 'Work only on what you are trained, authorised and fit to do today. If in doubt, stop and call your supervisor.',
  },
] as const;

/** The rules that come before any reading. Stringfield records checks; it never overrides site rules. */
export function FieldSafetyCard() {
  return (
    <section aria-labelledby="field-safety" className="overflow-hidden rounded-card border-2 border-attention/50 bg-surface shadow-card">
      <div className="flex items-center gap-3 bg-attention-soft px-4 py-3">
        <Icon name="bolt" className="size-7 text-attention" />
        <h2 id="field-safety" className="text-lg font-bold">
          Before you touch a string
        </h2>
      </div>
      <ol className="divide-y divide-line">
        {rules.map((rule, index) => (
          <li key={rule.title} className="flex gap-3 px-4 py-3">
            <span className="readings mt-0.5 grid size-7 shrink-0 place-items-center rounded-full bg-ink text-sm font-bold text-paper" aria-hidden="true">
              {index + 1}
            </span>
            <div>
              <p className="font-semibold text-ink">{rule.title}</p>
              <p className="text-ink-muted">{rule.detail}</p>
            </div>
          </li>
        ))}
      </ol>
      <p className="flex gap-2 border-t-2 border-attention/30 bg-paper px-4 py-3 text-ink">
        <Icon name="shield" className="mt-0.5 size-5 text-brand" />
        <span>
          <strong>Local codes and licensed-practice rules come first.</strong> Where they ask for more than this card, follow them.
        </span>
      </p>
    </section>
  );
}
