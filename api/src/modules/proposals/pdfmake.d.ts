// The slice of pdfmake 0.3's server API we use (the package ships no types; the DefinitelyTyped
// ones describe 0.2's PdfPrinter). Content stays loosely typed: pdfmake reads plain objects.
declare module 'pdfmake' {
  interface OutputDocument {
    getBuffer(): Promise<Buffer>;
  }
  interface PdfMake {
    setFonts(fonts: Record<string, Record<string, string>>): void;
    setUrlAccessPolicy(callback: (url: string) => boolean): void;
    setLocalAccessPolicy(callback: (path: string) => boolean): void;
    createPdf(definition: object, options?: object): OutputDocument;
  }
  const pdfmake: PdfMake;
  export default pdfmake;
}
