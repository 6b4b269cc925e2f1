/** One rolled section of a catalogue, in millimetres, with the table it came from. */
export interface CatalogueSection {
  /** Display name as the table writes it: 'IPE 300', 'HEA 200', 'W18X50'. */
  readonly name: string;
  /** 'IPE', 'HEA', 'HEB', 'HEM', a W nominal-depth group such as 'W18', or a project catalogue's own series. */
  readonly series: string;
  readonly depth_mm: number;
  readonly width_mm: number;
  readonly webThickness_mm: number;
  readonly flangeThickness_mm: number;
  /** Root fillet radius r; for W-shapes derived as k_des − tf. */
  readonly rootRadius_mm: number;
  /** Key of the table in CATALOGUE_SOURCES, or 'project' for an uploaded catalogue. */
  readonly sourceId: string;
}

export interface CatalogueSource {
  readonly id: string;
  readonly title: string;
  /** How the values got here, honestly: transcribed from a named table, or written from memory. */
  readonly provenance: string;
  readonly fromMemory: boolean;
}
