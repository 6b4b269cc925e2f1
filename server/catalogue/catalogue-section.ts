import type { Fabrication } from '../engine/section';
import type { SectionDimensions, SectionFamily } from '../engine/section-family';
import type { DesignationForm } from './designation';

/** One rolled or welded I-section of a catalogue, in millimetres, with the table it came from. */
export interface CatalogueSection {
  /** Display name as the table writes it: 'IPE 300', 'HEA 200', 'W18X50', '310UC96.8'. */
  readonly name: string;
  /** 'IPE', 'HEA', 'HEB', 'HEM', a nominal-depth group such as 'W18' or '310UC', or a project catalogue's own series. */
  readonly series: string;
  readonly depth_mm: number;
  readonly width_mm: number;
  readonly webThickness_mm: number;
  /** Nominal thickness; for a sloped flange measured half-way along the outstand. */
  readonly flangeThickness_mm: number;
  /** Root fillet radius r; for W-shapes derived as k_des − tf; 0 for welded sections. */
  readonly rootRadius_mm: number;
  /** Toe radius of a sloped flange (IPN, S), absent for parallel flanges. */
  readonly edgeRadius_mm?: number;
  /** Slope of the inner flange face (IPN, S), radians; absent for parallel flanges. */
  readonly flangeSlope_rad?: number;
  /** 'rolled' unless the table says otherwise (AS/NZS 3679.2 welded beams and columns). */
  readonly fabrication?: Fabrication;
  /** Key of the table in CATALOGUE_SOURCES, or 'project' for an uploaded catalogue. */
  readonly sourceId: string;
}

export interface CatalogueSource {
  readonly id: string;
  readonly title: string;
  /** How the values got here, honestly: transcribed from a named table, or written from memory. */
  readonly provenance: string;
  readonly fromMemory: boolean;
  /**
   * The regional naming form this table's names are written in, when no other region writes names so: a designation
   * written in that form names this table's section where other tables have a different one of the same size.
   */
  readonly namingForm?: DesignationForm;
}

/** How the section was made, which sets residual stresses, corner radii and, for I-sections, the fillets. */
export type SectionProcess = 'hot-rolled' | 'welded' | 'cold-formed' | 'hot-finished';

/** A catalogue section of any family, described with the shared section vocabulary. */
export interface CatalogueEntry {
  /** Display name as the table writes it: 'IPE 300', '300PFC40.1', 'HSS6X6X3/8', '100x100x6.0 SHS'. */
  readonly name: string;
  /**
   * The bare designation, when the name adds to it what tells two tables apart ('SHS 100x100x6' of
   * 'SHS 100x100x6 EN 10219'): the entry answers to it, and where it names different sections, finds nothing.
   */
  readonly designation?: string;
  readonly series: string;
  readonly family: SectionFamily;
  readonly dimensions: SectionDimensions;
  readonly process: SectionProcess;
  /** Key of the table in CATALOGUE_SOURCES, or 'project' for an uploaded catalogue. */
  readonly sourceId: string;
}

/** Where a looked-up section came from, as the member reports it. */
export type CatalogueOrigin = 'catalogue' | 'project-catalogue';

export interface CatalogueHit {
  readonly entry: CatalogueEntry;
  readonly origin: CatalogueOrigin;
  /** The part of the looked-up text that named the section: 'IPE270' in 'Beam:IPE270:341211'. */
  readonly designation: string;
}
