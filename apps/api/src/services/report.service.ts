import { createRequire } from 'node:module';
import path from 'node:path';
import pdfmake from 'pdfmake';
import {
  faultCategoryLabels,
  photoTagLabels,
  workOrderStatusLabels,
  type SessionUser,
  type StringCheck as StringCheckDto,
} from '@stringfield/shared';
import { storage } from '../lib/storage.ts';
import { logger } from '../lib/logger.ts';
import { IvTrace, Photo, Site } from '../models/index.ts';
import { listTicketChecks } from './field-checks.service.ts';
import { listDiodeReplacements, listPhotos, visibleTicket } from './evidence.service.ts';
import { getSignOff } from './sign-off.service.ts';
import { getWorkOrder } from './work-orders.service.ts';

// Inter as TTF from an npm font package: PDF libraries here cannot read WOFF2.
const require = createRequire(import.meta.url);
const interDir = path.dirname(require.resolve('@expo-google-fonts/inter/package.json'));
const font = (weight: string, file: string) => path.join(interDir, weight, file);
pdfmake.addFonts({
  Inter: {
    normal: font('400Regular', 'Inter_400Regular.ttf'),
    bold: font('700Bold', 'Inter_700Bold.ttf'),
    italics: font('400Regular_Italic', 'Inter_400Regular_Italic.ttf'),
    bolditalics: font('700Bold_Italic', 'Inter_700Bold_Italic.ttf'),
  },
});
pdfmake.setUrlAccessPolicy(() => false);
pdfmake.setLocalAccessPolicy((p) => path.resolve(p).startsWith(interDir));

const ink = '#13201D';
const brand = '#0E4B4F';
const muted = '#44524F';

const fmt = (n: number | null | undefined, digits = 1) => (n === null || n === undefined ? '—' : n.toFixed(digits));
const pct = (n: number | null | undefined) => (n === null || n === undefined ? '—' : `${n > 0 ? '+' : ''}${n.toFixed(1)} %`);
const when = (iso: string | null | undefined, tz: string) =>
  iso ? new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeStyle: 'short', timeZone: tz }).format(new Date(iso)) : '—';

function table(headers: string[], rows: string[][], widths?: Array<string | number>) {
  return {
    table: {
      headerRows: 1,
      widths: widths ?? headers.map(() => '*'),
      body: [headers.map((h) => ({ text: h, bold: true, color: '#FFFFFF', fillColor: brand })), ...rows.map((r) => r.map((c) => ({ text: c })))],
    },
    layout: { hLineColor: () => '#C9C4B8', vLineColor: () => '#C9C4B8', paddingTop: () => 3, paddingBottom: () => 3 },
    fontSize: 8,
    margin: [0, 4, 0, 12],
  };
}

