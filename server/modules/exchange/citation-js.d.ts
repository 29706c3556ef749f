/** The few parts of the citation library's API Sphereline uses (the packages ship no types). */
declare module '@citation-js/core' {
  export interface CslName {
    given?: string;
    family?: string;
    literal?: string;
  }
  export interface CslItem {
    id: string;
    type: string;
    title?: string;
    author?: CslName[];
    'container-title'?: string;
    issued?: { 'date-parts': number[][] };
    volume?: string;
    page?: string;
    DOI?: string;
    [field: string]: unknown;
  }
  export class Cite {
    constructor(data: unknown, options?: Record<string, unknown>);
    data: CslItem[];
    format(format: 'bibtex' | 'ris' | 'data' | string, options?: Record<string, unknown>): string;
  }
}
declare module '@citation-js/plugin-bibtex';
declare module '@citation-js/plugin-ris';
