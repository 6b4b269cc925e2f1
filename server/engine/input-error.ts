/**
 * Base of every "the caller gave us something we cannot compute with" error from the engine and the catalogue.
 * `field` names the offending input (dotted path), so an edge layer can map all of them to one validation response.
 */
export class EngineInputError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'EngineInputError';
  }
}