function ivSvg(points: Array<{ voltageV: number; currentA: number }>, stc: Array<{ voltageV: number; currentA: number }>): string {
  const w = 480;
  const h = 200;
  const all = [...points, ...stc];
  const maxV = Math.max(...all.map((p) => p.voltageV), 1);
  const maxI = Math.max(...all.map((p) => p.currentA), 0.1);
  const line = (pts: typeof points) => pts.map((p) => `${((p.voltageV / maxV) * (w - 40) + 35).toFixed(1)},${(h - 25 - (p.currentA / maxI) * (h - 40)).toFixed(1)}`).join(' ');
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}" viewBox="0 0 ${w} ${h}">
<rect x="35" y="15" width="${w - 40}" height="${h - 40}" fill="none" stroke="#C9C4B8"/>
<polyline fill="none" stroke="#A8480F" stroke-width="1.5" points="${line(points)}"/>
<polyline fill="none" stroke="#0E4B4F" stroke-width="1" stroke-dasharray="4,3" points="${line(stc)}"/>
<text x="35" y="${h - 8}" font-size="9" fill="#44524F">0 V</text><text x="${w - 60}" y="${h - 8}" font-size="9" fill="#44524F">${maxV.toFixed(0)} V</text>
<text x="2" y="20" font-size="9" fill="#44524F">${maxI.toFixed(1)} A</text>
</svg>`;
}

/** The close-out report as a PDF: what was found, what was measured, what was done, who signed it off. */
export async function buildReport(user: SessionUser, workOrderId: number): Promise<{ pdf: Buffer; fileName: string }> {
  const wo = await visibleTicket(user, workOrderId);
  const [detail, checks, photos, diodes, signOff, site] = await Promise.all([
    getWorkOrder(user, workOrderId),
    listTicketChecks(user, workOrderId, false),
    listPhotos(user, workOrderId),
    listDiodeReplacements(user, { workOrderId }),
    getSignOff(user, workOrderId),
    Site.findByPk(wo.siteId),
  ]);
  const tz = site?.timeZone ?? 'UTC';
  const traces = await IvTrace.findAll({ where: { checkId: checks.filter((c) => c.hasIvTrace).map((c) => c.id) } });
  const thumbs = await Promise.all(
    photos.slice(0, 24).map(async (p) => {
      try {
        const row = await Photo.findByPk(p.id);
        const data = await storage.get(row!.thumbKey);
        return { p, uri: `data:image/jpeg;base64,${data.toString('base64')}` };
      } catch (err) {
        logger.warn({ err: (err as Error).message, photoId: p.id }, 'thumbnail missing from the report');
        return null;
      }
    }),
  );

  const checkRow = (c: StringCheckDto) => [
    c.stringLabel,
    c.phase,
    when(c.takenAt, tz),
    `${fmt(c.irradianceWm2, 0)} W/m² · ${fmt(c.moduleTempC)} °C`,
    `${fmt(c.vocV)} V`,
    c.expected ? `${fmt(c.expected.vocV)} V` : '—',
    pct(c.vocDeviationPct),
    c.iscA === null ? '—' : `${fmt(c.iscA, 2)} A`,
    c.expected ? `${fmt(c.expected.iscA, 2)} A` : '—',
    pct(c.iscDeviationPct),
    c.verdict.toUpperCase(),
  ];

  const content: unknown[] = [
    { text: 'Stringfield · close-out report', color: brand, bold: true, fontSize: 10 },
    { text: `${detail.number} — ${detail.title}`, fontSize: 18, bold: true, margin: [0, 4, 0, 2] },
    {
      text: `${workOrderStatusLabels[detail.status]}${signOff ? ` on ${when(signOff.signedAt, tz)}` : ' — PREVIEW, not signed off'}`,
      color: signOff ? muted : '#B0231C',
      margin: [0, 0, 0, 10],
    },
    table(
      ['Site', 'Fault category', 'Priority', 'Reported', 'Technician'],
      [[`${detail.site.name} (${detail.site.code})`, faultCategoryLabels[detail.faultCategory], detail.priority, when(detail.reportedAt, tz), detail.assignee?.name ?? '—']],
    ),
    { text: 'Strings', style: 'h2' },
    table(['String', 'Inverter · input', 'Reported symptom'], detail.strings.map((s) => [s.label, `${s.inverterTag} · MPPT ${s.mpptInput}`, s.symptom || '—']), [90, 90, '*']),
    { text: 'Measurements (expected values computed at the measured conditions)', style: 'h2' },
    checks.length
      ? table(['String', 'Phase', 'Taken', 'Conditions', 'Voc', 'Voc exp.', 'ΔVoc', 'Isc', 'Isc exp.', 'ΔIsc', 'Verdict'], checks.map(checkRow), [58, 30, 62, 62, 38, 38, 34, 34, 36, 34, 40])
      : { text: 'No measurements recorded.', italics: true, margin: [0, 0, 0, 10] },
  ];
  const findings = checks.flatMap((c) => c.findings.map((f) => `${c.stringLabel} (${c.phase}): ${f.message}`));
  if (findings.length) content.push({ text: 'Findings', style: 'h2' }, { ul: findings, fontSize: 8, margin: [0, 0, 0, 10] });
  for (const t of traces) {
    const c = checks.find((x) => x.id === t.checkId)!;
    const analysis = JSON.parse(t.analysisJson) as { measured: { pmpW: number; fillFactor: number; likelyBypassedSubstrings: number }; stc: { pmpW: number } };
    content.push(
      { text: `I-V trace — ${c.stringLabel} (${c.phase})`, style: 'h2' },
      { svg: ivSvg(JSON.parse(t.pointsJson) as Array<{ voltageV: number; currentA: number }>, JSON.parse(t.stcPointsJson) as Array<{ voltageV: number; currentA: number }>), width: 480 },
      {
        text: `Measured (solid) at ${fmt(t.irradianceWm2, 0)} W/m², ${fmt(t.cellTempC)} °C: Pmp ${fmt(analysis.measured.pmpW, 0)} W, fill factor ${fmt(analysis.measured.fillFactor, 3)}, likely bypassed substrings ${analysis.measured.likelyBypassedSubstrings}. Translated to STC (dashed, IEC 60891 procedure 1): Pmp ${fmt(analysis.stc.pmpW, 0)} W.`,
        fontSize: 8,
        margin: [0, 2, 0, 10],
      },
    );
  }
  const thermal = photos.filter((p) => p.thermal);
  if (thermal.length) {
    content.push(
      { text: 'Thermal findings', style: 'h2' },
      table(
        ['String', 'Module', 'Pattern', 'Hottest', 'Reference', 'ΔT', 'G', 'Class'],
        thermal.map((p) => [p.stringLabel ?? '—', String(p.thermal!.modulePosition ?? p.modulePosition ?? '—'), p.thermal!.pattern, `${fmt(p.thermal!.hottestC)} °C`, `${fmt(p.thermal!.referenceC)} °C`, `${fmt(p.thermal!.deltaTC)} K`, `${fmt(p.thermal!.irradianceWm2, 0)} W/m²`, p.thermal!.classOfAbnormality ? `CoA ${p.thermal!.classOfAbnormality}` : 'not judged']),
      ),
    );
  }
  if (diodes.length) {
    content.push(
      { text: 'Bypass-diode replacements', style: 'h2' },
      table(
        ['String', 'Module · diode', 'Found', 'Installed part', 'Vf new', 'Voc before → after'],
        diodes.map((d) => [d.stringLabel, `${d.modulePosition} · ${d.diodePosition}`, `${d.failureMode} (${d.foundBy.replace('_', ' ')})`, typeof d.installedPart.partNumber === 'string' ? d.installedPart.partNumber : '', `${fmt(d.newDiodeForwardV, 2)} V`, `${fmt(d.vocBeforeV)} → ${fmt(d.vocAfterV)} V`]),
      ),
    );
  }
  const images = thumbs.filter((x): x is NonNullable<typeof x> => x !== null);
  if (images.length) {
    content.push({ text: 'Photos', style: 'h2' });
    for (let i = 0; i < images.length; i += 4) {
      content.push({
        columns: images.slice(i, i + 4).map(({ p, uri }) => ({
          stack: [{ image: uri, fit: [110, 110] }, { text: `${photoTagLabels[p.tag]}${p.stringLabel ? ` · ${p.stringLabel}` : ''}`, fontSize: 7, color: muted }],
        })),
        columnGap: 8,
        margin: [0, 0, 0, 8],
      });
    }
  }
  content.push(
    { text: 'Timeline', style: 'h2' },
    table(
      ['When', 'Who', 'What'],
      detail.events.map((e) => [
        when(e.createdAt, tz),
        e.actor?.name ?? '—',
        e.type === 'comment' ? `Comment: ${e.comment ?? ''}` : e.toStatus ? `${e.fromStatus ? `${workOrderStatusLabels[e.fromStatus]} → ` : ''}${workOrderStatusLabels[e.toStatus]}${e.comment ? ` (${e.comment})` : ''}` : e.type,
      ]),
      [90, 100, '*'],
    ),
  );
  content.push({ text: 'Sign-off', style: 'h2' });
  if (signOff) {
    content.push({
      stack: [
        `Signed off by ${signOff.supervisor.name} on ${when(signOff.signedAt, tz)}.`,
        ...(signOff.comment ? [`Comment: ${signOff.comment}`] : []),
        ...signOff.overrides.map((o) => `Override for ${o.stringLabel}: ${o.reason}`),
        { text: `Evidence digest (SHA-256): ${signOff.digest}`, fontSize: 7, color: muted, margin: [0, 4, 0, 0] },
      ],
      fontSize: 9,
      margin: [0, 0, 0, 10],
    });
  } else {
    content.push({ text: 'Not signed off yet.', italics: true, margin: [0, 0, 0, 10] });
  }
  content.push({
    text: 'Values are field measurements subject to the accuracy and calibration of the instruments used; expected values are modelled from the module datasheet at the measured irradiance and temperature. Local codes and licensed practice rule over this report.',
    fontSize: 7,
    color: muted,
    margin: [0, 10, 0, 0],
  });

  const doc = pdfmake.createPdf({
    info: { title: `${detail.number} close-out report`, author: 'Stringfield', subject: detail.title },
    pageSize: 'A4',
    pageMargins: [36, 40, 36, 40],
    defaultStyle: { font: 'Inter', fontSize: 9, color: ink },
    styles: { h2: { fontSize: 12, bold: true, color: brand, margin: [0, 6, 0, 2] } },
    footer: (page: number, pages: number) => ({ text: `${detail.number} · page ${page} of ${pages}`, alignment: 'center', fontSize: 7, color: muted, margin: [0, 10, 0, 0] }),
    content,
  });
  return { pdf: await doc.getBuffer(), fileName: `${detail.number}-close-out.pdf` };
}
