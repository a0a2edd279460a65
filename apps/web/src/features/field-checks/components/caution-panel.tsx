import { Button } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';

const cautions = [
  'Wear PPE rated for DC arc flash at this system voltage: gloves, face shield, arc-rated clothing.',
  'Never open a connector or a disconnect under load. Isolate at the inverter first and confirm the current is zero with a clamp meter.',
  'Use test leads and probes rated for the string voltage (CAT III 1500 V DC or as the system needs).',
  'Lock out and tag out the inverter input and the combiner before touching conductors.',
  'Only qualified persons carry out these tests.',
  'Follow the local electrical code, the site rules and licensed practice wherever they differ from this app.',
];

/**
 * The DC safety caution, shown before the first check of each day. A PV string cannot be switched
 * off in daylight; these are the rules that keep a technician safe while measuring it.
 */
export function CautionPanel({ onAcknowledge }: { onAcknowledge: () => void }) {
  return (
    <section aria-labelledby="dc-caution-title" className="rounded-card border-2 border-attention bg-attention-soft p-4 sm:p-6">
      <h2 id="dc-caution-title" className="flex items-center gap-2 text-xl font-bold text-ink">
        <Icon name="alert" className="size-7 text-attention" />
        Before you measure: DC is live in daylight
      </h2>
      <ul className="mt-4 flex flex-col gap-3 text-base text-ink">
        {cautions.map((text) => (
          <li key={text} className="flex gap-2">
            <Icon name="shield" className="mt-0.5 size-5 text-attention" />
            <span>{text}</span>
          </li>
        ))}
      </ul>
      <div className="mt-4 rounded-control border-2 border-fail bg-surface p-3" role="note">
        <p className="flex items-start gap-2 font-bold text-fail">
          <Icon name="fail" className="mt-0.5 size-5" />
          Polarity: if the Voc reads negative or the polarity is reversed, stop. Do not connect the string or close its fuse or switch.
        </p>
      </div>
      <Button variant="brand" size="lg" isFullWidth className="mt-5" onClick={onAcknowledge}>
        <Icon name="check" />
        I have read this: start today’s checks
      </Button>
      <p className="mt-2 text-sm text-ink-muted">Asked once a day on this phone.</p>
    </section>
  );
}
