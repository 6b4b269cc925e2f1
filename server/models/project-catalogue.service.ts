import { readFile } from 'node:fs/promises';
import type { DataSource } from 'typeorm';
import type { CatalogueSection } from '../catalogue/catalogue-section';
import { CatalogueCsvError, parseCatalogueCsv } from '../catalogue/catalogue-csv';
import { ValidationError } from '../http/errors';
import { ProjectCatalogue } from './project-catalogue.entity';

/** The project section catalogue: replaced as a whole by each upload; later ingests resolve name-only profiles with it. */
export class ProjectCatalogueService {
  constructor(private readonly dataSource: DataSource) {}

  /** Every row valid, or nothing changes and the error lists each bad line. */
  async replace(projectId: string, userId: string, file: { path: string; originalName: string }): Promise<{ sections: number }> {
    let sections: CatalogueSection[];
    try {
      sections = parseCatalogueCsv(await readFile(file.path, 'utf8'));
    } catch (error) {
      if (!(error instanceof CatalogueCsvError)) throw error;
      const details = error.problems.map((p) => ({
        location: 'body' as const,
        field: `file line ${p.line}${p.column ? ` ${p.column}` : ''}`,
        message: p.message,
      }));
      throw new ValidationError(error.message, { code: 'invalid_catalogue', details });
    }
    await this.dataSource
      .getRepository(ProjectCatalogue)
      .save({ projectId, sections, fileName: file.originalName.slice(0, 255), uploadedById: userId });
    return { sections: sections.length };
  }

  async sectionsOf(projectId: string): Promise<CatalogueSection[]> {
    const catalogue = await this.dataSource.getRepository(ProjectCatalogue).findOneBy({ projectId });
    return catalogue?.sections ?? [];
  }
}
