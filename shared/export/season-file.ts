/**
 * The season file's constants, without its schema: the client's file picker needs the size limit
 * and should not download every season schema for it.
 */
export const SEASON_FILE_FORMAT = 'scrubline-season';
export const SEASON_FILE_VERSION = 1;
/** The largest season file the import accepts. */
export const SEASON_FILE_MAX_BYTES = 5 * 1024 * 1024;

/** The answer to an import: the new car. */
export interface SeasonImportResult {
  carId: string;
}
