import { parseNistFile, type NistFile } from './nist-format';
import { BOXBOD_DAT } from './nist/boxbod';
import { CHWIRUT2_DAT } from './nist/chwirut2';
import { LONGLEY_DAT } from './nist/longley';
import { MISRA1A_DAT } from './nist/misra1a';
import { NORRIS_DAT } from './nist/norris';
import type { NistDatasetId } from './spec';
import { makeTable, type DataTable } from './table';

/**
 * The NIST StRD sets shipped with Fall Line (public domain; texts in nist/): Norris and Longley
 * (linear least squares) and Misra1a, Chwirut2 and BoxBOD (nonlinear least squares). Data, starting
 * values and certified values are all read from the file texts, parsed once.
 */
const TEXTS: Readonly<Record<NistDatasetId, string>> = {
  norris: NORRIS_DAT,
  longley: LONGLEY_DAT,
  misra1a: MISRA1A_DAT,
  chwirut2: CHWIRUT2_DAT,
  boxbod: BOXBOD_DAT,
};

export const NIST_DATASET_IDS = Object.freeze(Object.keys(TEXTS) as NistDatasetId[]);

const FILES = new Map<NistDatasetId, NistFile>();
const TABLES = new Map<NistDatasetId, DataTable>();

export function isNistDatasetId(id: unknown): id is NistDatasetId {
  return typeof id === 'string' && Object.hasOwn(TEXTS, id);
}

function checkId(id: string): NistDatasetId {
  if (!isNistDatasetId(id)) throw new Error(`dataset (nist): unknown id '${id}'; known ids: ${NIST_DATASET_IDS.join(', ')}`);
  return id;
}

/** The parsed file: model, starting values, certified values, data. */
export function nistFile(id: string): NistFile {
  const key = checkId(id);
  let file = FILES.get(key);
  if (!file) {
    file = parseNistFile(TEXTS[key]);
    FILES.set(key, file);
  }
  return file;
}

/** The data as a table with the file's column names (y first, then x or x1, x2, ...). */
export function nistTable(id: string): DataTable {
  const key = checkId(id);
  let table = TABLES.get(key);
  if (!table) {
    const file = nistFile(key);
    table = makeTable(file.name, `NIST StRD ${file.name}.dat (${file.procedure} least squares, ${file.difficulty.toLowerCase()} difficulty)`, file.columns, file.data);
    TABLES.set(key, table);
  }
  return table;
}
