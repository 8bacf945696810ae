// The parts of citation-js 0.8 (which ships no types) that the sources module uses.
declare module '@citation-js/core' {
  export interface CiteOptions {
    forceType?: string;
  }
  export interface FormatOptions {
    format?: 'text' | 'html';
    template?: string;
    lang?: string;
    type?: string;
  }
  export class Cite {
    constructor(data: unknown, options?: CiteOptions);
    static async(data: unknown, options?: CiteOptions): Promise<Cite>;
    data: Record<string, unknown>[];
    format(style: string, options?: FormatOptions): string;
  }
  export const plugins: {
    add(name: string, plugin: { input?: Record<string, unknown> }): void;
    input: { list(): string[] };
  };
}
declare module '@citation-js/plugin-bibtex';
declare module '@citation-js/plugin-ris';
declare module '@citation-js/plugin-csl';
