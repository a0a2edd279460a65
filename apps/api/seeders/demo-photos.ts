import sharp, { type Sharp } from 'sharp';
import { offsetMsAt, wallClockAt } from '../src/lib/zoned-time.ts';

// Invented pictures for the demo evidence, drawn rather than photographed: a multimeter showing the
// after-repair reading, a junction box before and after a diode change, and a false-colour thermal image
// of a hot junction box. No text is set (fonts differ between machines; the shapes do not), so the same
// input gives the same bytes on every seed. 640 × 480 keeps the seed fast and the files small.

export const PHOTO_WIDTH = 640;
export const PHOTO_HEIGHT = 480;
const W = PHOTO_WIDTH;
const H = PHOTO_HEIGHT;

/** EXIF as a phone writes it: the capture time on the site's wall clock with its UTC offset (EXIF 2.31). */
function exifOf(at: Date, timeZone: string, camera: string) {
  const w = wallClockAt(at, timeZone);
  const offsetMin = Math.round(offsetMsAt(at.getTime(), timeZone) / 60_000);
  const abs = Math.abs(offsetMin);
  const two = (n: number) => String(n).padStart(2, '0');
  const offset = `${offsetMin < 0 ? '-' : '+'}${two(Math.floor(abs / 60))}:${two(abs % 60)}`;
  const stamp = `${w.year}:${two(w.month)}:${two(w.day)} ${two(w.hour)}:${two(w.minute)}:${two(w.second)}`;
  return {
    IFD0: { Make: 'Stringfield Demo', Model: camera, DateTime: stamp },
    IFD2: { DateTimeOriginal: stamp, OffsetTimeOriginal: offset },
  };
}

const jpeg = (img: Sharp, at: Date, timeZone: string, camera: string) =>
  img
    .jpeg({ quality: 82 })
    .withExif(exifOf(at, timeZone, camera))
    .toBuffer();

// ---------- seven-segment digits (no font needed) ----------
const SEGMENTS: Record<string, string> = {
  '0': 'abcdef',
  '1': 'bc',
  '2': 'abged',
  '3': 'abgcd',
  '4': 'fgbc',
  '5': 'afgcd',
  '6': 'afgedc',
  '7': 'abc',
  '8': 'abcdefg',
  '9': 'abcdfg',
  '-': 'g',
  ' ': '',
};
type Rgb = readonly [number, number, number];

/** Fill a rectangle leaning right by `skew` px per px of height (an LCD's italic), straight into RGB pixels. */
function fillSkewed(
  px: Buffer,
  x: number,
  y: number,
  w: number,
  h: number,
  skew: number,
  colour: Rgb,
  baseY: number,
): void {
  for (let row = Math.round(y); row < Math.round(y + h); row += 1) {
    const shift = (baseY - row) * skew;
    for (let col = Math.round(x + shift); col < Math.round(x + w + shift); col += 1) {
      const i = (row * W + col) * 3;
      px[i] = colour[0];
      px[i + 1] = colour[1];
      px[i + 2] = colour[2];
    }
  }
}

/** Paint a number on a seven-segment display at (x, y), one digit cell per character ("." joins the digit before). */
function sevenSegment(
  px: Buffer,
  text: string,
  x: number,
  y: number,
  digitW: number,
  digitH: number,
  colour: Rgb,
): void {
  const t = Math.max(3, Math.round(digitW * 0.2));
  const gap = Math.round(digitW * 0.4);
  const half = (digitH - 3 * t) / 2;
  const seg: Record<string, [number, number, number, number]> = {
    a: [t, 0, digitW - 2 * t, t],
    b: [digitW - t, t, t, half],
    c: [digitW - t, 2 * t + half, t, half],
    d: [t, digitH - t, digitW - 2 * t, t],
    e: [0, 2 * t + half, t, half],
    f: [0, t, t, half],
    g: [t, t + half, digitW - 2 * t, t],
  };
  const skew = 0.1;
  let i = 0;
  for (const c of text) {
    const ox = x + i * (digitW + gap);
    if (c === '.') {
      fillSkewed(px, ox - gap * 0.7, y + digitH - t, t, t, skew, colour, y + digitH);
      continue;
    }
    for (const s of SEGMENTS[c] ?? '') {
      const [sx, sy, sw, sh] = seg[s]!;
      fillSkewed(px, ox + sx, y + sy, sw, sh, skew, colour, y + digitH);
    }
    i += 1;
  }
}

