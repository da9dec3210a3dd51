/** Size limits for imported tables (CSV files and inline table specs), chosen so a table fits comfortably in a worker. */
export const MAX_TABLE_ROWS = 100_000;
export const MAX_TABLE_COLUMNS = 50;
/** 20 MiB of CSV text (UTF-8). */
export const MAX_CSV_BYTES = 20 * 1024 * 1024;
