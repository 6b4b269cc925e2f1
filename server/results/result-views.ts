/** Uploads and result sets as the API shows them. */
import type { ResultSet } from './result-set.entity';
import type { ResultSetView } from './results-api-types';

/** `resultSet.createdBy` must be loaded. */
export function toResultSetView(resultSet: ResultSet): ResultSetView {
  const creator = resultSet.createdBy;
  return {
    id: resultSet.id,
    name: resultSet.name,
    fileName: resultSet.fileName,
    format: resultSet.format,
    sheet: resultSet.sheet,
    sha256: resultSet.sha256,
    rowCount: resultSet.rowCount,
    memberKeys: resultSet.memberKeyCount,
    combinations: resultSet.combinations,
    forceUnit: resultSet.forceUnit,
    mapping: resultSet.mapping,
    geometry: resultSet.geometry,
    createdBy: creator ? { id: creator.id, name: creator.name } : null,
    createdAt: resultSet.createdAt.toISOString(),
    modelRevisionId: resultSet.modelRevisionId,
    matching: resultSet.matching,
  };
}
