// citation-js 0.8 ships no type declarations; these cover the parts lib/citations uses.

declare module '@citation-js/core' {
  export type CslData = Record<string, unknown>;

  export class Cite {
    constructor(data?: unknown, options?: Record<string, unknown>);
    data: CslData[];
    format(format: string, options?: Record<string, unknown>): string;
  }

  export const plugins: {
    input: {
      /** Parses `data` through the registered parsers down to CSL-JSON items. */
      chain(data: unknown, options?: { generateGraph?: boolean; forceType?: string; target?: string }): CslData[];
      type(data: unknown): string;
    };
    config: {
      /** A plugin's configuration object, mutable (e.g. `get('@bibtex').parse.sentenceCase`). */
      get(ref: string): Record<string, Record<string, unknown>> | undefined;
    };
  };
}

declare module '@citation-js/plugin-bibtex';
declare module '@citation-js/plugin-ris';
declare module '@citation-js/plugin-csl';
