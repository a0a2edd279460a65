import type { CombinerBox, PvString } from '@stringfield/shared';
import { memo, useMemo } from 'react';
import { labelUrl, qrPath } from '../lib/qr-path';
import './label-sheet.css';

const QrCode = memo(function QrCode({ url, label }: { url: string; label: string }) {
  const { size, path } = useMemo(() => qrPath(url), [url]);
  // A quiet zone of 2 modules: enough for phone cameras, with the label's border around it.
  return (
    <svg
      viewBox={`-2 -2 ${size + 4} ${size + 4}`}
      role="img"
      aria-label={`QR code for ${label}`}
      className="size-28 shrink-0 bg-white"
      shapeRendering="crispEdges"
    >
      <path d={path} fill="#000" />
    </svg>
  );
});

function QrLabel({ url, title, lines, siteCode }: { url: string; title: string; lines: string[]; siteCode: string }) {
  return (
    <li className="qr-label flex items-center gap-3 rounded-control border-2 border-line bg-white p-3 text-black">
      <QrCode url={url} label={title} />
      <div className="min-w-0">
        <p className="qr-title readings font-mono text-lg leading-tight font-bold [overflow-wrap:anywhere]">{title}</p>
        {lines.map((line) => (
          <p key={line} className="readings text-sm leading-snug">
            {line}
          </p>
        ))}
        <p className="readings mt-1 font-mono text-sm font-bold tracking-wide">{siteCode}</p>
      </div>
    </li>
  );
}

/**
 * Printable labels: each string's QR opens its page (absolute URL, so any phone camera can follow
 * it; sign-in brings the person back to it). Combiner-box labels open the site.
 */
export function QrLabelSheet({
  origin,
  siteCode,
  strings,
  combinerBoxes,
  stringPath,
  combinerPath,
}: {
  origin: string;
  siteCode: string;
  strings: readonly PvString[];
  combinerBoxes: readonly CombinerBox[];
  stringPath: (stringId: number) => string;
  combinerPath: (box: CombinerBox) => string;
}) {
  return (
    <div className="label-sheet flex flex-col gap-8">
      {strings.length > 0 ? (
        <section className="label-section" aria-labelledby="string-labels">
          <h2 id="string-labels" className="label-section-title mb-3 text-lg font-semibold">
            String labels ({strings.length})
          </h2>
          <ul className="label-grid grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
            {strings.map((s) => (
              <QrLabel
                key={s.id}
                url={labelUrl(origin, stringPath(s.id))}
                title={s.label}
                siteCode={siteCode}
                lines={[`${s.inverterTag} · MPPT ${s.mpptInput}`, s.combinerTag ? `${s.combinerTag}${s.combinerPosition ? ` · pos ${s.combinerPosition}` : ''}` : `${s.modulesInSeries} × ${s.moduleModel}`]}
              />
            ))}
          </ul>
        </section>
      ) : null}
      {combinerBoxes.length > 0 ? (
        <section className="label-section" aria-labelledby="combiner-labels">
          <h2 id="combiner-labels" className="label-section-title mb-3 text-lg font-semibold">
            Combiner box labels ({combinerBoxes.length})
          </h2>
          <ul className="label-grid grid gap-3 sm:grid-cols-2 xl:grid-cols-3">
            {combinerBoxes.map((b) => (
              <QrLabel
                key={b.id}
                url={labelUrl(origin, combinerPath(b))}
                title={b.tag}
                siteCode={siteCode}
                lines={[`${b.stringCount} ${b.stringCount === 1 ? 'string' : 'strings'}`, b.fuseRatingA ? `Fuses ${b.fuseRatingA} A` : 'Combiner box']}
              />
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}
