// svg-to-pdfkit 0.1.8 ships no type declarations; this covers the options Hoebench uses.
declare module "svg-to-pdfkit" {
  type SvgToPdfOptions = {
    width?: number;
    height?: number;
    preserveAspectRatio?: string;
    /** Treat SVG user units as PDF points instead of CSS pixels (72/96). */
    assumePt?: boolean;
    fontCallback?: (family: string, bold: boolean, italic: boolean, fontOptions: { fauxBold?: boolean; fauxItalic?: boolean }) => string;
    warningCallback?: (message: string) => void;
  };

  function SVGtoPDF(doc: PDFKit.PDFDocument, svg: string, x?: number, y?: number, options?: SvgToPdfOptions): void;
  export default SVGtoPDF;
}