/** A unit glyph ("V" or "A") drawn as strokes. */
function unit(kind: 'V' | 'A', x: number, y: number, w: number, h: number, colour: string): string {
  const d =
    kind === 'V'
      ? `M${x} ${y}L${x + w / 2} ${y + h}L${x + w} ${y}`
      : `M${x} ${y + h}L${x + w / 2} ${y}L${x + w} ${y + h}M${x + w * 0.22} ${y + h * 0.62}H${x + w * 0.78}`;
  return `<path d="${d}" stroke="${colour}" stroke-width="${(w * 0.16).toFixed(1)}" fill="none" stroke-linejoin="round"/>`;
}

/** A small repeatable pseudo-random source for the scene's variation (mulberry32). */
function rng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const LCD = { x: 206, y: 78, ink: [28, 36, 25] as Rgb };
const METER_SCENES = 4;
const meterScenes = new Map<number, Promise<Buffer>>();

/**
 * One of a few scenes of the meter in front of the modules, without its reading, as raw RGB pixels: drawn
 * once per process, so that each meter photo costs one JPEG encode rather than an SVG render.
 */
function meterScene(variant: number): Promise<Buffer> {
  let scene = meterScenes.get(variant);
  if (scene) return scene;
  const r = rng(variant + 1);
  const sky = 190 + Math.round(r() * 30);
  const shiftX = Math.round((r() * 2 - 1) * 60);
  const cells: string[] = [];
  for (let i = 0; i < 4; i += 1) {
    const x0 = -40 + i * 190 + shiftX;
    cells.push(
      `<rect x="${x0}" y="40" width="180" height="300" fill="#1f2f5c" stroke="#c9ced6" stroke-width="5"/>`,
    );
    for (let c = 1; c < 6; c += 1)
      cells.push(
        `<line x1="${x0 + c * 30}" y1="40" x2="${x0 + c * 30}" y2="340" stroke="#33477a" stroke-width="2"/>`,
      );
    for (let c = 1; c < 10; c += 1)
      cells.push(
        `<line x1="${x0}" y1="${40 + c * 30}" x2="${x0 + 180}" y2="${40 + c * 30}" stroke="#33477a" stroke-width="2"/>`,
      );
  }
  const ink = `rgb(${LCD.ink.join(',')})`;
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">
  <defs><linearGradient id="sky" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="rgb(${sky - 60},${sky - 20},${sky + 30})"/><stop offset="1" stop-color="rgb(${sky},${sky + 10},${sky + 25})"/></linearGradient>
  <linearGradient id="ground" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#6f7a4a"/><stop offset="1" stop-color="#4e5734"/></linearGradient></defs>
  <rect width="${W}" height="${H}" fill="url(#sky)"/>
  <g transform="skewY(${(-8 + r() * 4).toFixed(1)}) translate(0 40)">${cells.join('')}</g>
  <rect y="380" width="${W}" height="100" fill="url(#ground)"/>
  <path d="M300 470 C 280 420, 200 440, 150 480" stroke="#b3261e" stroke-width="9" fill="none"/>
  <path d="M340 470 C 360 420, 460 440, 520 480" stroke="#1b1b1b" stroke-width="9" fill="none"/>
  <rect x="170" y="40" width="300" height="430" rx="38" fill="#e9b92f"/>
  <rect x="188" y="58" width="264" height="394" rx="26" fill="#2d3033"/>
  <rect x="${LCD.x}" y="${LCD.y}" width="228" height="150" rx="8" fill="#b9c6a9"/>
  ${unit('V', 404, 100, 20, 26, ink)}
  ${unit('A', 406, 176, 18, 24, ink)}
  <circle cx="320" cy="320" r="66" fill="#1b1d1f" stroke="#5a5f64" stroke-width="6"/>
  <rect x="314" y="258" width="12" height="52" rx="5" fill="#d9dde1" transform="rotate(${(-50 + r() * 10).toFixed(1)} 320 320)"/>
  <circle cx="250" cy="420" r="13" fill="#b3261e"/><circle cx="320" cy="420" r="13" fill="#111"/><circle cx="390" cy="420" r="13" fill="#444"/>
  </svg>`;
  scene = sharp(Buffer.from(svg)).removeAlpha().raw().toBuffer();
  meterScenes.set(variant, scene);
  return scene;
}

/**
 * A multimeter held in front of the modules, its display showing the reading (Voc in V, Isc in A if
 * measured): the after-repair photo a technician takes of the meter at each string.
 */
export async function meterPhoto(args: {
  vocV: number;
  iscA: number | null;
  seed: number;
  at: Date;
  timeZone: string;
}): Promise<Buffer> {
  const px = Buffer.from(await meterScene(args.seed % METER_SCENES));
  const voc = args.vocV.toFixed(1);
  const isc = args.iscA === null ? '----' : args.iscA.toFixed(2);
  // Right-aligned like a meter's display: five digit cells for Voc, four for Isc.
  const vocDigits = voc.replace('.', '').length;
  const iscDigits = isc.replace('.', '').length;
  sevenSegment(px, voc, LCD.x + 18 + (5 - vocDigits) * 34, LCD.y + 18, 24, 54, LCD.ink);
  sevenSegment(px, isc, LCD.x + 62 + (4 - iscDigits) * 26, LCD.y + 90, 18, 40, LCD.ink);
  return jpeg(
    sharp(px, { raw: { width: W, height: H, channels: 3 } }),
    args.at,
    args.timeZone,
    'SF-Demo Phone',
  );
}

/**
 * The inside of a module's junction box, three bypass diodes between the terminal strips; `scorchedDiode`
 * darkens the one that failed short (the before photo), `newDiode` marks the fresh part (the after photo).
 */
export function junctionBoxPhoto(args: {
  scorchedDiode?: number;
  newDiode?: number;
  seed: number;
  at: Date;
  timeZone: string;
}): Promise<Buffer> {
  const r = rng(args.seed);
  const tilt = (r() * 2 - 1) * 4;
  const diodes: string[] = [];
  for (let i = 1; i <= 3; i += 1) {
    const cx = 160 + i * 80;
    const scorched = args.scorchedDiode === i;
    const fresh = args.newDiode === i;
    if (scorched) diodes.push(`<ellipse cx="${cx}" cy="250" rx="52" ry="70" fill="url(#burn)"/>`);
    diodes.push(
      `<rect x="${cx - 16}" y="205" width="32" height="90" rx="6" fill="${scorched ? '#2a1a12' : fresh ? '#141414' : '#202020'}"/>`,
      `<rect x="${cx - 16}" y="${fresh ? 275 : 277}" width="32" height="10" fill="${scorched ? '#5b4a3e' : '#c9cdd2'}"/>`,
      `<rect x="${cx - 4}" y="180" width="8" height="25" fill="#b8bcc0"/><rect x="${cx - 4}" y="295" width="8" height="25" fill="#b8bcc0"/>`,
    );
    if (fresh) diodes.push(`<rect x="${cx - 10}" y="212" width="5" height="55" rx="2" fill="#5c5c5c"/>`);
  }
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}">
  <defs><radialGradient id="burn"><stop offset="0" stop-color="#1a0f08" stop-opacity="0.95"/><stop offset="0.6" stop-color="#5a3413" stop-opacity="0.7"/><stop offset="1" stop-color="#8a6a3a" stop-opacity="0"/></radialGradient></defs>
  <rect width="${W}" height="${H}" fill="#e6e4dd"/>
  <g stroke="#d4d1c8" stroke-width="3">${Array.from({ length: 9 }, (_, i) => `<line x1="0" y1="${i * 60}" x2="${W}" y2="${i * 60 + 20}"/>`).join('')}</g>
  <g transform="rotate(${tilt.toFixed(2)} 320 240)">
    <rect x="120" y="90" width="400" height="300" rx="18" fill="#2b2e31"/>
    <rect x="140" y="110" width="360" height="260" rx="10" fill="#5d6368"/>
    ${[180, 320].map((y) => `<rect x="150" y="${y - 4}" width="340" height="${y === 180 ? 8 : 8}" fill="#c7a15a"/>`).join('')}
    ${[200, 280, 360, 440].map((x) => `<rect x="${x - 9}" y="150" width="18" height="200" rx="3" fill="#b9bdc2"/>`).join('')}
    ${diodes.join('')}
    <rect x="60" y="150" width="70" height="26" rx="10" fill="#161616"/><rect x="60" y="300" width="70" height="26" rx="10" fill="#161616"/>
    <rect x="510" y="150" width="80" height="26" rx="10" fill="#161616"/><rect x="510" y="300" width="80" height="26" rx="10" fill="#161616"/>
  </g></svg>`;
  return jpeg(sharp(Buffer.from(svg)), args.at, args.timeZone, 'SF-Demo Phone');
}

