import { Icon } from '@/components/ui/icon';

/**
 * Shown before the diode form: a bypass diode sits in the junction box of a module that is live
 * whenever light falls on it, whatever the string fuse says.
 */
export function IsolationCaution() {
  return (
    <div role="note" aria-labelledby="isolation-caution-title" className="flex gap-3 rounded-control border-2 border-attention/50 bg-attention-soft p-4">
      <Icon name="shield" className="mt-0.5 size-7 shrink-0 text-attention" />
      <div className="min-w-0 space-y-2">
        <p id="isolation-caution-title" className="text-lg font-bold">
          Before you open a junction box
        </p>
        <ul className="list-disc space-y-1 pl-5">
          <li>
            <strong>Isolate the string:</strong> open the string fuse or isolator under no load, then lock it out and tag it.
          </li>
          <li>
            <strong>Prove it dead</strong> with a tested voltage meter before touching anything.
          </li>
          <li>
            <strong>Cover or shade the module.</strong> A module in daylight stays live, whatever the isolator says.
          </li>
          <li>Wear PPE rated for DC arc flash.</li>
          <li>Follow the module maker&apos;s instructions and the local electrical code. Qualified persons only.</li>
        </ul>
      </div>
    </div>
  );
}
