import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { Blob, Face } from 'harfbuzzjs';
import subsetFont from 'subset-font';
import type { Plugin } from 'vite';

/**
 * The faces a page's text almost always needs, cut down from the font packages' Latin files: printable
 * ASCII, the Latin-1 signs (°, ², µ, ±, ·, ×, ÷), dashes, quotes, … and the minus sign; only the weights
 * the app uses and the OpenType features it asks for. Inter's Latin file is 48 KB, its core 23 KB; on a
 * phone over a slow network those bytes come before the first page's text.
 *
 * src/fonts.css declares each core face after the package's own faces, with the core's unicode-range, so
 * the browser looks there first (overlapping ranges are tried from the last declared). A character
 * outside the core (an accented letter in a person's or a site's name) still comes from the package's full
 * Latin file, downloaded only when such a character is on the page; other scripts from their subsets.
 */
export const wantedRanges: ReadonlyArray<readonly [number, number]> = [
  [0x20, 0x7e],
  [0xa0, 0xbf],
  [0xd7, 0xd7],
  [0xf7, 0xf7],
  [0x2010, 0x2027],
  [0x2030, 0x203a],
  [0x2212, 0x2212],
  [0x2215, 0x2215],
];

/** Features the app's CSS and the fonts' defaults use (styles.css: cv11, ss01, tnum). */
const keepFeatures = ['kern', 'liga', 'calt', 'ccmp', 'locl', 'mark', 'mkmk', 'case', 'cv11', 'ss01', 'tnum'];

type CoreFace = { pkg: string; file: string; out: string; weights: { min: number; max: number } };

export const coreFaces: readonly CoreFace[] = [
  // font-normal to font-bold, and the 800 of the fleet map's numbers.
  { pkg: '@fontsource-variable/inter', file: 'inter-latin-wght-normal.woff2', out: 'inter-core-wght-normal.woff2', weights: { min: 400, max: 800 } },
  { pkg: '@fontsource-variable/space-grotesk', file: 'space-grotesk-latin-wght-normal.woff2', out: 'space-grotesk-core-wght-normal.woff2', weights: { min: 400, max: 700 } },
];

/** Code points as a CSS unicode-range value: "U+0020-007E,U+00A0,…". */
export function toUnicodeRange(codePoints: Iterable<number>): string {
  const sorted = [...new Set(codePoints)].sort((a, b) => a - b);
  const hex = (n: number) => n.toString(16).toUpperCase().padStart(4, '0');
  const parts: string[] = [];
  for (let i = 0; i < sorted.length; ) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1] === sorted[j]! + 1) j++;
    parts.push(i === j ? `U+${hex(sorted[i]!)}` : `U+${hex(sorted[i]!)}-${hex(sorted[j]!)}`);
    i = j + 1;
  }
  return parts.join(',');
}

/** The code points of a CSS unicode-range value. */
export function parseUnicodeRange(value: string): number[] {
  return value.split(',').flatMap((part) => {
    const m = /^\s*U\+([0-9A-F]+)(?:-([0-9A-F]+))?\s*$/i.exec(part);
    if (!m) throw new Error(`not a unicode-range part: ${part}`);
    const a = parseInt(m[1]!, 16);
    const b = m[2] ? parseInt(m[2], 16) : a;
    return Array.from({ length: b - a + 1 }, (_, k) => a + k);
  });
}

/** The code points a TrueType/OpenType font maps to a glyph. */
function mappedCodePoints(font: Buffer): Set<number> {
  return new Set(new Face(new Blob(new Uint8Array(font)), 0).collectUnicodes());
}

/** The unicode-range declared in a stylesheet for the face whose src ends in `file`. */
function declaredRange(css: string, file: string): string | undefined {
  const escaped = file.replace(/[.]/g, '\\.');
  return new RegExp(`${escaped}\\)[^;]*;\\s*unicode-range:\\s*([^;]+);`).exec(css)?.[1]?.replace(/\s/g, '');
}

/**
 * Writes the core faces into `outDir` before Vite reads any module (dev and build), so fonts.css can
 * point at them like any other asset. A core declares exactly the characters it has glyphs for (a
 * character it claimed but lacked would send the browser to the full file anyway); the build stops when
 * fonts.css declares another range, saying which, and when the package's Latin face does not cover the
 * core (a character would lose its fallback).
 */
export function coreFonts(options: { outDir: string; css: string }): Plugin {
  const require = createRequire(import.meta.url);
  const subsetFontVersion = (JSON.parse(readFileSync(require.resolve('subset-font/package.json'), 'utf8')) as { version: string }).version;
  const text = wantedRanges.map(([a, b]) => Array.from({ length: b - a + 1 }, (_, k) => String.fromCodePoint(a + k)).join('')).join('');
  return {
    name: 'stringfield:core-fonts',
    async buildStart() {
      const css = readFileSync(options.css, 'utf8');
      mkdirSync(options.outDir, { recursive: true });
      for (const face of coreFaces) {
        const dir = path.dirname(require.resolve(`${face.pkg}/package.json`));
        const latin = declaredRange(readFileSync(path.join(dir, 'index.css'), 'utf8'), `files/${face.file}`);
        if (!latin) this.error(`no unicode-range for ${face.file} in ${face.pkg}/index.css`);
        const source = readFileSync(path.join(dir, 'files', face.file));
        const target = path.join(options.outDir, face.out);
        // Same package file, same options: same output, so a rebuild or a dev start reuses it.
        const stamp = createHash('sha256').update(source).update(JSON.stringify([text, keepFeatures, face.weights, subsetFontVersion])).digest('hex');
        const stampFile = `${target}.json`;
        const kept = existsSync(target) && existsSync(stampFile) ? (JSON.parse(readFileSync(stampFile, 'utf8')) as { stamp: string; range: string }) : null;
        let range: string;
        if (kept?.stamp === stamp) {
          range = kept.range;
        } else {
          const sfnt = await subsetFont(source, text, { targetFormat: 'truetype', keepFeatures, variationAxes: { wght: face.weights } });
          range = toUnicodeRange(mappedCodePoints(sfnt));
          writeFileSync(target, await subsetFont(sfnt, text, { targetFormat: 'woff2', keepFeatures }));
          writeFileSync(stampFile, JSON.stringify({ stamp, range }));
        }
        const fallback = new Set(parseUnicodeRange(latin));
        const uncovered = parseUnicodeRange(range).filter((c) => !fallback.has(c));
        if (uncovered.length) this.error(`${face.out} has characters outside ${face.file}'s range: ${toUnicodeRange(uncovered)}`);
        const declared = declaredRange(css, `generated/fonts/${face.out}`);
        if (declared !== range) this.error(`${options.css}: the face of ${face.out} must declare unicode-range: ${range}; (it has ${declared ?? 'none'})`);
      }
    },
  };
}
