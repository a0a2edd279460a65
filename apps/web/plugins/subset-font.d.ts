// subset-font ships no types; this is the part of its API the build uses (README of subset-font 2.9).
declare module 'subset-font' {
  type Options = {
    targetFormat?: 'sfnt' | 'woff' | 'woff2' | 'truetype';
    keepFeatures?: string[];
    variationAxes?: Record<string, number | { min: number; max: number; default?: number }>;
    preserveNameIds?: number[];
    noLayoutClosure?: boolean;
  };
  export default function subsetFont(font: Buffer, text: string, options?: Options): Promise<Buffer>;
}
