/** The part of pdfkit 0.20 the document renderer uses (the package ships no type declarations). */
declare module "pdfkit" {
  interface TextOptions {
    width?: number;
    align?: "left" | "center" | "right" | "justify";
    continued?: boolean;
    lineBreak?: boolean;
    strike?: boolean;
    lineGap?: number;
    /** OpenType features for fontkit's layout ({ liga: false } turns ligatures off). */
    features?: Record<string, boolean>;
  }
  interface Margins {
    top: number;
    bottom: number;
    left: number;
    right: number;
  }
  export default class PDFDocument {
    constructor(options?: { size?: string; margins?: Margins; bufferPages?: boolean; info?: Record<string, string> });
    page: { width: number; height: number; margins: Margins };
    y: number;
    /** The current font (pdfkit's EmbeddedFont) and its fontkit font. */
    _font?: { font?: { glyphForCodePoint(cp: number): { id: number; _decode(): { numberOfContours: number } | null } } };
    on(event: "data", listener: (chunk: Buffer) => void): this;
    on(event: "end", listener: () => void): this;
    on(event: "error", listener: (e: unknown) => void): this;
    registerFont(name: string, src: Buffer | string): this;
    font(name: string): this;
    fontSize(size: number): this;
    fillColor(color: string): this;
    text(text: string, options?: TextOptions): this;
    text(text: string, x?: number, y?: number, options?: TextOptions): this;
    moveDown(lines?: number): this;
    bufferedPageRange(): { start: number; count: number };
    switchToPage(n: number): this;
    end(): void;
  }
}
