/** The BCF releases Taulens writes and reads, and the fixed names inside an archive. */

export const BCF_VERSIONS = ['2.1', '3.0'] as const;
export type BcfVersion = (typeof BCF_VERSIONS)[number];

export const VERSION_ENTRY = 'bcf.version';
export const PROJECT_ENTRY = 'project.bcfp';
/** BCF 3.0 only: the project's allowed statuses, types, priorities, labels and users. */
export const EXTENSIONS_ENTRY = 'extensions.xml';
export const MARKUP_FILE = 'markup.bcf';
export const VIEWPOINT_FILE = 'viewpoint.bcfv';
export const SNAPSHOT_FILE = 'snapshot.png';
