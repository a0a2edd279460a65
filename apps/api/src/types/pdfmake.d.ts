// pdfmake 0.3 ships no TypeScript types; this covers the part Stringfield uses.
declare module 'pdfmake' {
  type FontFiles = { normal: string; bold: string; italics: string; bolditalics: string };
  interface OutputDocument {
    getBuffer(): Promise<Buffer>;
  }
  interface PdfMake {
    addFonts(fonts: Record<string, FontFiles>): void;
    setUrlAccessPolicy(callback: (url: string) => boolean): void;
    setLocalAccessPolicy(callback: (path: string) => boolean): void;
    createPdf(docDefinition: Record<string, unknown>, options?: Record<string, unknown>): OutputDocument;
  }
  const pdfmake: PdfMake;
  export default pdfmake;
}