/** The "iron" false-colour scale of thermal cameras: black, blue, magenta, red, orange, yellow, white. */
const IRON: Array<[number, number, number, number]> = [
  [0, 0, 0, 10],
  [0.18, 40, 0, 140],
  [0.38, 150, 0, 150],
  [0.58, 225, 60, 40],
  [0.76, 250, 150, 0],
  [0.92, 255, 230, 60],
  [1, 255, 255, 240],
];
function iron(x: number): [number, number, number] {
  const v = Math.min(1, Math.max(0, x));
  for (let i = 1; i < IRON.length; i += 1) {
    const [p1, r1, g1, b1] = IRON[i]!;
    const [p0, r0, g0, b0] = IRON[i - 1]!;
    if (v <= p1) {
      const f = (v - p0) / (p1 - p0);
      return [r0 + (r1 - r0) * f, g0 + (g1 - g0) * f, b0 + (b1 - b0) * f];
    }
  }
  return [255, 255, 240];
}

/**
 * A false-colour thermal image of three modules in portrait, the middle one with a junction box at
 * `hottestC` against cells at `referenceC`: scale `spanC` wide from `minC`, a colour bar on the right and
 * the camera's cross-hair on the hottest spot.
 */
export function thermalPhoto(args: {
  hottestC: number;
  referenceC: number;
  ambientC: number;
  seed: number;
  at: Date;
  timeZone: string;
}): Promise<Buffer> {
  const r = rng(args.seed);
  const minC = Math.floor(args.ambientC - 5);
  const maxC = Math.ceil(args.hottestC + 4);
  const lut = Array.from({ length: 256 }, (_, i) => iron(i / 255));
  const px = Buffer.alloc(W * H * 3);
  const modW = 170;
  const modH = 400;
  const top = 40;
  const lefts = [30, 215, 400];
  const hot = { x: lefts[1]! + modW / 2, y: top + 38 };
  // Gentle, repeatable variation over the array: cells differ by a few tenths of a kelvin.
  const cellOffset = Array.from({ length: 3 * 60 }, () => (r() * 2 - 1) * 0.6);
  // Per column: which module (−1 for none), which cell column, and whether it is a gap between cells.
  const col = Array.from({ length: W }, (_, x) => {
    const m = lefts.findIndex((l) => x >= l && x < l + modW);
    const u = m >= 0 ? x - lefts[m]! : 0;
    return { m, cx: Math.floor((u / modW) * 6), isGap: u % (modW / 6) <= 2 };
  });
  const spreadM = 2 * 22 ** 2; // heat spreading from the box, 22 px standard deviation
  for (let y = 0; y < H; y += 1) {
    const v = y - top;
    const inRow = v >= 0 && v < modH;
    const cy = Math.floor((v / modH) * 10);
    const rowGap = v % (modH / 10) <= 2;
    for (let x = 0; x < W; x += 1) {
      let c = args.ambientC + 2 + (y / H) * 3; // roof membrane, warmer lower down
      const k = col[x]!;
      if (x >= 590)
        c = minC + (1 - y / H) * (maxC - minC); // the colour bar
      else if (k.m >= 0 && inRow) {
        c = k.isGap || rowGap ? args.referenceC - 3 : args.referenceC + cellOffset[k.m * 60 + cy * 6 + k.cx]!; // frame and gaps cooler
        if (k.m === 1)
          c +=
            (args.hottestC - args.referenceC) *
            Math.exp(-((x - hot.x) ** 2 + ((y - hot.y) * 1.4) ** 2) / spreadM);
      }
      const [red, green, blue] =
        lut[Math.max(0, Math.min(255, Math.round(((c - minC) / (maxC - minC)) * 255)))]!;
      const i = (y * W + x) * 3;
      px[i] = red;
      px[i + 1] = green;
      px[i + 2] = blue;
    }
  }
  // The cross-hair on the hottest spot.
  for (let d = -14; d <= 14; d += 1) {
    if (Math.abs(d) < 4) continue;
    for (const [x, y] of [
      [hot.x + d, hot.y],
      [hot.x, hot.y + d],
    ] as const) {
      const i = (Math.round(y) * W + Math.round(x)) * 3;
      px.fill(255, i, i + 3);
    }
  }
  return jpeg(
    sharp(px, { raw: { width: W, height: H, channels: 3 } }),
    args.at,
    args.timeZone,
    'SF-Demo Thermal 640',
  );
}
